import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { OPTION_CAUTIONS, optionCautions, scenarioCautions } from '../../shared/cautions';
import { scenarioSchema } from '../../shared/schema';
import { parsedHerd } from './engine/fixtures';
import { createOption } from '../../shared/starting-points';

describe('cautions where the work can hurt (README, "Cautions")', () => {
  const herd = parsedHerd();
  const farm = { currentKind: 'grazing' as const, herdCows: herd.cows };

  it('warns about sand in slurry and pits for a deep-sand option, and about moving a pasture herd indoors', () => {
    const sand = createOption('sand-freestall', herd, { id: 'sand' });
    expect(optionCautions(sand, farm)).toEqual(['sandInSlurry', 'movingIndoors', 'permits']);
    expect(OPTION_CAUTIONS.sandInSlurry).toMatch(/never enter a pit/);
  });

  it('warns about automatic scrapers trapping calves and children, and about bought-in cows', () => {
    const mattress = { ...createOption('mattress-freestall', herd, { id: 'm' }), herdChange: { cowsByYear: null, addedCows: 30, addedCowCost: null } };
    expect(optionCautions(mattress, farm)).toEqual(['automaticScraper', 'movingIndoors', 'permits', 'biosecurity']);
    expect(OPTION_CAUTIONS.automaticScraper).toMatch(/emergency stop/);
    // A herd listed by year that grows past today's herd buys cows too.
    const growing = { ...mattress, herdChange: { cowsByYear: [herd.cows, herd.cows + 10], addedCows: 0, addedCowCost: null } };
    expect(optionCautions(growing, farm)).toContain('biosecurity');
  });

  it('raises nothing for the current grazing option as it is', () => {
    const grazing = createOption('grazing', herd, { id: 'g', current: true });
    expect(optionCautions(grazing, farm)).toEqual([]);
  });

  it('says what to do about each hazard, deferring to the vet, the local authority and advisers', () => {
    // Common practice, no source: what a farm adviser tells a family before such a change.
    expect(OPTION_CAUTIONS.sandInSlurry).toMatch(/wears pumps/);
    expect(OPTION_CAUTIONS.sandInSlurry).toMatch(/reception pits/);
    expect(OPTION_CAUTIONS.automaticScraper).toMatch(/calves/);
    expect(OPTION_CAUTIONS.automaticScraper).toMatch(/children/);
    expect(OPTION_CAUTIONS.automaticScraper).toMatch(/guards/);
    expect(OPTION_CAUTIONS.movingIndoors).toMatch(/Lameness usually rises/);
    expect(OPTION_CAUTIONS.movingIndoors).toMatch(/vet and hoof trimmer/);
    expect(OPTION_CAUTIONS.permits).toMatch(/permits/);
    expect(OPTION_CAUTIONS.permits).toMatch(/nutrient rules/);
    expect(OPTION_CAUTIONS.biosecurity).toMatch(/cows bought in from other herds/);
    expect(OPTION_CAUTIONS.biosecurity).toMatch(/isolate/);
  });

  it('lists each caution the demo scenario raises once, with the options that raise it, for the print view', () => {
    const demo = scenarioSchema.parse(JSON.parse(readFileSync(new URL('../../scenarios/cairnbrook-five-systems.json', import.meta.url), 'utf8')));
    const listed = scenarioCautions(demo);
    // Four barns move the grazing herd indoors, need permits and add 40 cows; one has sand beds, one automatic scrapers.
    expect(listed.map((c) => c.key)).toEqual(['sandInSlurry', 'automaticScraper', 'movingIndoors', 'permits', 'biosecurity']);
    const barnNames = demo.options.filter((o) => !o.current).map((o) => o.name);
    expect(listed.find((c) => c.key === 'movingIndoors')?.optionNames).toEqual(barnNames);
    // Raised by every barn, the print says so instead of naming all four; sand by one barn only.
    expect(listed.filter((c) => c.everyNewOption).map((c) => c.key)).toEqual(['movingIndoors', 'permits', 'biosecurity']);
    expect(listed.find((c) => c.key === 'sandInSlurry')?.optionNames).toEqual([demo.options.find((o) => o.bed === 'deep-sand')?.name]);
    expect(listed.find((c) => c.key === 'automaticScraper')?.optionNames).toEqual([demo.options.find((o) => o.manureRemoval === 'automatic-scraper')?.name]);
    // The grazing herd as it is raises none of them.
    expect(listed.every((c) => !c.optionNames.includes(demo.options.find((o) => o.current)?.name ?? ''))).toBe(true);
  });
});

import { describe, expect, it } from 'vitest';
import { OPTION_CAUTIONS, optionCautions } from '../../shared/cautions';
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
});

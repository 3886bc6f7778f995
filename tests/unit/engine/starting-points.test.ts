import { describe, expect, it } from 'vitest';
import { optionSchema, startingPoints } from '../../../shared/schema';
import { checkStallDimensions } from '../../../shared/engine/sizing';
import { createOption, STARTING_POINT_ORDER } from '../../../shared/starting-points';
import { parsedHerd } from './fixtures';

const herd = parsedHerd();

describe('starting points', () => {
  it('lists the five starting points of the product brief', () => {
    // PRODUCT.md capability 3: grazing with seasonal housing, steel dividers, flexible dividers, mattress, sand.
    expect([...STARTING_POINT_ORDER].sort()).toEqual([...startingPoints].sort());
    expect(STARTING_POINT_ORDER).toHaveLength(5);
  });

  it.each(startingPoints)('creates a valid %s option with a source for every default', (startingPoint) => {
    const option = createOption(startingPoint, herd, { id: startingPoint });
    expect(() => optionSchema.parse(option)).not.toThrow();
    for (const key of ['lyingHoursPerDay', 'housedDaysPerYear', 'health.lamenessCasesPer100Cows', 'bedding.kgPerStallDay', 'manure.storageDays', 'stockingRate']) {
      expect(option.sources[key], key).toBeDefined();
    }
    for (const source of Object.values(option.sources)) {
      expect(['reference', 'common-practice', 'assumption', 'user']).toContain(source.kind);
      expect(source.note.length).toBeGreaterThan(0);
    }
    // Every capital line's cost is an invented figure, tagged as such.
    for (const line of option.capitalLines) {
      const field = line.kind === 'item' ? 'unitCost' : 'rate';
      expect(option.sources[`capitalLines.${line.id}.${field}`]?.kind).toBe('assumption');
    }
  });

  it('sizes stalls and troughs from the herd', () => {
    // 120 cows at 1 cow per stall (common practice: one cow per stall) → per-stall lines sized at 120 stalls;
    // troughs: 120 × 7.6 cm = 9.12 m ÷ 3 m per trough → 4 troughs (Penn State Extension).
    const option = createOption('sand-freestall', herd, { id: 'sand' });
    expect(option.stockingRate).toBe(1);
    expect(option.water.troughs).toBe(4);
    const shell = option.capitalLines.find((line) => line.id === 'shell');
    expect(shell?.kind === 'item' ? shell.quantity : null).toBe(120 * 8);
  });

  it('takes its defaults from the references', () => {
    // Tucker & Weary 2004 (read): 12.3 h bare mattress, 13.8 h with 7.5 kg sawdust.
    expect(createOption('steel-freestall', herd, { id: 'a' }).lyingHoursPerDay).toBe(12.3);
    expect(createOption('mattress-freestall', herd, { id: 'b' }).lyingHoursPerDay).toBe(13.8);
    expect(createOption('mattress-freestall', herd, { id: 'b' }).sources.lyingHoursPerDay?.kind).toBe('reference');
    // Cook et al. 2004 (read): lameness 11.1 % in sand herds vs 24.0 % in mattress herds.
    expect(createOption('sand-freestall', herd, { id: 'c' }).health.lamenessCasesPer100Cows).toBe(11.1);
    expect(createOption('flexible-freestall', herd, { id: 'd' }).health.lamenessCasesPer100Cows).toBe(24);
    // University guidance (read, secondary): at least 50 lb = 23 kg sand per stall per day.
    expect(createOption('sand-freestall', herd, { id: 'e' }).bedding.kgPerStallDay).toBe(23);
    // Common practice, no source: flexible dividers give fewer injuries than steel.
    expect(createOption('flexible-freestall', herd, { id: 'f' }).health.injuriesPer100Cows).toBeLessThan(
      createOption('steel-freestall', herd, { id: 'g' }).health.injuriesPer100Cows,
    );
    // MODEL.md: no bedding for bare mattresses; an automatic scraper has ~0 labour.
    expect(createOption('steel-freestall', herd, { id: 'h' }).bedding.kgPerStallDay).toBe(0);
    expect(createOption('mattress-freestall', herd, { id: 'i' }).labour.scrapingPassesPerDay).toBe(0);
  });

  it('fills stall dimensions that pass the guidance check for the breed size', () => {
    // Dairy cattle extension, "Design considerations for dairy cattle free stalls" (read): the middle of each range passes.
    for (const breedSize of ['small', 'large'] as const) {
      const option = createOption('flexible-freestall', { ...herd, breedSize }, { id: breedSize });
      expect(checkStallDimensions(option.stallDimensions, breedSize).status).toBe('within');
    }
    // Large cows: width 48–52 in → middle 50 in = 1.27 m.
    expect(createOption('sand-freestall', herd, { id: 'w' }).stallDimensions?.widthM).toBe(1.27);
  });

  it('starts the current option without capital lines (its housing is sunk cost)', () => {
    const current = createOption('grazing', herd, { id: 'now', current: true });
    expect(current.current).toBe(true);
    expect(current.capitalLines).toEqual([]);
    expect(current.name).toBe('Grazing with seasonal housing');
    expect(createOption('grazing', herd, { id: 'x', name: 'Our grazing' }).name).toBe('Our grazing');
  });
});

import { describe, expect, it } from 'vitest';
import { optionSchema, scenarioSchema, startingPoints } from '../../../shared/schema';
import { checkStallDimensions } from '../../../shared/engine/sizing';
import { createOption, scopedLineId, STARTING_POINT_ORDER, withOptionId } from '../../../shared/starting-points';
import { demoScenarioInput } from './fixtures';
import { parsedHerd } from './fixtures';

const herd = parsedHerd();

describe('starting points', () => {
  it('lists the five starting points of docs/product.md', () => {
    // docs/product.md capability 3: grazing with seasonal housing, steel dividers, flexible dividers, mattress, sand.
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
    const shell = option.capitalLines.find((line) => line.id === 'sand.shell');
    expect(shell?.kind === 'item' ? shell.quantity : null).toBe(120 * 8);
  });

  it('takes its defaults from the references', () => {
    // Tucker & Weary 2004 (read): 12.3 h bare mattress, 13.8 h with 7.5 kg sawdust; the 2.5 kg
    // top-dressing interpolates on a straight line: 12.3 + 1.5 × 2.5 / 7.5 = 12.8 h.
    expect(createOption('steel-freestall', herd, { id: 'a' }).lyingHoursPerDay).toBe(12.3);
    const mattress = createOption('mattress-freestall', herd, { id: 'b' });
    expect(mattress.bedding.kgPerStallDay).toBe(2.5);
    expect(mattress.lyingHoursPerDay).toBeCloseTo(12.3 + (1.5 * 2.5) / 7.5, 12);
    // Deep sand is the surface cows choose most (common practice): never below the best mattress figure.
    expect(createOption('sand-freestall', herd, { id: 's' }).lyingHoursPerDay).toBeGreaterThanOrEqual(13.8);
    // Cook et al. 2004 (read): lameness prevalence 11.1 % in sand herds vs 24.0 % in mattress herds;
    // entered as yearly incidence, sand at the same ratio: 35 × 11.1 / 24 = 16.19 → 16.2 cases per 100 cows.
    expect(createOption('sand-freestall', herd, { id: 'c' }).health.lamenessCasesPer100Cows).toBe(16.2);
    expect(createOption('flexible-freestall', herd, { id: 'd' }).health.lamenessCasesPer100Cows).toBe(35);
    // University guidance (read, secondary): at least 50 lb = 23 kg sand per stall per day.
    expect(createOption('sand-freestall', herd, { id: 'e' }).bedding.kgPerStallDay).toBe(23);
    // Common practice, no source: flexible dividers give fewer injuries than steel.
    expect(createOption('flexible-freestall', herd, { id: 'f' }).health.injuriesPer100Cows).toBeLessThan(
      createOption('steel-freestall', herd, { id: 'g' }).health.injuriesPer100Cows,
    );
    // docs/model.md: no bedding for bare mattresses; an automatic scraper has ~0 labour.
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

  it('puts every line id under the option id, so capital lines are unique in a scenario', () => {
    // A document is attached to scenarioId + capital line id (README, documents API): two options must not share one.
    const sand = createOption('sand-freestall', herd, { id: 'sand-freestall' });
    const steel = createOption('steel-freestall', herd, { id: 'steel-freestall' });
    expect(sand.capitalLines.map((line) => line.id)).toContain('sand-freestall.shell');
    expect(steel.capitalLines.map((line) => line.id)).toContain('steel-freestall.shell');
    for (const line of [...sand.capitalLines, ...sand.energyLines, ...sand.runningCosts]) expect(line.id.startsWith('sand-freestall.')).toBe(true);
    expect(sand.sources['capitalLines.sand-freestall.shell.unitCost']?.kind).toBe('assumption');
    const ids = [...sand.capitalLines, ...steel.capitalLines].map((line) => line.id);
    expect(new Set(ids).size).toBe(ids.length);
  });

  it('re-ids a copied option’s lines under the copy’s id', () => {
    const sand = createOption('sand-freestall', herd, { id: 'sand' });
    const copy = withOptionId({ ...sand, capitalLines: [...sand.capitalLines, { kind: 'item', id: 'line-1', description: 'Gate', category: 'other', unit: 'lump-sum', quantity: null, unitCost: 500, lifeYears: 20, replaceAtEndOfLife: true, taxClass: 'economic-life', taxLifeYears: null, documentIds: [] }] }, 'sand-2');
    expect(copy.id).toBe('sand-2');
    expect(copy.capitalLines.map((line) => line.id)).toContain('sand-2.shell');
    // A line the user added under no option prefix goes under the copy's id too.
    expect(copy.capitalLines.map((line) => line.id)).toContain('sand-2.line-1');
    expect(copy.energyLines.every((line) => line.id.startsWith('sand-2.'))).toBe(true);
    expect(copy.sources['capitalLines.sand-2.shell.unitCost']).toEqual(sand.sources['capitalLines.sand.shell.unitCost']);
    expect(copy.sources['capitalLines.sand.shell.unitCost']).toBeUndefined();
    // The line's own tag (its quantity, life and tax class) follows the line as well.
    expect(sand.sources['capitalLines.sand.shell']?.note).toMatch(/economic life and tax life/);
    expect(copy.sources['capitalLines.sand-2.shell']).toEqual(sand.sources['capitalLines.sand.shell']);
    expect(copy.sources['capitalLines.sand.shell']).toBeUndefined();
    // The ids stay within the schema's 60 characters, the option part shortened.
    expect(scopedLineId('x'.repeat(60), 'shell')).toHaveLength(60);
    expect(scopedLineId('x'.repeat(60), 'shell').endsWith('.shell')).toBe(true);
    const input = demoScenarioInput();
    const [, steel] = input.options;
    if (!steel) throw new Error('no second option');
    const both = scenarioSchema.safeParse({ ...input, options: [...input.options, { ...withOptionId(steel as Parameters<typeof withOptionId>[0], 'steel-copy'), current: false }] });
    expect(both.success).toBe(true);
  });
});

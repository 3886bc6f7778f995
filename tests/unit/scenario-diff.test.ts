import { describe, expect, it } from 'vitest';
import { diffScenarios, type Json } from '../../shared/scenario-diff';

const doc = (over: Record<string, Json> = {}): Json => ({
  name: 'Barn',
  herd: { cows: 190, yieldKgPerCowDay: 26 },
  options: [
    {
      id: 'a',
      name: 'A',
      stallDimensions: { widthM: 1.2 },
      capitalLines: [{ id: 'shell', unit: 'per-m2', unitCost: 180 }],
    },
    { id: 'b', name: 'B', capitalLines: [] },
  ],
  ...over,
});

describe('diffScenarios', () => {
  it('finds nothing between equal documents', () => {
    expect(diffScenarios(doc(), doc(), 'us')).toEqual([]);
  });

  it('shows a yield change in lb/cow/day for US customary units', () => {
    const changes = diffScenarios(doc(), doc({ herd: { cows: 190, yieldKgPerCowDay: 30 } }), 'us');
    expect(changes).toHaveLength(1);
    const [change] = changes;
    expect(change).toMatchObject({ path: 'herd.yieldKgPerCowDay', kind: 'changed', from: 26, to: 30 });
    // 1 lb = 0.45359237 kg (NIST Handbook 44, Appendix C, from memory of a definition).
    expect(change?.display?.unit).toBe('lb/cow/day');
    expect(change?.display?.from).toBeCloseTo(26 / 0.45359237, 9);
    expect(change?.display?.to).toBeCloseTo(30 / 0.45359237, 9);
  });

  it('keeps metric values as stored and leaves fields of no known kind raw', () => {
    const changes = diffScenarios(doc(), doc({ name: 'New barn', herd: { cows: 200, yieldKgPerCowDay: 27 } }), 'metric');
    expect(changes.map((c) => [c.path, c.display])).toEqual([
      ['name', null],
      ['herd.cows', null],
      ['herd.yieldKgPerCowDay', { unit: 'kg/cow/day', from: 26, to: 27 }],
    ]);
  });

  it('shows stall widths stored in metres in inches, and a per-m² capital cost per ft²', () => {
    const newer = doc() as { options: { stallDimensions?: { widthM: number }; capitalLines: { unitCost: number }[] }[] };
    newer.options[0]!.stallDimensions = { widthM: 1.27 };
    newer.options[0]!.capitalLines[0]!.unitCost = 200;
    const changes = diffScenarios(doc(), newer as unknown as Json, 'us');
    const width = changes.find((c) => c.path === 'options.0.stallDimensions.widthM');
    // 1 in = 2.54 cm exactly (NIST Handbook 44, Appendix C, from memory of a definition): 1.27 m = 50 in.
    expect(width?.display).toMatchObject({ unit: 'in' });
    expect(width?.display?.to).toBeCloseTo(50, 9);
    const cost = changes.find((c) => c.path === 'options.0.capitalLines.0.unitCost');
    // 1 ft² = 0.09290304 m² (0.3048², NIST, from memory of a definition): a price per m² × 0.09290304 is per ft².
    expect(cost?.display?.unit).toBe('per ft²');
    expect(cost?.display?.to).toBeCloseTo(200 * 0.09290304, 9);
  });

  it('matches options by id: a reorder is one change, an edit is reported at its new index', () => {
    const older = doc() as { options: Json[] };
    const newer = structuredClone(older);
    newer.options.reverse();
    (newer.options[1] as { name: string }).name = 'A renamed';
    const changes = diffScenarios(older as unknown as Json, newer as unknown as Json, 'metric');
    expect(changes).toEqual([
      { path: 'options.1.name', kind: 'changed', from: 'A', to: 'A renamed', display: null },
      { path: 'options', kind: 'reordered', from: ['a', 'b'], to: ['b', 'a'], display: null },
    ]);
  });

  it('reports an added and a removed option as whole items', () => {
    const older = doc() as { options: Json[] };
    const newer = structuredClone(older);
    newer.options.splice(1, 1, { id: 'c', name: 'C', capitalLines: [] });
    const changes = diffScenarios(older as unknown as Json, newer as unknown as Json, 'metric');
    expect(changes.map((c) => [c.path, c.kind])).toEqual([
      ['options.1', 'removed'],
      ['options.1', 'added'],
    ]);
  });
});

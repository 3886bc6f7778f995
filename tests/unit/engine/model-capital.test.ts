import { describe, expect, it } from 'vitest';
import {
  capitalAssets,
  capitalLineQuantity,
  capitalTotal,
  maintenanceCostPerYear,
  purchaseSchedule,
  replacementsByYear,
  residualValue,
  salvageAtHorizon,
} from '../../../shared/engine/capital';
import { residualValueStraightLine } from '../../oracles/depreciation';
import type { CapitalLine } from '../../../shared/schema';

const sized = { stalls: 120, storageM3: 2500, troughs: 4 };

function item(id: string, unit: Extract<CapitalLine, { kind: 'item' }>['unit'], quantity: number | null, unitCost: number, lifeYears: number, replace = true, category: Extract<CapitalLine, { kind: 'item' }>['category'] = 'other'): CapitalLine {
  return { kind: 'item', id, description: id, category, unit, quantity, unitCost, lifeYears, replaceAtEndOfLife: replace, taxClass: 'economic-life', taxLifeYears: null, documentIds: [] };
}

const LINES: CapitalLine[] = [
  item('shell', 'per-m2', 960, 180, 30, false, 'building-shell'),
  item('mattresses', 'per-stall', null, 220, 10, true, 'beds'),
  item('storage', 'per-m3', null, 45, 25, false, 'manure-storage'),
  item('troughs', 'per-item', null, 900, 15, true, 'water'),
  item('fees', 'lump-sum', null, 15000, 30, false, 'fees'),
  { kind: 'contingency', id: 'contingency', description: 'Contingency', rate: 0.1, lifeYears: 30 },
];

describe('capital lines (docs/model.md "Capital lines": quantity × unit cost, contingency %)', () => {
  it('sizes null quantities from the helpers', () => {
    // per-stall → 120 stalls; per-m3 manure storage → 2500 m³; per-item water → 4 troughs; lump sum → 1.
    const [shell, mattresses, storage, troughs, fees] = LINES;
    if (shell?.kind !== 'item' || mattresses?.kind !== 'item' || storage?.kind !== 'item' || troughs?.kind !== 'item' || fees?.kind !== 'item') throw new Error('fixture');
    expect(capitalLineQuantity(shell, sized)).toBe(960);
    expect(capitalLineQuantity(mattresses, sized)).toBe(120);
    expect(capitalLineQuantity(storage, sized)).toBe(2500);
    expect(capitalLineQuantity(troughs, sized)).toBe(4);
    expect(capitalLineQuantity(fees, sized)).toBe(1);
  });

  it('totals the items and adds contingency as a share of them', () => {
    // shell 960 m² × 180 = 172 800; mattresses 120 × 220 = 26 400; storage 2500 × 45 = 112 500;
    // troughs 4 × 900 = 3600; fees 15 000 → items 330 300; contingency 10 % = 33 030 → total 363 330.
    const assets = capitalAssets(LINES, sized);
    expect(assets.map((a) => a.cost)).toEqual([172_800, 26_400, 112_500, 3600, 15_000, 33_030]);
    expect(capitalTotal(assets)).toBeCloseTo(363_330, 9);
  });

  it('scales every item by a cost multiplier, contingency following', () => {
    // × 1.2: items 396 360, contingency 39 636 → 435 996.
    expect(capitalTotal(capitalAssets(LINES, sized, 1.2))).toBeCloseTo(435_996, 6);
  });
});

describe('replacements at end of life at grown cost (docs/model.md "Replacements")', () => {
  it('buys a replaceable line again at L, 2L… strictly before H', () => {
    // Mattresses 26 400, life 10, H 20, inflation 2 %: bought at year 0 and year 10 (year 20 = H is not inside).
    // Year-10 cost = 26 400 × 1.02^10 = 26 400 × 1.2189944 = 32 181.45.
    const assets = capitalAssets([item('m', 'per-stall', null, 220, 10)], sized);
    const purchases = purchaseSchedule(assets, 20, 0.02);
    expect(purchases.map((p) => p.year)).toEqual([0, 10]);
    expect(purchases[1]?.cost).toBeCloseTo(26_400 * 1.02 ** 10, 6);
    const byYear = replacementsByYear(purchases, 20);
    expect(byYear[10]).toBeCloseTo(32_181.45, 1);
    expect(byYear.reduce((a, b) => a + b, 0)).toBeCloseTo(byYear[10] ?? 0, 9);
  });

  it('does not replace a line marked not to be replaced', () => {
    const assets = capitalAssets([item('shell', 'lump-sum', null, 100_000, 5, false)], sized);
    expect(purchaseSchedule(assets, 20, 0.02).map((p) => p.year)).toEqual([0]);
  });
});

describe('salvage by straight-line remaining life (docs/model.md "Salvage in year H")', () => {
  it('values the latest purchase at its remaining life', () => {
    // Shell 100 000, life 30, H 20: 100 000 × 10/30 = 33 333.33.
    // Troughs 3600, life 15, replaced at 15 for 3600 × 1.02^15 = 4845.07, age 5 at H: 4845.07 × 10/15 = 3230.05.
    const assets = capitalAssets([item('shell', 'lump-sum', null, 100_000, 30, false), item('t', 'per-item', null, 900, 15, true, 'water')], sized);
    const purchases = purchaseSchedule(assets, 20, 0.02);
    const expected = (100_000 * 10) / 30 + (3600 * 1.02 ** 15 * 10) / 15;
    expect(salvageAtHorizon(assets, purchases, 20)).toBeCloseTo(expected, 6);
    expect(expected).toBeCloseTo(33_333.33 + 3230.05, 1);
  });

  it('gives nothing for a line used up and not replaced', () => {
    // Life 10 < H 20 and not replaced → fully used, 0.
    const assets = capitalAssets([item('x', 'lump-sum', null, 5000, 10, false)], sized);
    expect(salvageAtHorizon(assets, purchaseSchedule(assets, 20, 0.02), 20)).toBe(0);
  });

  it('matches the finance residual-value function', () => {
    // depreciation.ts residualValueStraightLine is the ledger version (cents); 12 000 × 7/25 = 3360.
    expect(residualValue(12_000, 25, 18)).toBeCloseTo(residualValueStraightLine(12_000, 25, 18), 2);
    expect(residualValue(12_000, 25, 18)).toBeCloseTo(3360, 9);
  });
});

describe('maintenance (docs/model.md: % of capital per year)', () => {
  it('charges the rate on year-0 capital', () => {
    // 1.5 % × 363 330 = 5449.95.
    expect(maintenanceCostPerYear(0.015, 363_330)).toBeCloseTo(5449.95, 9);
  });
});

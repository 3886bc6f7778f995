import { describe, expect, it } from 'vitest';
import { macrsFast, straightLineFast } from '../../../shared/engine/cents';
import { coverageRatio, lowestByYear } from '../../../shared/engine/coverage';
import { MACRS_10_YEAR_150DB, MACRS_10_YEAR_200DB, MACRS_20_YEAR_150DB } from '../../../shared/engine/depreciation';
import { decliningBalance, macrsSchedule, straightLine } from '../../oracles/depreciation';
import { evaluateScenario } from '../../../shared/engine/evaluate';
import { lossCarriedOn, taxableIncome, TaxDepreciationSum, taxOfYear, type DepreciationSchedule } from '../../../shared/engine/tax';

/** One year's tax and the loss it carries on, as the ledger settles them. */
const taxForYear = (taxable: number, rate: number, offset: boolean, carried: number) => ({ tax: taxOfYear(taxable, rate, offset, carried), lossCarried: lossCarriedOn(taxable, rate, offset, carried) });

/** Tax depreciation of a list of purchases over the horizon. */
function taxDepreciation(purchases: { year: number; cost: number; lifeYears: number }[], horizon: number, schedule: DepreciationSchedule) {
  const sum = new TaxDepreciationSum(horizon, schedule);
  for (const p of purchases) sum.add(p.year, p.cost, p.lifeYears);
  return sum.result();
}
import { handScenario } from './hand-scenario';

describe('taxable income (docs/model.md: operating margin − depreciation − loan interest)', () => {
  it('deducts depreciation and interest and adds a disposal gain', () => {
    // 50 000 − 10 000 − 4000 + 0 = 36 000; in H with salvage 8000 over book 6000: + 2000 = 38 000.
    expect(taxableIncome(50_000, 10_000, 4000, 0)).toBe(36_000);
    expect(taxableIncome(50_000, 10_000, 4000, 8000 - 6000)).toBe(38_000);
  });
});

describe('tax and losses', () => {
  it('taxes a profit at the rate', () => {
    // 36 000 × 25 % = 9000.
    expect(taxForYear(36_000, 0.25, true, 0)).toEqual({ tax: 9000, lossCarried: 0 });
  });

  it('gives a saving on a loss when losses offset other farm income', () => {
    // −20 000 × 25 % = −5000 (a refund against other income; docs/model.md default).
    expect(taxForYear(-20_000, 0.25, true, 0)).toEqual({ tax: -5000, lossCarried: 0 });
  });

  it('carries a loss forward when losses do not offset other income', () => {
    // Year 1: −20 000 → no tax, carry 20 000. Year 2: 30 000 − 20 000 = 10 000 × 25 % = 2500, carry 0.
    const year1 = taxForYear(-20_000, 0.25, false, 0);
    expect(year1).toEqual({ tax: 0, lossCarried: 20_000 });
    expect(taxForYear(30_000, 0.25, false, year1.lossCarried)).toEqual({ tax: 2500, lossCarried: 0 });
    // Year 2 smaller than the loss: 5000 uses 5000 of it, 15 000 left.
    expect(taxForYear(5000, 0.25, false, 20_000)).toEqual({ tax: 0, lossCarried: 15_000 });
  });

  it('is zero at a zero rate (pre-tax analysis)', () => {
    expect(taxForYear(1e6, 0, false, 0)).toEqual({ tax: 0, lossCarried: 0 });
  });
});

describe('tax depreciation over the horizon', () => {
  it('depreciates straight line from the year after purchase and keeps the rest as book value', () => {
    // 120 000 over 20 years = 6000/yr in years 1..20; H = 15 → 15 × 6000 = 90 000 taken, book 30 000.
    // A replacement of 10 000 (life 10) bought in year 10 → 1000/yr in years 11..15, book 5000.
    const result = taxDepreciation(
      [
        { year: 0, cost: 120_000, lifeYears: 20 },
        { year: 10, cost: 10_000, lifeYears: 10 },
      ],
      15,
      straightLine,
    );
    expect(result.byYear[0]).toBe(0);
    expect(result.byYear[1]).toBe(6000);
    expect(result.byYear[11]).toBe(7000);
    expect(result.bookValueAtHorizon).toBeCloseTo(35_000, 9);
  });

  it('follows the declining-balance schedule when chosen', () => {
    // 10 000, life 5, 200 % DB: 4000, 2400, 1440, then straight line on 2160 over 2 years = 1080, 1080
    // (textbook double-declining with switch, from memory; recomputes exactly).
    const result = taxDepreciation([{ year: 0, cost: 10_000, lifeYears: 5 }], 5, (cost, life) => decliningBalance(cost, life, 2));
    expect(result.byYear.slice(1)).toEqual([4000, 2400, 1440, 1080, 1080]);
    expect(result.bookValueAtHorizon).toBe(0);
  });

  it('gets the same cents from the floating-point straight-line twin', () => {
    // 1000.01 over 3 years: 333.34, 333.34, 333.33 — the last year absorbs the rounding (depreciation.ts convention).
    expect(straightLineFast(1000.01, 3)).toEqual(straightLine(1000.01, 3));
    expect(straightLine(1000.01, 3)).toEqual([333.34, 333.34, 333.33]);
  });
});

describe('debt-service coverage (FFSC, farmdoc daily (8):175, 2018: cash available ÷ scheduled P + I)', () => {
  it('divides cash available by debt service', () => {
    // 59 125 ÷ 43 097.48 = 1.37192…
    expect(coverageRatio(59_125, 43_097.48)).toBeCloseTo(59_125 / 43_097.48, 12);
    // Nothing due → no ratio.
    expect(coverageRatio(59_125, 0)).toBeNull();
  });

  it('finds the lowest defined year', () => {
    expect(lowestByYear([{ year: 1, value: 1.4 }, { year: 2, value: null }, { year: 3, value: 1.1 }, { year: 4, value: 1.2 }])).toEqual({ year: 3, value: 1.1 });
    expect(lowestByYear([{ year: 1, value: null }])).toBeNull();
    // Equal lows apart from floating-point noise (a level loan on a steady herd): the earliest year.
    const noisy = [1.4742054585405515, 1.4742054585405513, 1.4742054585405513].map((value, i) => ({ year: i + 1, value }));
    expect(lowestByYear(noisy)).toEqual({ year: 1, value: 1.4742054585405513 });
    // A real difference, however small next to the display precision, still counts.
    expect(lowestByYear([{ year: 1, value: 1.2 }, { year: 2, value: 1.2 - 1e-6 }])).toEqual({ year: 2, value: 1.2 - 1e-6 });
  });
});

describe('tax class apart from economic life (docs: shared/engine/README.md, "Tax")', () => {
  it('gets the same cents as the decimal.js MACRS schedule from the floating-point twin', () => {
    // IRS Publication 946, Table A-1 (read in a copy): 10-year 200 % DB, half-year: 10.00 % in year 1.
    expect(macrsFast(120_000, MACRS_10_YEAR_200DB.percentages)).toEqual(macrsSchedule(120_000, MACRS_10_YEAR_200DB));
    for (const cost of [0.01, 1.25, 999.99, 12_345.67, 250_000, 1_234_567.89]) {
      for (const table of [MACRS_10_YEAR_200DB, MACRS_10_YEAR_150DB, MACRS_20_YEAR_150DB]) expect(macrsFast(cost, table.percentages)).toEqual(macrsSchedule(cost, table));
    }
  });

  it('depreciates a barn over the 20-year 150 % table while its economic life stays 30 years', () => {
    // Iowa State CALT worked example (read): a 120 000 farm building on the 20-year 150 % DB table
    // deducts 4 500 in year 1 (3.75 %). Hand case with tax 25 %, the candidate's barn is that building:
    // life 30 years (economic), tax class macrs-20-150db.
    const scenario = handScenario((input) => {
      input.finance.taxRate = 0.25;
      const barn = input.options[1]?.capitalLines?.[0];
      if (barn?.kind === 'item') Object.assign(barn, { unitCost: 120_000, lifeYears: 30, taxClass: 'macrs-20-150db' });
    });
    const candidate = evaluateScenario(scenario).options.find((o) => o.id === 'candidate');
    expect(candidate?.years[1]?.depreciation).toBe(4500);
    // Year 2: 7.219 % = 8 662.80; salvage still follows the 30-year economic life: 120 000 × 25/30 = 100 000 at H = 5.
    expect(candidate?.years[2]?.depreciation).toBe(8662.8);
    expect(candidate?.years[5]?.salvage).toBe(100_000);
  });

  it('depreciates straight line over a tax life of its own, and grants can reduce the base', () => {
    // 100 000 over a 10-year tax life (economic life 20): 10 000 a year.
    const tenYears = handScenario((input) => {
      input.finance.taxRate = 0.25;
      const barn = input.options[1]?.capitalLines?.[0];
      if (barn?.kind === 'item') Object.assign(barn, { taxClass: 'straight-line', taxLifeYears: 10 });
    });
    expect(evaluateScenario(tenYears).options.find((o) => o.id === 'candidate')?.years[1]?.depreciation).toBe(10_000);
    // A 40 000 grant with grants reducing the base: (100 000 − 40 000) ÷ 10 = 6 000 a year.
    const granted = handScenario((input) => {
      input.finance = { ...input.finance, taxRate: 0.25, grants: 40_000, grantsReduceDepreciableBase: true };
      const barn = input.options[1]?.capitalLines?.[0];
      if (barn?.kind === 'item') Object.assign(barn, { taxClass: 'straight-line', taxLifeYears: 10 });
    });
    expect(evaluateScenario(granted).options.find((o) => o.id === 'candidate')?.years[1]?.depreciation).toBe(6000);
  });
});

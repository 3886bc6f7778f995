import { describe, expect, it } from 'vitest';
import type { OptionResult, ScenarioResults } from '../../../shared/engine/results';
import type { Scenario } from '../../../shared/schema';
import { cashLeftAfterLoans, familySummary } from '../../../src/components/print/family-summary';
import { operationsPaybackReading, type ReadingFormat } from '../../../src/components/results/readings';
import { formatMoney, formatNumber, formatPercent } from '@/composables/useFormat';

const en: ReadingFormat = {
  money: (v) => formatMoney(v, { currency: 'EUR', locale: 'en-IE' }, 0),
  percent: (v) => formatPercent(v, 'en-IE'),
  number: (v, d = 0) => formatNumber(v, 'en-IE', d, d > 0),
};

/** Only the fields the summary reads; a two-year horizon built by hand. */
function option(id: string, fields: Partial<OptionResult>): OptionResult {
  return {
    id,
    name: id,
    current: false,
    labourHoursPerYear: [0, 0, 0],
    beddingTonnesPerYear: [0, 0, 0],
    years: [{}, { cashAvailableForDebtService: 0 }, { cashAvailableForDebtService: 0 }],
    loan: { years: [] },
    breakEvenMilkPriceForCoverage: { atOne: null, atThreshold: null },
    // The engine gives the current option no change against itself (docs/model.md).
    incremental: null,
    ...fields,
  } as unknown as OptionResult;
}

const grazing = option('grazing', {
  current: true,
  labourHoursPerYear: [0, 1460, 1460],
  beddingTonnesPerYear: [0, 52, 52],
  years: [{}, { cashAvailableForDebtService: 300000 }, { cashAvailableForDebtService: 290000 }] as OptionResult['years'],
});
const barn = option('barn', {
  labourHoursPerYear: [0, 2190, 2190],
  beddingTonnesPerYear: [0, 156, 156],
  years: [{}, { cashAvailableForDebtService: 330000 }, { cashAvailableForDebtService: 310000 }] as OptionResult['years'],
  loan: { years: [{ payment: 50000 }, { payment: 50000 }] } as OptionResult['loan'],
  incremental: { npv: -120000 } as OptionResult['incremental'],
});
const results = {
  horizonYears: 2,
  currency: 'EUR',
  currentOptionId: 'grazing',
  currentOptionCarriesCapital: false,
  // Existing farm cash = 160 000 − 300 000 (herd margin) + the current option's cash that year.
  existingFarm: { herdMarginInExistingCash: 300000, cashForDebtServiceByYear: [0, 160000, 150000], debtPaymentsByYear: [0, 45000, 45000] },
  options: [grazing, barn],
} as unknown as ScenarioResults;
const scenario = { herd: { milkPricePerKg: 0.45, lyingResponseKgPerHour: 1 }, finance: { coverageThreshold: 1.25 } } as unknown as Scenario;

describe('the family summary', () => {
  it('counts the cash left after every loan payment from the existing farm, the change and both debts', () => {
    // Year 1: 160 000 + (330 000 − 300 000) − 45 000 − 50 000 = 95 000 (by hand).
    expect(cashLeftAfterLoans(results, barn, grazing, 1)).toBe(95000);
    // Year 2: 150 000 + (310 000 − 290 000) − 45 000 − 50 000 = 75 000.
    expect(cashLeftAfterLoans(results, barn, grazing, 2)).toBe(75000);
    // Staying put in year 1: 160 000 − 45 000 = 115 000.
    expect(cashLeftAfterLoans(results, grazing, grazing, 1)).toBe(115000);
  });

  it('ranks by the change and says in everyday words what it changes', () => {
    const summary = familySummary(scenario, results, null, en, (v) => `€${v.toFixed(3)} a kg`);
    expect(summary.question).toBe('Should the farm stay with grazing or change to barn?');
    const [first] = summary.options;
    expect(first?.headline).toBe("leaves the family €120,000 worse off than grazing over 2 years, in today's money.");
    // (2190 − 1460) h ÷ 365 days = 2.0 h a day; (156 − 52) t ÷ 52 weeks = 2.0 t a week (by hand).
    expect(first?.dayToDay).toEqual([
      'Work: 2.0 hours a day more than today.',
      'Bedding to buy and spread: 2.0 tonnes a week more than today.',
      'Cash left for the farm after every loan payment: €95,000 in year 1; the tightest year is year 2 with €75,000.',
    ]);
    expect(summary.staying).toBe('Staying with grazing: €115,000 left for the farm after every loan payment in year 1.');
    // Without a kept risk run the page says so once, and no option carries a risk sentence.
    expect(first?.risk).toBeNull();
    expect(summary.riskNotRun).toMatch(/No risk run is kept on this version/);
  });

  it('says the same hours as today when the work does not change', () => {
    const same = option('same', { labourHoursPerYear: [0, 1460, 1460], beddingTonnesPerYear: [0, 52, 52], incremental: { npv: 1000 } as OptionResult['incremental'] });
    const summary = familySummary(scenario, { ...results, options: [grazing, same] }, null, en, (v) => `€${v.toFixed(3)} a kg`);
    expect(summary.options[0]?.dayToDay.slice(0, 2)).toEqual(['Work: the same hours a day as today.', 'Bedding to buy and spread: the same tonnes a week as today.']);
  });

  it('reads the kept risk run on the change: the chance of losing money and the middle run', () => {
    // A kept run of 5 000 draws in which the barn's change loses money in 3 015 (60.3 %) and the P50 is −130 150.
    const risk = {
      seed: 1,
      drawsRequested: 5000,
      drawsDone: 5000,
      cancelled: false,
      coverageThreshold: 1.25,
      options: [{ optionId: 'barn', incrementalNpv: { p10: -788585, p50: -130150, p90: 471000, probabilityNegative: 3015 / 5000 } }],
    } as unknown as Parameters<typeof familySummary>[5];
    const summary = familySummary(scenario, results, null, en, (v) => `€${v.toFixed(3)} a kg`, risk);
    expect(summary.options[0]?.risk).toBe(
      "In the farm's risk run (5,000 runs with prices, costs and yields varied) it leaves the family worse off than grazing in 60.3% of the runs; the middle run ends €130,150 worse off.",
    );
    expect(summary.riskNotRun).toBeNull();
  });

  it('names the inputs that move the answer most, with the milk break-evens as prices, not rounded money', () => {
    const best = { ...barn, incremental: { npv: -120000, breakEvenMilkPrice: 0.487 } as OptionResult['incremental'], breakEvenMilkPriceForCoverage: { atOne: 0.41, atThreshold: 0.432 } };
    const sens = { options: [{ optionId: 'barn', incrementalNpv: [{ key: 'milkPrice', atLow: -900000, atHigh: 400000 }] }] } as unknown as Parameters<typeof familySummary>[2];
    const summary = familySummary(scenario, { ...results, options: [grazing, best] }, sens, en, (v) => `€${v.toFixed(3)} a kg`);
    const ahead = familySummary(scenario, { ...results, options: [grazing, { ...best, incremental: { npv: 50000, breakEvenMilkPrice: 0.441 } as OptionResult['incremental'] }] }, sens, en, (v) => `€${v.toFixed(3)} a kg`);
    expect(ahead.drivers[0]).toContain('It stays ahead of grazing while milk pays more than €0.441 a kg (today €0.450 a kg).');
    expect(summary.drivers).toEqual([
      "Milk price: from its low to its high value the barn ends between −€900,000 and €400,000 against grazing. It only catches up with grazing if milk pays €0.487 a kg (today €0.450 a kg). The bank's coverage of 1.25 holds while milk pays at least €0.432 a kg.",
    ]);
  });

  it('reads a payback from operations that is not reached as the share of the outlay won back', () => {
    expect(operationsPaybackReading(null, 'not-within-horizon', 0.35, 20, en)).toBe(
      'not paid back from operations: over 20 years running it wins back 35.0% of the outlay; the rest rests on salvage and herd value at the end',
    );
    expect(operationsPaybackReading(null, 'not-within-horizon', -0.6, 20, en)).toMatch(/none of the outlay comes back/);
    expect(operationsPaybackReading(12.2, undefined, 1.4, 20, en)).toBe('the extra cash from running it pays the outlay back in year 13 of 20, before anything is sold at the end');
  });
});

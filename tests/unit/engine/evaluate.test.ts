import { describe, expect, it } from 'vitest';
import { evaluateNpvOnly, evaluateScenario, metricsOf } from '../../../shared/engine/evaluate';
import { milkingLyingHours, npvAtMilk, planOption, projectOption } from '../../../shared/engine/projection';
import { scenarioSchema, type Scenario } from '../../../shared/schema';
import type { OptionResult } from '../../../shared/engine/results';
import { demoScenario } from './fixtures';
import { handScenario } from './hand-scenario';

const v = 1 / 1.06;

function option(results: ReturnType<typeof evaluateScenario>, id: string): OptionResult {
  const found = results.options.find((o) => o.id === id);
  if (!found) throw new Error(`no option ${id}`);
  return found;
}

describe('metric conventions', () => {
  it('discounts year 0 by nothing (numpy / financial npv convention)', () => {
    // Gitman (2003) p. 346 via numpy-financial npv docs (read): 8 %; −40 000, 5000, 8000, 12 000, 30 000 → 3065.22267.
    const metrics = metricsOf([-40_000, 5000, 8000, 12_000, 30_000], 0.08, 0.08);
    expect(metrics.npv).toBeCloseTo(3065.22267, 4);
    // Spreadsheet NPV() would discount the first flow: 3065.22267 / 1.08 = 2838.16914 — not what we report.
    expect(metrics.npv).not.toBeCloseTo(2838.16914, 0);
  });

  it('reports IRR and a null IRR with a reason', () => {
    // Gitman p. 348 via numpy-financial irr docs (read): −100, 39, 59, 55, 20 → 0.28095.
    expect(metricsOf([-100, 39, 59, 55, 20], 0.1, 0.1).irr).toBeCloseTo(0.28095, 5);
    expect(metricsOf([-100, 39, 59, 55, 20], 0.1, 0.1).irrKind).toBe('investment');
    // The same flows reversed in sign are a loan taken at 28.095 %: the rate is a cost, not a return.
    const borrowing = metricsOf([100, -39, -59, -55, -20], 0.1, 0.1);
    expect(borrowing.irr).toBeCloseTo(0.28095, 5);
    expect(borrowing.irrKind).toBe('borrowing');
    // All positive flows: no rate makes NPV 0 (docs/model.md: null with a reason, never a wrong number).
    const none = metricsOf([100, 39, 59], 0.1, 0.1);
    expect(none.irr).toBeNull();
    expect(none.irrReason).toBe('no-sign-change');
  });
});

describe('evaluateScenario on the hand-calculated case', () => {
  const results = evaluateScenario(handScenario());
  const candidate = option(results, 'candidate');
  const current = option(results, 'current');

  it('puts year 0 as −capital and no loan proceeds in the project flows', () => {
    // Project (unlevered) view, shared/engine/README.md: year 0 = grants − capital = −100 000.
    expect(candidate.cashFlows[0]).toBe(-100_000);
    expect(candidate.capitalTotal).toBe(100_000);
    expect(candidate.capitalPerStall).toBeCloseTo(100_000 / 100, 9);
    expect(current.cashFlows[0]).toBe(0);
  });

  it('builds each yearly line from the hand calculation', () => {
    // Year 1: yield 30 + 1.0 × 1 h × 0.5 = 30.5 kg; milk 100 × 30.5 × 365 = 1 113 250 kg × 0.40 = 445 300.00.
    // Feed 100 × 365 × 5 = 182 500 + 0.15 × (1 113 250 − 1 095 000 = 18 250 kg) = 2737.50 → 185 237.50.
    const year1 = candidate.years[1];
    expect(year1?.yieldKgPerCowDay).toBeCloseTo(30.5, 12);
    expect(year1?.milkSoldKg).toBeCloseTo(1_113_250, 6);
    expect(year1?.milkIncome).toBe(445_300);
    expect(year1?.feed).toBe(185_237.5);
    // Margin 445 300 − 185 237.50 = 260 062.50; no tax; net = margin.
    expect(year1?.operatingMargin).toBe(260_062.5);
    expect(year1?.netCashFlow).toBe(260_062.5);
    // Year 5 salvage: 100 000 × (20 − 5)/20 = 75 000.
    expect(candidate.years[5]?.salvage).toBe(75_000);
  });

  it('gives the incremental flows against the current option', () => {
    // Extra milk 100 × 0.5 × 365 = 18 250 kg × (0.40 − 0.15) = 4562.50 in year 1; 36 500 kg × 0.25 = 9125 after;
    // year 5 adds salvage 75 000 → 84 125.
    expect(candidate.incremental?.cashFlows).toEqual([-100_000, 4562.5, 9125, 9125, 9125, 84_125]);
  });

  it('gives NPV, payback and profitability index on those flows', () => {
    // NPV = −100 000 + 4562.5v + 9125(v² + v³ + v⁴) + 84 125v⁵, v = 1/1.06 → −9822.06.
    const npv = -100_000 + 4562.5 * v + 9125 * (v ** 2 + v ** 3 + v ** 4) + 84_125 * v ** 5;
    expect(candidate.incremental?.npv).toBeCloseTo(npv, 6);
    expect(npv).toBeCloseTo(-9822.06, 2);
    // Payback: cumulative −68 062.50 after year 4; 4 + 68 062.50 / 84 125 = 4.80906 (docs/model.md interpolation).
    expect(candidate.incremental?.paybackYears).toBeCloseTo(4 + 68_062.5 / 84_125, 12);
    // Discounted payback: never (NPV < 0 at H).
    expect(candidate.incremental?.discountedPaybackYears).toBeNull();
    expect(candidate.incremental?.profitabilityIndex).toBeCloseTo((npv + 100_000) / 100_000, 9);
  });

  it('finds the break-even milk price', () => {
    // NPV(p) = −100 000 + 75 000v⁵ + (p − 0.15)(18 250v + 36 500(v² + v³ + v⁴ + v⁵)) = 0
    // → p = 0.15 + (100 000 − 75 000v⁵) / (18 250v + 36 500(v² + v³ + v⁴ + v⁵)) = 0.471938.
    const expected = 0.15 + (100_000 - 75_000 * v ** 5) / (18_250 * v + 36_500 * (v ** 2 + v ** 3 + v ** 4 + v ** 5));
    expect(candidate.incremental?.breakEvenMilkPrice).toBeCloseTo(expected, 7);
    expect(expected).toBeCloseTo(0.471938, 6);
  });

  it('finds the break-even lying-time response', () => {
    // NPV(g) = −100 000 + 75 000v⁵ + g × 1 h × 36 500 × 0.25 × (0.5v + v² + v³ + v⁴ + v⁵) = 0 → g = 1.287754 kg/h,
    // inside the 0.9–1.6 kg/h range reported from Miner Institute research (docs/references.md, read, secondary).
    const expected = (100_000 - 75_000 * v ** 5) / (9125 * (0.5 * v + v ** 2 + v ** 3 + v ** 4 + v ** 5));
    expect(candidate.incremental?.breakEvenLyingResponse).toBeCloseTo(expected, 7);
    expect(expected).toBeCloseTo(1.287754, 6);
  });

  it('borrows capital − equity − grants and schedules it in cents', () => {
    // 100 000 at 5 % over 5 annual payments: 100 000 × 0.05 / (1 − 1.05⁻⁵) = 23 097.48; year-1 interest 5000.00.
    expect(candidate.loan.amount).toBe(100_000);
    expect(candidate.loan.years[0]?.payment).toBe(23_097.48);
    expect(candidate.loan.years[0]?.interest).toBe(5000);
    expect(candidate.loan.totalPrincipal).toBe(100_000);
    expect(candidate.years[1]?.loanInterest).toBe(5000);
    expect(candidate.years[1]?.loanPrincipal).toBe(18_097.48);
    // Financed view: year 0 = −100 000 + loan 100 000 = 0; year 1 = 260 062.50 − 23 097.48 = 236 965.02.
    expect(candidate.financedCashFlows[0]).toBe(0);
    expect(candidate.financedCashFlows[1]).toBe(236_965.02);
    expect(current.loan.amount).toBe(0);
  });

  it('gives project and whole-farm coverage (FFSC: cash for debt service ÷ P + I)', () => {
    // Year 1: project = 4562.50 / 23 097.48 = 0.197532; whole farm = (50 000 + 4562.50) / (20 000 + 23 097.48) = 1.266040.
    const year1 = candidate.coverage[0];
    expect(year1?.project).toBeCloseTo(4562.5 / 23_097.48, 9);
    expect(year1?.wholeFarm).toBeCloseTo(54_562.5 / 43_097.48, 9);
    // Lowest whole farm is year 1 (year 2..5 carry 9125 of extra cash).
    expect(candidate.lowestCoverage?.year).toBe(1);
    // Below the 1.25 default threshold (common practice, no source)? 1.266 is not.
    expect(candidate.yearsBelowCoverageThreshold).toEqual([]);
    // The current option: no project ratio; whole farm 50 000 / 20 000 = 2.5.
    expect(current.coverage[0]).toEqual({ year: 1, project: null, wholeFarm: 2.5 });
  });

  it('reports the sizing of the option', () => {
    // 100 cows at 1 cow per stall → 100 stalls; 2 troughs × 4 m = 8 m ≥ 100 × 7.6 cm = 7.6 m (Penn State Extension).
    expect(candidate.stalls).toBe(100);
    expect(candidate.sizing.waterCheck.status).toBe('within');
    expect(candidate.sizing.stallCheck.status).toBe('not-given');
  });
});

describe('evaluateScenario: every named line of a year', () => {
  // Year 2 of the candidate with wage growth 3 %, bedding, fertiliser and general growth 2 %
  // (growth factors 1.03² = 1.0609 and 1.02² = 1.0404; docs/model.md: today's money grown to year t).
  const results = evaluateScenario(
    handScenario((s) => {
      s.herd.growth = { milkPrice: 0, feed: 0, wages: 0.03, bedding: 0.02, fertiliser: 0.02, general: 0.02 };
      s.herd.fertiliserPrices = { nitrogenPerKg: 1.1, phosphatePerKg: 0.9, potashPerKg: 0.6 };
      const candidate = s.options[1];
      if (!candidate) return;
      candidate.labour = { scrapingPassesPerDay: 2, minutesPerScrapingPass: 15, bedCleaningsPerDay: 2, secondsPerStallCleaning: 10, beddingTonnesPerHour: 1, troughCleaningsPerDay: 1, minutesPerTroughCleaning: 5, grazingHoursPerGrazingDay: 3 };
      candidate.bedding = { material: 'sawdust', kgPerStallDay: 1, pricePerTonne: 60, bulkDensityTonnesPerM3: 0.25, shareToManureStorage: 1 };
      candidate.health = { lamenessCasesPer100Cows: 24, lamenessCostPerCase: 300, mastitisCasesPer100Cows: 0, mastitisCostPerCase: 0, injuriesPer100Cows: 0, injuryCostPerCase: 0, extraCullsPer100Cows: 2 };
      candidate.maintenanceRate = 0.01;
      candidate.energyLines = [{ id: 'fans', description: 'Fans', kwhPerYear: 1000, pricePerKwh: 0.25 }];
      candidate.runningCosts = [{ id: 'misc', description: 'Sundries', amountPerYear: 500, growth: 'general' }];
      candidate.manure = { collectionEfficiency: 0.95, handlingCostPerM3: 2.5, sandExtraHandlingCostPerM3: 0, storageDays: 120, washWaterM3PerCowDay: 0.05, openStorageAreaM2: 0, netRainMPerYear: 0, freeboardM: 0 };
    }),
  );
  const year2 = option(results, 'candidate').years[2];

  it('costs labour by task', () => {
    // Scraping 2 × 15 min ÷ 60 × 365 = 182.5 h × 15.00 × 1.0609 = 2904.21375 → 2904.21.
    expect(year2?.labourScraping).toBe(2904.21);
    // Bed care 2 × 10 s × 100 stalls ÷ 3600 × 365 = 202.78 h × 15 × 1.0609 = 3226.904 → 3226.90.
    expect(year2?.labourBedCare).toBe(3226.9);
    // Troughs 1 × 5 min × 2 troughs ÷ 60 × 365 = 60.83 h × 15 × 1.0609 = 968.071 → 968.07.
    expect(year2?.labourTroughs).toBe(968.07);
    // Bedding top-up 36.5 t ÷ 1 t/h = 36.5 h × 15 × 1.0609 = 580.84275 → 580.84.
    expect(year2?.labourBeddingTopUp).toBe(580.84);
    // A freestall has no grazing days, so 3 h per grazing day costs nothing.
    expect(year2?.labourGrazing).toBe(0);
    expect(year2?.labourHours.total).toBeCloseTo(182.5 + 202.7777778 + 60.8333333 + 36.5, 6);
  });

  it('costs bedding, health, culling, maintenance, energy and running costs', () => {
    // Bedding 1 kg × 100 stalls × 365 = 36.5 t × 60 = 2190 × 1.0404 = 2278.476 → 2278.48.
    expect(year2?.bedding).toBe(2278.48);
    expect(year2?.beddingTonnes).toBeCloseTo(36.5, 9);
    // Lameness 24 per 100 (Cook et al. 2004 mattress prevalence) × 1 × 300 = 7200 × 1.0404 = 7490.88.
    expect(year2?.health).toBe(7490.88);
    // Extra culls 2 per 100 × 1 × (2000 − 800) = 2400 × 1.0404 = 2496.96.
    expect(year2?.culling).toBe(2496.96);
    // Maintenance 1 % × 100 000 = 1000 × 1.0404; energy 1000 kWh × 0.25 = 250 × 1.0404; sundries 500 × 1.0404.
    expect(year2?.maintenance).toBe(1040.4);
    expect(year2?.energy).toBe(260.1);
    expect(year2?.runningCosts).toBe(520.2);
  });

  it('values the manure and costs its handling', () => {
    // 100 cows × 365 × 0.95 = 34 675 cow-days. N 0.45 × 34 675 × 0.35 × 1.10 = 6007.44; P 0.078 × 34 675 × 2.2910 × 0.90 = 5576.72;
    // K 0.10 × 34 675 × 1.2051 × 0.60 = 2507.21 (ASABE D384.2 from memory; SPES-201NP; Cornell CSS 412) → 14 091.372 × 1.0404 = 14 660.66.
    expect(year2?.manureValue).toBe(14_660.66);
    // Stored: 68 × 34 675 ÷ 1000 = 2357.9 m³ + wash 0.05 × 100 × 365 = 1825 + sawdust 36.5 t ÷ 0.25 t/m³ = 146 → 4328.9 m³
    // × 2.50 = 10 822.25 × 1.0404 = 11 259.4689 → 11 259.47.
    expect(year2?.manure.storedM3).toBeCloseTo(4328.9, 6);
    expect(year2?.manureHandling).toBe(11_259.47);
  });

  it('sums the lines into the margin and the net cash flow exactly', () => {
    if (!year2) throw new Error('no year 2');
    const costs = year2.feed + year2.labourScraping + year2.labourBedCare + year2.labourBeddingTopUp + year2.labourTroughs + year2.labourGrazing +
      year2.bedding + year2.health + year2.culling + year2.maintenance + year2.energy + year2.runningCosts + year2.manureHandling;
    expect(year2.operatingMargin).toBeCloseTo(year2.milkIncome + year2.manureValue - costs, 9);
    expect(year2.netCashFlow).toBeCloseTo(year2.operatingMargin - year2.replacements - year2.herdPurchases - year2.tax, 9);
  });
});

describe('evaluateScenario: replacements and equivalent annual cost', () => {
  it('replaces a short-lived line inside the horizon and values the last one at H', () => {
    // Mattresses 100 stalls × 200 = 20 000, life 2, H 5, no inflation: bought at 0, again at 2 and 4; at H the
    // year-4 set is 1 year old: 20 000 × 1/2 = 10 000 salvage, plus the barn's 75 000.
    const candidate = option(
      evaluateScenario(
        handScenario((s) => {
          s.options[1]?.capitalLines?.push({ kind: 'item', id: 'mats', description: 'Mattresses', category: 'beds', unit: 'per-stall', quantity: null, unitCost: 200, lifeYears: 2, replaceAtEndOfLife: true });
        }),
      ),
      'candidate',
    );
    expect(candidate.years.map((y) => y.replacements)).toEqual([0, 0, 20_000, 0, 20_000, 0]);
    expect(candidate.years[5]?.salvage).toBe(85_000);
    expect(candidate.capitalTotal).toBe(120_000);
  });

  it('gives the equivalent annual cost per stall with the capital recovery factor', () => {
    // (100 000 − 75 000 × 1.06⁻⁵) × CRF(6 %, 5) ÷ 100 stalls; CRF = 0.06 / (1 − 1.06⁻⁵) = 0.2373964.
    const candidate = option(evaluateScenario(handScenario()), 'candidate');
    const crf = 0.06 / (1 - 1.06 ** -5);
    expect(crf).toBeCloseTo(0.2373964, 7);
    expect(candidate.equivalentAnnualCostPerStall).toBeCloseTo(((100_000 - 75_000 * v ** 5) * crf) / 100, 2);
  });
});

describe('evaluateScenario: tax, grants and herd change', () => {
  it('taxes each option and carries the interest and depreciation shield', () => {
    // 25 % tax, straight line 100 000 / 20 = 5000 a year.
    // Current year 1: margin 438 000 − 182 500 = 255 500 → tax 63 875.00.
    // Candidate year 1: 260 062.50 − 5000 − 5000 interest = 250 062.50 × 25 % = 62 515.625 → 62 515.63 (half-up).
    // Incremental year 1 = 4562.50 − (62 515.63 − 63 875) = 5921.87.
    const results = evaluateScenario(handScenario((s) => (s.finance.taxRate = 0.25)));
    const candidate = option(results, 'candidate');
    expect(option(results, 'current').years[1]?.tax).toBe(63_875);
    expect(candidate.years[1]?.depreciation).toBe(5000);
    expect(candidate.years[1]?.tax).toBe(62_515.63);
    expect(candidate.incremental?.cashFlows[1]).toBe(5921.87);
    // Year 2 interest 5 % × 81 902.52 = 4095.126 → 4095.13; taxable 264 625 − 5000 − 4095.13 = 255 529.87 × 25 % = 63 882.4675 → 63 882.47;
    // incremental 9125 − (63 882.47 − 63 875) = 9117.53.
    expect(candidate.years[2]?.loanInterest).toBe(4095.13);
    expect(candidate.incremental?.cashFlows[2]).toBe(9117.53);
    // Year 5: salvage 75 000 equals the tax book value 100 000 − 5 × 5000, so no gain is taxed.
    expect(candidate.years[5]?.taxableIncome).toBe(264_625 - 5000 - (candidate.years[5]?.loanInterest ?? 0));
  });

  it('carries losses forward when they may not offset other income', () => {
    // Rate 25 %, no offset, margin cut to a loss by a 300 000 running cost: year-1 taxable < 0 → no tax (not a refund).
    const results = evaluateScenario(
      handScenario((s) => {
        s.finance.taxRate = 0.25;
        s.finance.lossesOffsetOtherIncome = false;
        const candidate = s.options[1];
        if (candidate) candidate.runningCosts = [{ id: 'x', description: 'Loss maker', amountPerYear: 300_000 }];
      }),
    );
    const candidate = option(results, 'candidate');
    // 260 062.50 − 300 000 − 5000 − 5000 = −49 937.50 → tax 0 (carried).
    expect(candidate.years[1]?.taxableIncome).toBe(-49_937.5);
    expect(candidate.years[1]?.tax).toBe(0);
    // Year 2: taxable 264 625 − 300 000 − … < 0 again → still 0; no year pays negative tax.
    expect(candidate.years.every((y) => y.tax >= 0)).toBe(true);
  });

  it('takes grants into year 0 and out of the loan', () => {
    // Grants 20 000: year 0 = 20 000 − 100 000 = −80 000; loan 100 000 − 20 000 = 80 000.
    const candidate = option(evaluateScenario(handScenario((s) => (s.finance.grants = 20_000))), 'candidate');
    expect(candidate.cashFlows[0]).toBe(-80_000);
    expect(candidate.loan.amount).toBe(80_000);
    expect(candidate.financing).toEqual({ grants: 20_000, equity: 0, loanAmount: 80_000 });
  });

  it('buys added cows at year 0 and values them at cull value in year H', () => {
    // 10 added cows × 2000 (replacement heifer cost) = 20 000 in year 0; year 5: 10 × 800 = 8000 herd value.
    // Year-1 milk: 110 × 30.5 × 365 × 0.40 = 489 830.00.
    const results = evaluateScenario(
      handScenario((s) => {
        const candidate = s.options[1];
        if (candidate) candidate.herdChange = { addedCows: 10 };
      }),
    );
    const candidate = option(results, 'candidate');
    expect(candidate.cashFlows[0]).toBe(-120_000);
    expect(candidate.years[0]?.herdPurchases).toBe(20_000);
    expect(candidate.years[1]?.milkIncome).toBe(489_830);
    expect(candidate.years[5]?.herdValueAtHorizon).toBe(8000);
    // Stalls follow the largest herd: 110.
    expect(candidate.stalls).toBe(110);
  });
});

describe('fast path', () => {
  it('agrees with the full evaluation to 0.01 on the demo scenario', () => {
    const scenario = demoScenario();
    const full = evaluateScenario(scenario);
    const fast = evaluateNpvOnly(scenario, { incrementalIrr: true });
    for (const result of full.options) {
      const quick = fast.find((f) => f.id === result.id);
      expect(quick).toBeDefined();
      expect(Math.abs((quick?.npv ?? NaN) - result.npv)).toBeLessThanOrEqual(0.01);
      if (result.incremental) expect(Math.abs((quick?.incrementalNpv ?? NaN) - result.incremental.npv)).toBeLessThanOrEqual(0.01);
      else expect(quick?.incrementalNpv).toBeNull();
      if (result.irr === null) expect(quick?.irr).toBeNull();
      else expect(quick?.irr).toBeCloseTo(result.irr, 9);
      expect(quick?.minCoverage ?? null).toBe(result.lowestCoverage?.value ?? null);
      if (result.incremental?.irr != null) expect(quick?.incrementalIrr).toBeCloseTo(result.incremental.irr, 9);
    }
  });
});

describe('payback on an incremental series without an outlay', () => {
  it('is null with no-net-investment, not 0', () => {
    // docs/model.md payback: the first year cumulative CF ≥ 0. A change that saves 50 at year 0 and costs 10 a
    // year after has nothing to pay back; shared/engine/README.md states the rule.
    const saving = metricsOf([50, -10, -10, -10], 0.06, 0.06, 'incremental');
    expect(saving.paybackYears).toBeNull();
    expect(saving.paybackReason).toBe('no-net-investment');
    expect(saving.discountedPaybackYears).toBeNull();
    expect(saving.discountedPaybackReason).toBe('no-net-investment');
    // The same flows of an option's own project keep finance.ts paybackYears (0 when flows[0] ≥ 0).
    expect(metricsOf([50, -10, -10, -10], 0.06, 0.06).paybackYears).toBe(0);
    // Never reached: null with not-within-horizon.
    const never = metricsOf([-100, 10, 10], 0.06, 0.06, 'incremental');
    expect(never.paybackYears).toBeNull();
    expect(never.paybackReason).toBe('not-within-horizon');
  });
});

describe('coverage in the horizon year', () => {
  it('leaves the salvage and the tax on its gain out of the cash available for debt service', () => {
    // FFSC: cash available for debt service = operating margin − tax on the year's operations; the salvage at H
    // is a valuation, not an operating receipt. 200 % declining balance over 20 years leaves a tax book value of
    // 100 000 × 0.9⁵ = 59 049 at year 5 against 75 000 salvage, so the year's tax includes 25 % × 15 951 of gain.
    const results = evaluateScenario(
      handScenario((s) => {
        s.finance.taxRate = 0.25;
        s.finance.depreciation = 'declining-balance';
      }),
    );
    const year5 = option(results, 'candidate').years[5];
    if (!year5) throw new Error('no year 5');
    const operatingTaxable = year5.operatingMargin - year5.depreciation - year5.loanInterest;
    expect(year5.taxableIncome).toBeCloseTo(operatingTaxable + 75_000 - 59_049, 6);
    expect(year5.cashAvailableForDebtService).toBeCloseTo(year5.operatingMargin - Math.round(0.25 * operatingTaxable * 100) / 100, 6);
    expect(year5.cashAvailableForDebtService).toBeGreaterThan(year5.operatingMargin - year5.tax);
  });
});

describe('break-evens from the unrounded search', () => {
  // The barns feed a mixed ration (+6 kg/cow/day), so at least one lying-time break-even falls inside 0..5 kg/h.
  const scenario = demoScenario();
  for (const candidate of scenario.options) if (!candidate.current) candidate.systemYieldAdjustment = 6;
  const results = evaluateScenario(scenario);
  const H = scenario.horizonYears;
  // Each year ≈ 25 lines in two options, each rounded to the cent (± 0.005), over H + 1 years.
  const centsNoise = 0.005 * 25 * 2 * (H + 1);

  it('gives an incremental NPV of about 0 on the ledger path at the break-even milk price and response', () => {
    // docs/model.md: the break-even milk price is the price at which incremental NPV = 0.
    let checked = 0;
    for (const result of results.options) {
      const price = result.incremental?.breakEvenMilkPrice;
      if (price === null || price === undefined) continue;
      const atPrice = evaluateScenario(scenarioSchema.parse({ ...scenario, herd: { ...scenario.herd, milkPricePerKg: price } }));
      expect(Math.abs(option(atPrice, result.id).incremental?.npv ?? NaN)).toBeLessThanOrEqual(centsNoise);
      const response = result.incremental?.breakEvenLyingResponse;
      if (response === null || response === undefined) continue;
      const atResponse = evaluateScenario(scenarioSchema.parse({ ...scenario, herd: { ...scenario.herd, lyingResponseKgPerHour: response } }));
      expect(Math.abs(option(atResponse, result.id).incremental?.npv ?? NaN)).toBeLessThanOrEqual(centsNoise);
      checked++;
    }
    expect(checked).toBeGreaterThan(0);
  });

  it('models each option’s NPV from its milk model as the projection does', () => {
    const current = scenario.options.find((o) => o.current) as Scenario['options'][number];
    for (const candidate of scenario.options) {
      const { plan } = planOption(scenario, candidate, 'fast');
      const projection = projectOption(scenario, candidate, plan, milkingLyingHours(scenario.herd, current), false, true);
      if (!projection.milk) throw new Error('no milk model');
      const modelled = npvAtMilk(projection.milk, plan, scenario.finance, projection.cashFlows[0] ?? 0, scenario.herd.milkPricePerKg, scenario.herd.lyingResponseKgPerHour);
      // Milk, feed and tax are unrounded in the model: three lines a year at ± 0.005.
      expect(Math.abs(modelled - option(results, candidate.id).npv)).toBeLessThanOrEqual(0.005 * 3 * (H + 1));
    }
  });
});

import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { scenarioSchema } from '../../../shared/schema';
import { anchoredForShocks, evaluateCore, evaluateScenario, evaluateStressYears } from '../../../shared/engine/evaluate';
import { milkingLyingHours, planOption, projectOption, withCapitalOf, withFinanceTerms, type MilkModel } from '../../../shared/engine/projection';
import { shockScenario, STRESS_TESTS } from '../../../shared/engine/stress';
import { handScenario } from './hand-scenario';

// The hand case (hand-scenario.ts): 100 cows, 30 kg at 0.40, feed 5 a cow-day, no growth, no tax.
// Current option: milk 100 × 30 × 365 × 0.40 = 438 000, feed 100 × 365 × 5 = 182 500, margin 255 500 a year.
// Candidate (1 h more lying, g = 1, half in year 1): year 1 milk 1 113 250 kg → 445 300, feed 182 500
// + 18 250 × 0.15 = 185 237.50, margin 260 062.50 (change 4 562.50); years 2..5 milk 1 131 500 kg →
// 452 600, feed 187 975, margin 264 625 (change 9 125). Loan 100 000 at 5 % over 5 annual payments:
// 100 000 × 0.05 ÷ (1 − 1.05^−5) = 23 097.48 a year. Existing cash 50 000, existing debt 20 000.
const LOAN_PAYMENT = 23_097.48;
const CASH_BESIDE_HERD = 50_000 - 255_500; // the existing figure less the herd margin it holds (year 1 of the current option)

describe('payback of the change from operations', () => {
  it('leaves out the year-H salvage: operations recover 41 062.50 of the 100 000 outlay', () => {
    const candidate = evaluateScenario(handScenario()).options[1];
    // 4 562.50 + 4 × 9 125 = 41 062.50 < 100 000; with the salvage of 100 000 × 15 ÷ 20 = 75 000 in
    // year 5 the project flows do pay back: 4 + (100 000 − 4 562.50 − 3 × 9 125) ÷ (9 125 + 75 000).
    expect(candidate?.incremental?.paybackFromOperationsYears).toBeNull();
    expect(candidate?.incremental?.paybackFromOperationsReason).toBe('not-within-horizon');
    expect(candidate?.incremental?.operationsRecoveredShare).toBeCloseTo(41_062.5 / 100_000, 12);
    expect(candidate?.incremental?.paybackYears).toBeCloseTo(4 + 68_062.5 / 84_125, 9);
  });

  it('is reached in year 4 when the barn costs 30 000', () => {
    const scenario = handScenario((input) => {
      const line = input.options[1]?.capitalLines?.[0];
      if (line && line.kind === 'item') line.unitCost = 30_000;
    });
    const candidate = evaluateScenario(scenario).options[1];
    // Cumulative from operations: −30 000 + 4 562.50 + 9 125 + 9 125 = −7 187.50 after year 3; year 4 adds 9 125.
    expect(candidate?.incremental?.paybackFromOperationsYears).toBeCloseTo(3 + 7_187.5 / 9_125, 9);
    expect(candidate?.incremental?.paybackFromOperationsReason).toBeUndefined();
  });
});

describe('whole-farm coverage that moves with the current option', () => {
  it('takes the existing farm down with a milk price 10 % lower', () => {
    const base = anchoredForShocks(handScenario());
    expect(base.herd.existingCashHerdMarginPerYear).toBe(255_500);
    const lower = { ...base, herd: { ...base.herd, milkPricePerKg: 0.36 } };
    const current = evaluateScenario(lower).options[0];
    // Current margin at 0.36: 394 200 − 182 500 = 211 700; (−205 500 + 211 700) ÷ 20 000 = 0.31.
    expect(current?.lowestCoverage?.value).toBeCloseTo(6_200 / 20_000, 12);
    expect(evaluateScenario(base).options[0]?.lowestCoverage?.value).toBeCloseTo(50_000 / 20_000, 12);
  });

  it('counts an existing loan until its last year', () => {
    const scenario = handScenario((input) => {
      input.herd.existingLoans = [{ description: 'Parlour loan', paymentPerYear: 10_000, lastYear: 2 }];
    });
    const results = evaluateScenario(scenario);
    expect(results.existingFarm.debtPaymentsByYear).toEqual([0, 30_000, 30_000, 20_000, 20_000, 20_000]);
    const current = results.options[0];
    expect(current?.coverage[0]?.wholeFarm).toBeCloseTo(50_000 / 30_000, 12);
    expect(current?.coverage[2]?.wholeFarm).toBeCloseTo(50_000 / 20_000, 12);
    // Candidate year 2: (−205 500 + 264 625) ÷ (30 000 + 23 097.48).
    expect(results.options[1]?.coverage[1]?.wholeFarm).toBeCloseTo((CASH_BESIDE_HERD + 264_625) / (30_000 + LOAN_PAYMENT), 9);
  });

  it('counts the current option’s own loan against the change when it carries new capital', () => {
    const scenario = handScenario((input) => {
      input.options[0] = { ...input.options[0]!, capitalLines: [{ kind: 'item', id: 'old-barn', description: 'Refit', category: 'building-shell', unit: 'lump-sum', quantity: 1, unitCost: 40_000, lifeYears: 20, replaceAtEndOfLife: false }] };
    });
    const results = evaluateScenario(scenario);
    expect(results.currentOptionCarriesCapital).toBe(true);
    // Current loan 40 000 → 9 238.99 a year; change in debt service 23 097.48 − 9 238.99 = 13 858.49.
    const currentDue = 40_000 * 0.05 / (1 - 1.05 ** -5);
    expect(results.options[0]?.loan.years[0]?.payment).toBeCloseTo(currentDue, 2);
    expect(results.options[1]?.coverage[0]?.project).toBeCloseTo(4_562.5 / (LOAN_PAYMENT - 9_238.99), 9);
  });
});

describe('the lender stress table', () => {
  it('pins milk −10 % on the hand case', () => {
    const candidate = evaluateScenario(handScenario()).options[1];
    const milk10 = candidate?.stress.find((s) => s.id === 'milk-10');
    // Year 1 at 0.36: margin 400 770 − 185 237.50 = 215 532.50; whole farm (−205 500 + 215 532.50) ÷ 43 097.48.
    expect(milk10?.lowestCoverage).toBeCloseTo((CASH_BESIDE_HERD + 215_532.5) / (20_000 + LOAN_PAYMENT), 9);
    // Change year 1: 215 532.50 − 211 700 = 3 832.50 over this loan's 23 097.48.
    expect(milk10?.lowestProjectCoverage).toBeCloseTo(3_832.5 / LOAN_PAYMENT, 9);
    expect(milk10?.yearsBelowThreshold).toBe(5);
    // Change flows: −100 000; 3 832.50; 7 665 in years 2..4; 7 665 + 75 000 salvage in year 5; at 6 %.
    const flows = [-100_000, 3_832.5, 7_665, 7_665, 7_665, 82_665];
    const npv = flows.reduce((sum, cf, t) => sum + cf / 1.06 ** t, 0);
    expect(milk10?.npvAgainstCurrent).toBeCloseTo(npv, 4);
  });

  it('pins interest +2 points on the hand case', () => {
    const candidate = evaluateScenario(handScenario()).options[1];
    const rate = candidate?.stress.find((s) => s.id === 'rate+2');
    const payment = (100_000 * 0.07) / (1 - 1.07 ** -5); // 24 389.07
    expect(rate?.lowestCoverage).toBeCloseTo((50_000 + 4_562.5) / (20_000 + payment), 6);
    expect(rate?.lowestProjectCoverage).toBeCloseTo(4_562.5 / payment, 6);
  });

  // Overstocking the current option makes its lying hours differ from the figure entered: the
  // re-projection under the capital shock must measure against the same hours as the full run.
  it.each([
    ['as it is', 1],
    ['with the current option overstocked at 1.3 cows per stall', 1.3],
  ])('equals a full evaluation of the demo scenario with the shocked inputs, %s', (_, stocking) => {
    const file = JSON.parse(readFileSync(new URL('../../../scenarios/cairnbrook-five-systems.json', import.meta.url), 'utf8'));
    const demo = scenarioSchema.parse(file);
    const scenario = stocking === 1 ? demo : { ...demo, options: demo.options.map((o) => (o.current ? { ...o, stockingRate: stocking } : o)) };
    const results = evaluateScenario(scenario);
    for (const test of STRESS_TESTS) {
      const shocked = evaluateScenario(shockScenario(scenario, test));
      results.options.forEach((option, i) => {
        const row = option.stress.find((s) => s.id === test.id);
        const again = shocked.options[i];
        expect(row?.lowestCoverage, `${test.id} ${option.id}`).toBeCloseTo(again?.lowestCoverage?.value ?? NaN, 6);
        if (again?.lowestProjectCoverage) expect(row?.lowestProjectCoverage).toBeCloseTo(again.lowestProjectCoverage.value, 6);
        expect(row?.yearsBelowThreshold).toBe(again?.yearsBelowCoverageThreshold.length);
        if (again?.incremental) expect(Math.abs((row?.npvAgainstCurrent ?? NaN) - again.incremental.npv)).toBeLessThan(1);
        else expect(row?.npvAgainstCurrent).toBeNull();
      });
    }
  });
});

describe('the scenario anchored for shocks', () => {
  it('writes in the same herd margin the full evaluation measures, also with the current option overstocked', () => {
    const demo = scenarioSchema.parse(JSON.parse(readFileSync(new URL('../../../scenarios/cairnbrook-five-systems.json', import.meta.url), 'utf8')));
    const scenario = {
      ...demo,
      herd: { ...demo.herd, existingCashHerdMarginPerYear: null },
      options: demo.options.map((o) => (o.current ? { ...o, stockingRate: 1.3 } : o)),
    };
    const anchored = anchoredForShocks(scenario).herd.existingCashHerdMarginPerYear;
    expect(anchored).not.toBeNull();
    // The full evaluation's figure is rounded to the cent.
    expect(Math.abs((anchored ?? NaN) - evaluateScenario(scenario).existingFarm.herdMarginInExistingCash)).toBeLessThanOrEqual(0.005 + 1e-6);
  });
});

describe('break-even milk price for coverage', () => {
  it('solves the hand case where the lowest whole-farm coverage is 1.0 and 1.25', () => {
    const [current, candidate] = evaluateScenario(handScenario()).options;
    // Current: (−205 500 + 1 095 000 p − 182 500) ÷ 20 000 = 1 → p = 408 000 ÷ 1 095 000; = 1.25 → 413 000 ÷ 1 095 000.
    expect(current?.breakEvenMilkPriceForCoverage.atOne).toBeCloseTo(408_000 / 1_095_000, 5);
    expect(current?.breakEvenMilkPriceForCoverage.atThreshold).toBeCloseTo(413_000 / 1_095_000, 5);
    // Candidate: year 1 binds: −205 500 + 1 113 250 p − 185 237.50 = 43 097.48.
    expect(candidate?.breakEvenMilkPriceForCoverage.atOne).toBeCloseTo((205_500 + 185_237.5 + 20_000 + LOAN_PAYMENT) / 1_113_250, 5);
  });
});

describe('sources and uses of funds', () => {
  it('balances to the cent with interest during construction capitalised or paid', () => {
    const build = (mode: 'capitalised' | 'paid') =>
      evaluateScenario(handScenario((input) => {
        input.finance.constructionMonths = 6;
        input.finance.interestDuringConstruction = mode;
      })).options[1]?.sourcesAndUses;
    // IDC = 100 000 × 5 % × 6/12 ÷ 2 = 1 250; feed stock = 6/12 × 2 737.50 extra year-1 feed = 1 368.75.
    const capitalised = build('capitalised');
    expect(capitalised?.uses.map((u) => u.amount)).toEqual([100_000, 1_368.75, 1_250]);
    expect(capitalised?.sources.map((s) => [s.key, s.amount])).toEqual([['loan', 101_250], ['other', 1_368.75]]);
    const paid = build('paid');
    expect(paid?.sources.map((s) => [s.key, s.amount])).toEqual([['loan', 100_000], ['other', 2_618.75]]);
    for (const table of [capitalised, paid]) {
      const sum = (lines: { amount: number }[] = []) => lines.reduce((s, l) => s + Math.round(l.amount * 100), 0);
      expect(sum(table?.uses)).toBe(sum(table?.sources));
    }
  });

  it('warns when the loan runs past the weighted life of what it finances', () => {
    const long = evaluateScenario(handScenario((input) => { input.finance.termYears = 25; })).options[1]?.sourcesAndUses;
    expect(long?.weightedLifeYears).toBe(20);
    expect(long?.termPastLifeWarning).toMatch(/25 years, past the 20.0-year weighted life/);
    expect(evaluateScenario(handScenario()).options[1]?.sourcesAndUses.termPastLifeWarning).toBeNull();
  });
});

describe('Monte Carlo with the existing farm taking the same prices', () => {
  it('counts the current option below the threshold when every draw lowers milk by about 10 %', async () => {
    const { runMonteCarlo } = await import('../../../shared/engine/risk/monte-carlo');
    const scenario = handScenario((input) => {
      input.finance.coverageThreshold = 2.4;
    });
    // Held flat the existing farm would cover 50 000 ÷ 20 000 = 2.5 in every draw; at 0.36 a kg it covers 0.31.
    const result = runMonteCarlo(scenario, {
      draws: 50,
      seed: 7,
      inputs: [{ key: 'milkPrice', distribution: 'triangular', min: 0.89, mode: 0.9, max: 0.91 }],
    });
    const current = result.options.find((o) => o.current);
    expect(current?.probabilityCoverageBelowThreshold).toBe(1);
    // The change's NPV distribution is reported beside it: the candidate loses money in every draw.
    expect(result.options[1]?.incrementalNpv?.probabilityNegative).toBe(1);
    expect(result.options[1]?.incrementalNpv?.p50).toBeLessThan(0);
  });
});

describe('the core evaluation without the decision figures', () => {
  // The split is the engine's own (docs/model.md, "Decision figures"): the core is the full
  // evaluation less the stress table and the coverage break-evens, figure for figure.
  it.each(['cairnbrook-five-systems.json', 'cairnbrook-mattress-or-sand.json'])('equals the full evaluation less stress and coverage break-evens on %s', (name) => {
    const scenario = scenarioSchema.parse(JSON.parse(readFileSync(new URL(`../../../scenarios/${name}`, import.meta.url), 'utf8')));
    const full = evaluateScenario(scenario);
    const core = evaluateCore(scenario);
    expect(core.options.map((o) => Object.keys(o).filter((key) => key === 'stress' || key === 'breakEvenMilkPriceForCoverage'))).toEqual(core.options.map(() => []));
    const stripped = full.options.map((option) => {
      const copy: Record<string, unknown> = { ...option };
      delete copy.stress;
      delete copy.breakEvenMilkPriceForCoverage;
      return copy;
    });
    expect(core).toEqual({ ...full, options: stripped });
    for (const option of full.options) {
      expect(option.stress.map((s) => s.id)).toEqual(STRESS_TESTS.map((t) => t.id));
      expect(option.breakEvenMilkPriceForCoverage).toBeDefined();
    }
  });
});

describe('the stress shocks year by year (what the workbook discounts and divides)', () => {
  it('give back every stress row: NPV of the change, lowest whole-farm and project coverage and years below the threshold', () => {
    const scenario = scenarioSchema.parse(JSON.parse(readFileSync(new URL('../../../scenarios/cairnbrook-five-systems.json', import.meta.url), 'utf8')));
    const results = evaluateScenario(scenario);
    const years = evaluateStressYears(scenario);
    const { discountRate, coverageThreshold } = scenario.finance;
    let checked = 0;
    results.options.forEach((option, i) => {
      option.stress.forEach((row, k) => {
        const detail = years[i]?.[k];
        expect(detail?.id).toBe(row.id);
        // NPV convention of numpy-financial / `financial` npv: flows[0] at t = 0.
        const npv = detail?.changeFlows?.reduce((sum, flow, t) => sum + flow / (1 + discountRate) ** t, 0) ?? null;
        if (row.npvAgainstCurrent === null) expect(npv).toBeNull();
        else expect(Math.abs((npv ?? NaN) - row.npvAgainstCurrent)).toBeLessThan(1e-6);
        // Farm Financial Standards Council coverage: cash available for debt service ÷ P + I, per year.
        const ratios = (detail?.wholeFarmCash ?? []).slice(1).map((cash, t) => cash / (detail?.wholeFarmDebt[t + 1] ?? NaN));
        expect(Math.min(...ratios)).toBeCloseTo(row.lowestCoverage ?? NaN, 12);
        expect(ratios.filter((r) => r < coverageThreshold)).toHaveLength(row.yearsBelowThreshold);
        // Project coverage: the change in whole-farm cash over the change in whole-farm debt service
        // against the current option under the same shock (the existing farm cancels), as the workbook divides.
        const current = years[results.options.findIndex((o) => o.current)]?.[k];
        if (!option.current && current && detail) {
          const project = detail.wholeFarmCash.slice(1).map((cash, t) => {
            const due = (detail.wholeFarmDebt[t + 1] ?? 0) - (current.wholeFarmDebt[t + 1] ?? 0);
            return (cash - (current.wholeFarmCash[t + 1] ?? 0)) / due;
          });
          expect(Math.min(...project)).toBeCloseTo(row.lowestProjectCoverage ?? NaN, 9);
        }
        checked += 1;
      });
    });
    expect(checked).toBe(5 * STRESS_TESTS.length);
  });
});

describe('a plan at other finance terms', () => {
  it('equals the plan built again with the interest rate 2 points higher, loan line by loan line', () => {
    const scenario = scenarioSchema.parse(JSON.parse(readFileSync(new URL('../../../scenarios/cairnbrook-five-systems.json', import.meta.url), 'utf8')));
    const test = STRESS_TESTS.find((t) => t.id === 'rate+2');
    if (!test) throw new Error('no rate+2 shock');
    const shocked = shockScenario(scenario, test);
    for (const option of scenario.options) {
      const moved = withFinanceTerms(planOption(scenario, option, 'ledger').plan, shocked.finance);
      const again = planOption(shocked, option, 'fast').plan;
      // The whole plan, not only the loan: nothing else may depend on the rate (construction interest included).
      expect(moved, option.id).toEqual(again);
    }
    // The rate moved something: the demo's barns borrow.
    const sand = scenario.options.find((o) => o.id === 'sand-freestall');
    if (!sand) throw new Error('no sand option');
    expect(withFinanceTerms(planOption(scenario, sand, 'fast').plan, shocked.finance).interestByYear[1]).toBeGreaterThan(planOption(scenario, sand, 'fast').plan.interestByYear[1] ?? Infinity);
  });
});

describe('a projection at other capital', () => {
  // Consistency with the ledger itself (year-ledger.ts projectOption), no outside source: the
  // stress table's capital shock must read the very figures a re-projection gives.
  it('gives the milk model and year-0 flow of the option projected again with the capital 15 % higher, to the bit', () => {
    const demo = scenarioSchema.parse(JSON.parse(readFileSync(new URL('../../../scenarios/cairnbrook-five-systems.json', import.meta.url), 'utf8')));
    // Grants of 150 000, so a shock also moves grants capped at a cheap option's capital.
    const scenario = { ...demo, finance: { ...demo.finance, grants: 150_000 } };
    const test = STRESS_TESTS.find((t) => t.id === 'capital+15');
    if (!test) throw new Error('no capital+15 shock');
    const shocked = shockScenario(scenario, test);
    const current = scenario.options.find((o) => o.current);
    if (!current) throw new Error('no current option');
    const lying = milkingLyingHours(scenario.herd, current);
    let moved = 0;
    scenario.options.forEach((option, i) => {
      const shockedOption = shocked.options[i];
      if (!shockedOption) throw new Error('options lost under the shock');
      const { plan } = planOption(scenario, option, 'ledger');
      const before = projectOption(scenario, option, plan, lying, true, true);
      const shockedPlan = planOption(shocked, shockedOption, 'fast').plan;
      const again = projectOption(shocked, shockedOption, shockedPlan, lying, false, true);
      const swapped = withCapitalOf(shocked, shockedOption, shockedPlan, before.lines ?? [], before.milk as MilkModel);
      expect(swapped.model, option.id).toEqual(again.milk);
      expect(swapped.yearZero, option.id).toBe(again.cashFlows[0]);
      if (swapped.yearZero !== before.cashFlows[0] && swapped.model.otherMargin.some((m, t) => m !== before.milk?.otherMargin[t])) moved += 1;
    });
    // The shock moved something: the demo's barns carry capital and its maintenance.
    expect(moved).toBeGreaterThan(0);
  });
});

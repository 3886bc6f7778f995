import type { Option, Scenario } from '../schema';
import { coverageSummary, loanDueIn, type ExistingFarm } from './farm-coverage';
import { presentValue } from './discounting';
import { flowsAtPrice, milkAtResponse, planOption, withCapitalOf, withFinanceTerms, type MilkAtResponse, type OptionPlan } from './projection';
import type { YearLine } from './results';
import type { SteadyLines } from './steady-lines';
import { scaleCapitalCost, scaleGrazingFeedCost, scaleHousedFeedCost, scaleMarginalFeedCost, scaleMilkPrice } from './risk/perturb';

/** The lender's shocks, each applied to the inputs as entered. */
export const STRESS_TESTS = [
  { id: 'milk-10', label: 'Milk price −10 %', milk: 0.9, ratePoints: 0, feed: 1, capital: 1 },
  { id: 'milk-20', label: 'Milk price −20 %', milk: 0.8, ratePoints: 0, feed: 1, capital: 1 },
  { id: 'rate+2', label: 'Interest rate +2 points', milk: 1, ratePoints: 0.02, feed: 1, capital: 1 },
  { id: 'feed+10', label: 'Feed cost +10 %', milk: 1, ratePoints: 0, feed: 1.1, capital: 1 },
  { id: 'capital+15', label: 'Capital cost +15 %', milk: 1, ratePoints: 0, feed: 1, capital: 1.15 },
  { id: 'milk-10-rate+2', label: 'Milk price −10 % and interest rate +2 points', milk: 0.9, ratePoints: 0.02, feed: 1, capital: 1 },
] as const;

export type StressTest = (typeof STRESS_TESTS)[number];
export type StressId = StressTest['id'];

/** One option under one shock (ratios; currency for the NPV). */
export interface StressResult {
  id: StressId;
  label: string;
  /** Lowest whole-farm coverage over the horizon; null when nothing is due. */
  lowestCoverage: number | null;
  lowestProjectCoverage: number | null;
  /** NPV of the change against the current option under the shock; null for the current option. */
  npvAgainstCurrent: number | null;
  /** Years whose whole-farm coverage is below the lender's threshold (count). */
  yearsBelowThreshold: number;
}

/**
 * One option under one shock, year by year (currency, index = year): what the workbook's live
 * stress formulas are built on. The change's flows are null for the current option.
 */
export interface StressYears {
  id: StressId;
  /** The project flows of the change against the current option, [0] = year 0. */
  changeFlows: number[] | null;
  /** Whole-farm cash for debt service: the existing farm beside the herd + this option's cash ([0] = 0). */
  wholeFarmCash: number[];
  /** Whole-farm debt service: existing debt + this option's loan P + I ([0] = 0). */
  wholeFarmDebt: number[];
}

/** Feed cost × m: feed per cow-day (housed and grazing, herd and every option) and per extra kg of milk. */
function scaleFeedCost(scenario: Scenario, m: number): Scenario {
  return scaleMarginalFeedCost(scaleGrazingFeedCost(scaleHousedFeedCost(scenario, m), m), m);
}

/** The scenario with one stress test's shocks applied (the discount rate is left alone). */
export function shockScenario(scenario: Scenario, test: StressTest): Scenario {
  let shocked = scenario;
  if (test.milk !== 1) shocked = scaleMilkPrice(shocked, test.milk);
  if (test.feed !== 1) shocked = scaleFeedCost(shocked, test.feed);
  if (test.capital !== 1) shocked = scaleCapitalCost(shocked, test.capital);
  if (test.ratePoints !== 0) shocked = { ...shocked, finance: { ...shocked.finance, interestRate: shocked.finance.interestRate + test.ratePoints } };
  return shocked;
}

/**
 * One option as the stress table re-evaluates it: its plan, its milk model at the herd's
 * lying-time response, its year-0 flow, its yearly lines and its steady lines (no shock here moves them).
 */
export interface StressOption {
  option: Option;
  plan: OptionPlan;
  milk: MilkAtResponse;
  yearZero: number;
  lines: readonly YearLine[];
  steady: SteadyLines;
}

/** Cash for debt service per year and NPV (currency) of one option under a shocked scenario. */
function underShock(
  shocked: Scenario,
  test: StressTest,
  entry: StressOption,
  index: number,
  plans: Map<string, OptionPlan>,
): { cash: number[]; net: number[]; plan: OptionPlan; npv: number } {
  let { plan, yearZero } = entry;
  let model = entry.milk.model;
  const option = shocked.options[index] ?? entry.option;
  // Interest and capital change the plan (loan, depreciation); capital also the maintenance inside the margin.
  const buysCapital = entry.plan.capitalTotal > 0;
  if (buysCapital && (test.ratePoints !== 0 || test.capital !== 1)) {
    // The plan does not depend on the milk price: shocks with the same rate and capital share it;
    // a rate alone moves only the loan, capital not the herd, sizing or storage.
    const key = `${index}|${test.ratePoints}|${test.capital}`;
    plan = plans.get(key) ?? (test.capital === 1 ? withFinanceTerms(plan, shocked.finance) : planOption(shocked, option, 'fast', entry.steady.basis).plan);
    plans.set(key, plan);
  }
  if (buysCapital && test.capital !== 1) ({ model, yearZero } = withCapitalOf(shocked, option, plan, entry.lines, model));
  // Feed per cow and per extra kg of milk are linear in the feed prices.
  if (test.feed !== 1) model = { ...model, feedPerCow: model.feedPerCow * test.feed, marginalFeedCostPerKg: model.marginalFeedCostPerKg * test.feed };
  const { finance, herd } = shocked;
  const response = herd.lyingResponseKgPerHour;
  const milk = model === entry.milk.model && response === entry.milk.response ? entry.milk : milkAtResponse(model, plan.horizon, response);
  const cash = new Array<number>(plan.horizon + 1);
  const net = new Array<number>(plan.horizon + 1);
  flowsAtPrice(milk, plan, finance, yearZero, herd.milkPricePerKg, net, cash);
  return { cash, net, plan, npv: presentValue(finance.discountRate, net) };
}

/**
 * The lender's stress table, per option (index = option) and shock (STRESS_TESTS order): the
 * scenario, with the existing farm's figure anchored at its own prices, shocked and evaluated
 * again. Each option is re-evaluated from its milk model (milk, feed and tax unrounded, as the
 * break-even searches), re-planned when the interest rate or the capital moves and, when the
 * capital moves, with the maintenance on the new capital in its margins (year-ledger.ts
 * withCapitalOf), so the figures agree with a full evaluation of the shocked scenario within the
 * cents of rounding.
 */
export function stressTables(anchored: Scenario, farm: ExistingFarm, entries: readonly StressOption[], currentIndex: number): StressResult[][] {
  return stressRuns(anchored, farm, entries, currentIndex).tables;
}

/** The stress table's shocks year by year, per option (index = option) and shock (STRESS_TESTS order); see stressTables. */
export function stressYears(anchored: Scenario, farm: ExistingFarm, entries: readonly StressOption[], currentIndex: number): StressYears[][] {
  return stressRuns(anchored, farm, entries, currentIndex, true).years;
}

function stressRuns(
  anchored: Scenario,
  farm: ExistingFarm,
  entries: readonly StressOption[],
  currentIndex: number,
  withYears = false,
): { tables: StressResult[][]; years: StressYears[][] } {
  const threshold = anchored.finance.coverageThreshold;
  const tables = entries.map((): StressResult[] => []);
  const years = entries.map((): StressYears[] => []);
  const plans = new Map<string, OptionPlan>();
  for (const test of STRESS_TESTS) {
    const shocked = shockScenario(anchored, test);
    const runs = entries.map((entry, index) => underShock(shocked, test, entry, index, plans));
    const current = runs[currentIndex];
    if (!current) continue;
    runs.forEach((run, index) => {
      const isCurrent = index === currentIndex;
      const sides = { ownCash: run.cash, ownPlan: run.plan, currentCash: current.cash, currentPlan: current.plan, isCurrent };
      const summary = coverageSummary(farm, sides, run.plan.horizon, threshold);
      tables[index]?.push({
        id: test.id,
        label: test.label,
        lowestCoverage: summary.minCoverage,
        lowestProjectCoverage: summary.minProjectCoverage,
        npvAgainstCurrent: isCurrent ? null : run.npv - current.npv,
        yearsBelowThreshold: summary.yearsBelowThreshold,
      });
      if (withYears) {
        const horizon = run.plan.horizon;
        const wholeFarmCash = run.cash.map((cash, t) => (t === 0 ? 0 : farm.cashBesideHerd + cash));
        const wholeFarmDebt = run.cash.map((_, t) => (t === 0 ? 0 : (farm.debtByYear[t] ?? 0) + loanDueIn(run.plan, t)));
        const changeFlows = isCurrent ? null : run.net.slice(0, horizon + 1).map((flow, t) => flow - (current.net[t] ?? 0));
        years[index]?.push({ id: test.id, changeFlows, wholeFarmCash, wholeFarmDebt });
      }
    });
  }
  return { tables, years };
}

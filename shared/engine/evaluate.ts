import type { Option, Scenario } from '../schema';
import { roundCentsFast } from './cents';
import { lowestByYear } from './coverage';
import { breakEvenMilkPriceForCoverage } from './coverage-break-even';
import { coverageInYear, coverageSummary, existingFarmOf, withExistingCashAnchored, type CoverageSides, type ExistingFarm } from './farm-coverage';
import { operationsPayback } from './operations-payback';
import { sourcesAndUses } from './sources-and-uses';
import { stressTables, stressYears, type StressYears } from './stress';
import { presentValue } from './discounting';
import { expansionSplitFlows, type SplitSide } from './expansion-split';
import { discount, equivalentAnnualCost, mirr, paybackYears } from './finance';
import { milkAtResponse, milkingLyingHours, npvAtMilk, npvAtPrice, planOption, planOptionsFast, projectOption, type MilkAtResponse, type MilkModel, type OptionPlan, type Projection } from './projection';
import type { CoreOptionResult, CoreScenarioResults, CoverageYear, DecisionFigures, ExpansionSplit, FastOptionResult, IncrementalResult, Metrics, ScenarioResults } from './results';
import { irrFast } from './irr-fast';
import { findRoot } from './root';
import { housingWork } from './housing-work';
import { steadyLines, type SteadyLines } from './steady-lines';
import { checkStallDimensions, checkWater } from './sizing';
import { scenarioWarnings } from './warnings';

/** The current option (the schema guarantees exactly one; the first option otherwise). */
export function currentOptionOf(scenario: Scenario): Option {
  const current = scenario.options.find((option) => option.current) ?? scenario.options[0];
  if (!current) throw new RangeError('options must hold at least one option');
  return current;
}

/** Which series the metrics describe: an option's own flows, or its flows minus the current option's. */
export type Series = 'option' | 'incremental';

/**
 * Investment metrics of a cash-flow series (flows[0] at t = 0; numpy / `financial` npv
 * convention); rates per year as fractions. On an incremental series whose year 0 is not an
 * outlay (flows[0] ≥ 0: the option saves capital against the current one) there is nothing to
 * pay back, so both paybacks are null with 'no-net-investment' rather than 0.
 */
export function metricsOf(cashFlows: number[], discountRate: number, financeRate: number, series: Series = 'option'): Metrics {
  const irrResult = irrFast(cashFlows);
  // finance.ts discount: the present values npv, discounted payback and the index share.
  const presentValues = discount(discountRate, cashFlows);
  let presentValue = 0;
  for (const pv of presentValues) presentValue += pv;
  const outlay = cashFlows[0] ?? 0;
  const noOutlay = series === 'incremental' && outlay >= 0;
  const payback = noOutlay ? null : paybackYears(cashFlows);
  const discountedPayback = noOutlay ? null : paybackYears(presentValues);
  const paybackReason = noOutlay ? 'no-net-investment' : 'not-within-horizon';
  return {
    cashFlows,
    npv: presentValue,
    irr: irrResult.value,
    ...(irrResult.value === null ? { irrReason: irrResult.reason } : { irrKind: firstNonZero(cashFlows) > 0 ? 'borrowing' : 'investment' }),
    mirr: finiteOrNull(mirr(cashFlows, financeRate, discountRate)),
    paybackYears: payback,
    ...(payback === null ? { paybackReason } : {}),
    discountedPaybackYears: discountedPayback,
    ...(discountedPayback === null ? { discountedPaybackReason: paybackReason } : {}),
    // finance.ts profitabilityIndex from the present value above: PV of flows[1..] ÷ the year-0 outlay.
    profitabilityIndex: outlay < 0 ? finiteOrNull((presentValue - outlay) / -outlay) : null,
  };
}

function firstNonZero(flows: readonly number[]): number {
  return flows.find((cf) => cf !== 0) ?? 0;
}

function finiteOrNull(value: number | null): number | null {
  return value !== null && Number.isFinite(value) ? value : null;
}

/** Coverage per year 1..H: project (incremental) and whole-farm; see farm-coverage.ts coverageInYear. */
function coverageOf(farm: ExistingFarm, sides: CoverageSides, horizon: number): CoverageYear[] {
  const years: CoverageYear[] = [];
  for (let t = 1; t <= horizon; t++) years.push({ year: t, ...coverageInYear(farm, sides, t) });
  return years;
}

/**
 * Equivalent annual cost of the capital per stall (currency per stall per year): the present
 * value (the engine's one discounting rule) of the capital at year 0, the replacements and the
 * salvage given back at H, × the capital recovery factor at the discount rate over H ÷ stalls.
 */
function equivalentAnnualCostPerStall(plan: OptionPlan, discountRate: number): number | null {
  if (plan.stalls <= 0) return null;
  const capitalFlows = new Array<number>(plan.horizon + 1);
  capitalFlows[0] = plan.capitalTotal;
  for (let t = 1; t <= plan.horizon; t++) capitalFlows[t] = plan.replacementsByYear[t] ?? 0;
  capitalFlows[plan.horizon] = (capitalFlows[plan.horizon] ?? 0) - plan.salvage;
  return roundCentsFast(equivalentAnnualCost(presentValue(discountRate, capitalFlows), discountRate, plan.horizon) / plan.stalls);
}

// The searches cover 0..10× today's milk price (at least 0..1 a kg) and 0..5 kg/cow/day per hour
// (the schema's range for g).
const MILK_PRICE_SEARCH_MULTIPLE = 10;
const MILK_PRICE_SEARCH_FLOOR = 1;
const LYING_RESPONSE_SEARCH_MAX = 5;

/** Upper end of the milk-price searches (currency per kg). */
function milkPriceSearchMax(scenario: Scenario): number {
  return Math.max(scenario.herd.milkPricePerKg * MILK_PRICE_SEARCH_MULTIPLE, MILK_PRICE_SEARCH_FLOOR);
}

type BreakEvens = Pick<IncrementalResult, 'breakEvenMilkPrice' | 'breakEvenMilkPriceReason' | 'breakEvenLyingResponse' | 'breakEvenLyingResponseReason'>;

/** One option as the break-even searches see it: its plan, its milk model (also at the herd's lying-time response) and its year-0 flow. */
interface SearchInput {
  plan: OptionPlan;
  model: MilkModel;
  milk: MilkAtResponse;
  yearZero: number;
}

/**
 * Break-even milk price and lying-time response against the current option: Brent's method on
 * the incremental NPV with milk, feed and tax unrounded (a smooth function of the price and the
 * response; at the roots the ledger's cents move NPV by cents at most), each evaluation a single
 * pass over the years of both milk models.
 */
function breakEvens(scenario: Scenario, option: SearchInput, current: SearchInput, sameLyingTime: boolean): BreakEvens {
  const { finance, herd } = scenario;
  const flows = new Array<number>(option.plan.horizon + 1);
  const npvAt = (input: SearchInput, price: number): number => npvAtPrice(input.milk, input.plan, finance, input.yearZero, price, flows);
  const priceHi = milkPriceSearchMax(scenario);
  const price = findRoot((p) => npvAt(option, p) - npvAt(current, p), 0, priceHi, { tolerance: priceHi * 1e-10 });
  const result: BreakEvens = {
    breakEvenMilkPrice: price.value,
    ...(price.value === null ? { breakEvenMilkPriceReason: 'none-in-range' as const } : {}),
    breakEvenLyingResponse: null,
  };
  if (sameLyingTime) return { ...result, breakEvenLyingResponseReason: 'same-lying-time' };
  // The current option's yield does not depend on the response (its lying time is the reference).
  const currentNpv = npvAt(current, herd.milkPricePerKg);
  const response = findRoot((r) => npvAtMilk(option.model, option.plan, finance, option.yearZero, herd.milkPricePerKg, r) - currentNpv, 0, LYING_RESPONSE_SEARCH_MAX, { tolerance: 1e-9 });
  return {
    ...result,
    breakEvenLyingResponse: response.value,
    ...(response.value === null ? { breakEvenLyingResponseReason: 'none-in-range' as const } : {}),
  };
}

/** The change's split into housing with today's herd and the expansion, with metrics on each part. */
function splitMetrics(scenario: Scenario, option: SplitSide, current: SplitSide, currentLyingHours: number): ExpansionSplit | null {
  const flows = expansionSplitFlows(scenario, option, current, currentLyingHours);
  if (!flows) return null;
  const { discountRate, interestRate } = scenario.finance;
  return {
    housingTodaysHerd: metricsOf(flows.housingTodaysHerd, discountRate, interestRate, 'incremental'),
    expansion: metricsOf(flows.expansion, discountRate, interestRate, 'incremental'),
  };
}

/** What the decision figures re-use from an evaluation: the anchored farm, each option's plan and milk model. */
interface Evaluated {
  results: CoreScenarioResults;
  farm: ExistingFarm;
  baseCash: number[];
  entries: { option: Option; plan: OptionPlan; steady: SteadyLines; projection: Projection; search: SearchInput }[];
  currentIndex: number;
}

/**
 * Every option's figures but the decision figures (see evaluateScenario): yearly lines, loan
 * schedule, metrics, coverage and, for each option but the current one, the incremental block.
 */
function evaluateParts(scenario: Scenario): Evaluated {
  const current = currentOptionOf(scenario);
  const { discountRate, interestRate, coverageThreshold } = scenario.finance;
  const currentLying = milkingLyingHours(scenario.herd, current);
  const evaluated = scenario.options.map((option) => {
    const { plan, loan } = planOption(scenario, option, 'ledger');
    // Built here (as projectOption would) so the capital shock re-projects without rebuilding them.
    const steady = steadyLines(scenario, option, plan, housingWork(option, plan));
    const projection = projectOption(scenario, option, plan, currentLying, true, true, steady);
    // withMilkModel = true always returns the model.
    const model = projection.milk as MilkModel;
    const search: SearchInput = { plan, model, milk: milkAtResponse(model, plan.horizon, scenario.herd.lyingResponseKgPerHour), yearZero: projection.cashFlows[0] ?? 0 };
    return { option, plan, loan, steady, projection, search };
  });
  const base = evaluated.find((entry) => entry.option === current) ?? evaluated[0];
  if (!base) throw new RangeError('options must hold at least one option');
  const farm = existingFarmOf(scenario, base.projection.cashForDebtService);
  const baseLines = base.projection.lines ?? [];
  const baseFeedYear1 = baseLines[1]?.feed ?? 0;

  const options = evaluated.map(({ option, plan, loan, projection, search }): CoreOptionResult => {
    const isCurrent = option === current;
    const lines = projection.lines ?? [];
    const sides: CoverageSides = { ownCash: projection.cashForDebtService, ownPlan: plan, currentCash: base.projection.cashForDebtService, currentPlan: base.plan, isCurrent };
    const coverage = coverageOf(farm, sides, plan.horizon);
    const result: CoreOptionResult = {
      id: option.id,
      name: option.name,
      current: isCurrent,
      incremental: null,
      ...metricsOf(projection.cashFlows, discountRate, interestRate),
      stalls: plan.stalls,
      capitalTotal: roundCentsFast(plan.capitalTotal),
      capitalPerStall: plan.stalls > 0 ? roundCentsFast(plan.capitalTotal / plan.stalls) : null,
      equivalentAnnualCostPerStall: equivalentAnnualCostPerStall(plan, discountRate),
      financing: { grants: roundCentsFast(plan.grants), equity: roundCentsFast(plan.equity), loanAmount: roundCentsFast(plan.loanAmount) },
      years: lines,
      financedCashFlows: lines.map((line) => line.financedCashFlow),
      loan: { amount: roundCentsFast(plan.loanAmount), ...(loan ?? { payments: [], years: [], totalInterest: 0, totalPrincipal: 0 }) },
      coverage,
      lowestCoverage: lowestByYear(coverage.map((c) => ({ year: c.year, value: c.wholeFarm }))),
      lowestProjectCoverage: lowestByYear(coverage.map((c) => ({ year: c.year, value: c.project }))),
      yearsBelowCoverageThreshold: coverage.filter((c) => c.wholeFarm !== null && c.wholeFarm < coverageThreshold).map((c) => c.year),
      sourcesAndUses: sourcesAndUses(option, plan, scenario.finance, isCurrent ? 0 : (lines[1]?.feed ?? 0) - baseFeedYear1),
      labourHoursPerYear: lines.map((line) => line.labourHours.total),
      beddingTonnesPerYear: lines.map((line) => line.beddingTonnes),
      manureFertiliserValuePerYear: lines.map((line) => line.manureValue),
      sizing: {
        designCows: plan.designCows,
        stalls: plan.stalls,
        stallCheck: checkStallDimensions(option.stallDimensions, scenario.herd.breedSize),
        waterCheck: checkWater(plan.designCows, option.water.troughs, option.water.troughPerimeterM, option.water.fillRateLitresPerMinute),
        manureStorageM3: plan.storageM3,
      },
    };
    if (!isCurrent) {
      const flows = projection.cashFlows.map((cf, t) => roundCentsFast(cf - (base.projection.cashFlows[t] ?? 0)));
      const sameLyingTime = milkingLyingHours(scenario.herd, option) === currentLying;
      result.incremental = {
        ...metricsOf(flows, discountRate, interestRate, 'incremental'),
        ...operationsPayback(lines, baseLines),
        ...breakEvens(scenario, search, base.search, sameLyingTime),
        split: splitMetrics(scenario, { option, plan, cashFlows: projection.cashFlows }, { option: current, plan: base.plan, cashFlows: base.projection.cashFlows }, currentLying),
      };
    }
    return result;
  });
  const results: CoreScenarioResults = {
    horizonYears: scenario.horizonYears,
    currency: scenario.currency,
    currentOptionId: current.id,
    currentOptionCarriesCapital: base.plan.capitalTotal > 0,
    existingFarm: {
      herdMarginInExistingCash: roundCentsFast(scenario.herd.existingCashForDebtServicePerYear - farm.cashBesideHerd),
      cashForDebtServiceByYear: base.projection.cashForDebtService.map((cash, t) => (t === 0 ? 0 : roundCentsFast(farm.cashBesideHerd + cash))),
      debtPaymentsByYear: farm.debtByYear,
    },
    options,
    warnings: scenarioWarnings(scenario),
  };
  return { results, farm, baseCash: base.projection.cashForDebtService, entries: evaluated, currentIndex: evaluated.indexOf(base) };
}

/**
 * The figures that answer "what does building change", for every screen that does not show the
 * lender's stress: every option's yearly lines, loan, metrics, coverage and the incremental block
 * against the current option with its break-even milk price and lying-time response. Leaves out
 * the stress table and the coverage break-evens (`evaluateScenario` adds them), so summaries and
 * other repeated evaluations do not pay for six shocked re-evaluations and two root searches per option.
 */
export function evaluateCore(scenario: Scenario): CoreScenarioResults {
  return evaluateParts(scenario).results;
}

/** The stress tables' inputs from an evaluation: the scenario anchored at its prices and each option's plan and milk model. */
function stressInputs(scenario: Scenario, parts: Evaluated): Parameters<typeof stressTables> {
  return [
    withExistingCashAnchored(scenario, parts.baseCash),
    parts.farm,
    parts.entries.map(({ option, plan, steady, projection, search }) => ({ option, plan, milk: search.milk, yearZero: search.yearZero, lines: projection.lines ?? [], steady })),
    parts.currentIndex,
  ];
}

/** The stress table and the coverage break-evens of each option (index = option), from an evaluation's plans and milk models. */
function decisionFiguresOf(scenario: Scenario, parts: Evaluated): DecisionFigures[] {
  const { farm, entries } = parts;
  const stress = stressTables(...stressInputs(scenario, parts));
  const priceHi = milkPriceSearchMax(scenario);
  return entries.map(({ plan, search }, index) => ({
    stress: stress[index] ?? [],
    breakEvenMilkPriceForCoverage: breakEvenMilkPriceForCoverage(scenario, farm, search.milk, plan, priceHi),
  }));
}

/**
 * Evaluates every option of a valid scenario (currency of the scenario, nominal, money in cents):
 * `evaluateCore`'s figures (yearly lines, loan schedule, metrics on the project cash flow with
 * year 0 = grants − capital − cows bought for year 1, coverage, the incremental block) plus the
 * decision figures a lender reads: the stress table and the milk prices at which whole-farm
 * coverage is 1.0 and the threshold. The CLI, the server's scenario views, the workbook and the
 * live preview use this.
 */
export function evaluateScenario(scenario: Scenario): ScenarioResults {
  const parts = evaluateParts(scenario);
  const figures = decisionFiguresOf(scenario, parts);
  return {
    ...parts.results,
    options: parts.results.options.map((option, index) => ({ ...option, ...(figures[index] as DecisionFigures) })),
  };
}

/**
 * The stress table's shocks year by year for each option (index = option; STRESS_TESTS order):
 * the change's flows and the whole-farm cash and debt service that the workbook's live stress
 * formulas discount and divide. Their NPV and lowest ratio are `evaluateScenario`'s stress rows.
 */
export function evaluateStressYears(scenario: Scenario): StressYears[][] {
  return stressYears(...stressInputs(scenario, evaluateParts(scenario)));
}

export interface FastEvaluationOptions {
  /** Also solve the incremental IRR (slower when the incremental flows change sign several times). */
  incrementalIrr?: boolean;
  /**
   * Where each option's IRR search starts (fraction per year, index = option), e.g. the IRRs of
   * the unperturbed scenario for a Monte Carlo draw; null or absent = 10 %. Only speed depends on it.
   */
  irrStart?: readonly (number | null)[];
  /**
   * Each option's steady lines (index = option), when the scenario moves none of them nor the
   * herd, housing or general inflation (see {@link steadyLinesOf}); absent = built here. Their
   * plan also gives each option's herd and sizing, and its capital and loan when those are unmoved.
   */
  steadyLines?: readonly (SteadyLines | null)[];
}

/**
 * Fast path for Monte Carlo and sensitivity: NPV, incremental NPV against the current option,
 * IRR and lowest coverage per option, in floating point without decimal.js or yearly detail.
 * Cents are rounded as in the ledger, so results agree with evaluateScenario to the cent.
 */
export function evaluateNpvOnly(scenario: Scenario, settings: FastEvaluationOptions = {}): FastOptionResult[] {
  const current = currentOptionOf(scenario);
  const { discountRate } = scenario.finance;
  const currentLying = milkingLyingHours(scenario.herd, current);
  const plans = planOptionsFast(scenario, settings.steadyLines?.map((steady) => steady?.basis));
  const runs = scenario.options.map((option, index) => {
    const steady = settings.steadyLines?.[index] ?? null;
    const plan = plans[index] as OptionPlan;
    return { option, plan, projection: projectOption(scenario, option, plan, currentLying, false, false, steady) };
  });
  const base = runs.find((run) => run.option === current) ?? runs[0];
  if (!base) return [];
  const baseNpv = presentValue(discountRate, base.projection.cashFlows);
  const farm = existingFarmOf(scenario, base.projection.cashForDebtService);
  return runs.map(({ option, plan, projection }, index) => {
    const isCurrent = option === current;
    const flows = projection.cashFlows;
    const optionNpv = flows === base.projection.cashFlows ? baseNpv : presentValue(discountRate, flows);
    const sides: CoverageSides = { ownCash: projection.cashForDebtService, ownPlan: plan, currentCash: base.projection.cashForDebtService, currentPlan: base.plan, isCurrent };
    const { minCoverage, minProjectCoverage, yearsBelowThreshold } = coverageSummary(farm, sides, plan.horizon, scenario.finance.coverageThreshold);
    let incrementalIrr: number | null = null;
    if (settings.incrementalIrr && !isCurrent) {
      incrementalIrr = irrFast(flows.map((cf, t) => roundCentsFast(cf - (base.projection.cashFlows[t] ?? 0)))).value;
    }
    return {
      id: option.id,
      npv: optionNpv,
      incrementalNpv: isCurrent ? null : optionNpv - baseNpv,
      irr: irrFast(flows, settings.irrStart?.[index] ?? undefined).value,
      incrementalIrr,
      minCoverage,
      minProjectCoverage,
      yearsBelowThreshold,
    };
  });
}

/** Each option's steady lines (index = option), to reuse across shocked copies that move none of them. */
export function steadyLinesOf(scenario: Scenario): SteadyLines[] {
  return scenario.options.map((option) => {
    const { plan } = planOption(scenario, option, 'fast');
    return steadyLines(scenario, option, plan, housingWork(option, plan));
  });
}

/**
 * The scenario ready to be shocked (sensitivity, Monte Carlo): the herd margin inside the
 * existing farm cash written in at these prices, so every shocked copy moves the existing
 * farm's cash with the current option's margin instead of holding it flat.
 */
export function anchoredForShocks(scenario: Scenario): Scenario {
  if (scenario.herd.existingCashHerdMarginPerYear !== null) return scenario;
  const current = currentOptionOf(scenario);
  const { plan } = planOption(scenario, current, 'fast');
  return withExistingCashAnchored(scenario, projectOption(scenario, current, plan, milkingLyingHours(scenario.herd, current), false).cashForDebtService);
}

import type { Herd, Scenario } from '../schema';
import { coverageRatio, somethingDue } from './coverage';
import type { OptionPlan } from './projection';

/**
 * The existing farm as whole-farm coverage sees it (currency per year, nominal):
 * - `cashBesideHerd`: existing farm cash − the herd margin it includes, so that the existing
 *   farm's cash in year t = cashBesideHerd + the current option's cash for debt service in year t
 *   (it moves with milk, feed, wages and inputs at the same prices as every option);
 * - `debtByYear`: existing debt payments per year, index = year, [0] = 0: the payments running
 *   through the horizon plus each listed loan up to its last year.
 */
export interface ExistingFarm {
  cashBesideHerd: number;
  debtByYear: number[];
}

/** Existing debt payments per year (currency), index = year: running payments + listed loans until their last year. */
export function existingDebtByYear(herd: Herd, horizon: number): number[] {
  const byYear = new Array<number>(horizon + 1).fill(0);
  for (let t = 1; t <= horizon; t++) {
    let due = herd.existingDebtPaymentsPerYear;
    for (const loan of herd.existingLoans) if (t <= loan.lastYear) due += loan.paymentPerYear;
    byYear[t] = due;
  }
  return byYear;
}

/**
 * The herd margin the existing farm cash figure includes (currency per year): the entered one,
 * else the current option's year-1 cash for debt service (so in year 1 of the base case the
 * existing farm's cash is exactly the figure entered).
 */
export function herdMarginInExistingCash(herd: Herd, currentCashForDebtService: readonly number[]): number {
  return herd.existingCashHerdMarginPerYear ?? currentCashForDebtService[1] ?? 0;
}

/** The existing farm of a scenario, given the current option's cash for debt service per year. */
export function existingFarmOf(scenario: Scenario, currentCashForDebtService: readonly number[]): ExistingFarm {
  const { herd } = scenario;
  return {
    cashBesideHerd: herd.existingCashForDebtServicePerYear - herdMarginInExistingCash(herd, currentCashForDebtService),
    debtByYear: existingDebtByYear(herd, scenario.horizonYears),
  };
}

/** Debt service of an option's loan in year t (currency): interest + principal. */
export function loanDueIn(plan: OptionPlan, t: number): number {
  return (plan.interestByYear[t] as number) + (plan.principalByYear[t] as number);
}

/** One option's cash for debt service and loan, and the current option's, as the ratios need them. */
export interface CoverageSides {
  ownCash: readonly number[];
  ownPlan: OptionPlan;
  currentCash: readonly number[];
  currentPlan: OptionPlan;
  isCurrent: boolean;
}

/**
 * Coverage ratios of year t (FFSC definition, cash available for debt service ÷ scheduled P + I):
 * - whole farm = (existing farm cash in year t + the change in cash against the current option)
 *   ÷ (existing debt payments in year t + this option's loan), i.e. (cashBesideHerd + this
 *   option's cash) ÷ (existing debt + this option's loan): each option replaces the current one,
 *   so a current option carrying new capital counts its own loan and its own margin;
 * - project = the change in cash ÷ the change in debt service (this option's loan − the
 *   current option's); null for the current option and when the change borrows nothing more.
 */
export function coverageInYear(farm: ExistingFarm, sides: CoverageSides, t: number): { project: number | null; wholeFarm: number | null } {
  const wholeFarm = coverageRatio(wholeFarmCash(farm, sides, t), wholeFarmDue(farm, sides, t));
  if (sides.isCurrent) return { project: null, wholeFarm };
  return { project: coverageRatio(changeInCash(sides, t), changeInDue(sides, t)), wholeFarm };
}

// The two ratios' numerators and denominators in year t (currency), as coverageInYear defines them.
const wholeFarmCash = (farm: ExistingFarm, sides: CoverageSides, t: number): number => farm.cashBesideHerd + (sides.ownCash[t] as number);
const wholeFarmDue = (farm: ExistingFarm, sides: CoverageSides, t: number): number => (farm.debtByYear[t] as number) + loanDueIn(sides.ownPlan, t);
const changeInCash = (sides: CoverageSides, t: number): number => (sides.ownCash[t] as number) - (sides.currentCash[t] as number);
const changeInDue = (sides: CoverageSides, t: number): number => loanDueIn(sides.ownPlan, t) - loanDueIn(sides.currentPlan, t);

/** Lowest whole-farm and project coverage over years 1..H and the count of years below the threshold. */
export interface CoverageSummary {
  minCoverage: number | null;
  minProjectCoverage: number | null;
  yearsBelowThreshold: number;
}

/** The summary of {@link coverageInYear} over the horizon, without per-year objects (the fast path). */
export function coverageSummary(farm: ExistingFarm, sides: CoverageSides, horizon: number, threshold: number): CoverageSummary {
  let minCoverage: number | null = null;
  let minProjectCoverage: number | null = null;
  let yearsBelowThreshold = 0;
  // coverageInYear's ratios without a record or a nullable number per year (this runs for every
  // option of every Monte Carlo draw): the lowest so far is NaN until a year defines one.
  let lowest = Number.NaN;
  let lowestProject = Number.NaN;
  for (let t = 1; t <= horizon; t++) {
    const due = wholeFarmDue(farm, sides, t);
    if (somethingDue(due)) {
      const wholeFarm = wholeFarmCash(farm, sides, t) / due;
      if (!(wholeFarm >= lowest)) lowest = wholeFarm;
      if (wholeFarm < threshold) yearsBelowThreshold += 1;
    }
    if (sides.isCurrent) continue;
    const changeDue = changeInDue(sides, t);
    if (somethingDue(changeDue)) {
      const project = changeInCash(sides, t) / changeDue;
      if (!(project >= lowestProject)) lowestProject = project;
    }
  }
  if (!Number.isNaN(lowest)) minCoverage = lowest;
  if (!Number.isNaN(lowestProject)) minProjectCoverage = lowestProject;
  return { minCoverage, minProjectCoverage, yearsBelowThreshold };
}

/**
 * The scenario with the herd margin inside the existing farm cash written in (its current
 * option's year-1 cash for debt service when not entered), so that a shocked copy of it keeps
 * the existing farm's figure measured at these prices and the farm takes the shock too.
 */
export function withExistingCashAnchored(scenario: Scenario, currentCashForDebtService: readonly number[]): Scenario {
  if (scenario.herd.existingCashHerdMarginPerYear !== null) return scenario;
  const margin = herdMarginInExistingCash(scenario.herd, currentCashForDebtService);
  return { ...scenario, herd: { ...scenario.herd, existingCashHerdMarginPerYear: margin } };
}

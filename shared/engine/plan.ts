/**
 * An option's plan: what does not change with prices — herd per year, stalls, storage, capital,
 * replacements, salvage, tax depreciation and the loan.
 */
import type { CapitalLine, Option, Scenario } from '../schema';
import { beddingToStorageM3PerYear, beddingTonnesPerYear } from './bedding';
import { capitalAssets, capitalTotal, purchaseSchedule, replacementsByYear, salvageAtHorizon, type CapitalAsset } from './capital';
import { decliningBalanceFast, loanScheduleFast, loanYearsFast, loanYearsSideBySide, macrsFast, roundCentsFast, straightLineFast, type LoanYearsFast } from './cents';
import { interestDuringConstruction } from './construction';
import { MACRS_10_YEAR_150DB, MACRS_10_YEAR_200DB, MACRS_20_YEAR_150DB } from './depreciation';
import { effectiveHousedDays, grazingDaysPerYear } from './feed';
import type { LoanSchedule } from './finance';
import { milkCowEquivalents } from './herd-costs';
import { cowsPerYear, herdPurchasesByYear, herdValueAtHorizon } from './herd-size';
import { manureStorageVolumeM3, stallsFor } from './sizing';
import { TaxDepreciationSum, type DepreciationSchedule } from './tax';

/** Everything about an option that does not change with prices: herd, sizing, capital, tax depreciation, loan. */
export interface OptionPlan {
  /** Operating years H (years). */
  horizon: number;
  /** Cows per year (head), index = year, [0] = today's herd. */
  cows: number[];
  /** Cows in milk at the herd's yield per year (cow equivalents): newcomers at the first-lactation factor. */
  milkCows: number[];
  /** The largest herd of the horizon, which sizes stalls and storage (head). */
  designCows: number;
  /** Stalls built (count). */
  stalls: number;
  /** Housed and grazing days per year (days/yr). */
  housedDays: number;
  grazingDays: number;
  /** Manure storage volume sized (m³). */
  storageM3: number;
  assets: CapitalAsset[];
  /** Capital at year 0 (currency). */
  capitalTotal: number;
  /** Replacement purchases per year (currency, index = year). */
  replacementsByYear: number[];
  /** Salvage value at the horizon (currency). */
  salvage: number;
  /** Tax depreciation per year (currency, index = year) and the tax book value left at H (currency). */
  depreciationByYear: number[];
  taxBookValueAtHorizon: number;
  /** Grants and equity at year 0 (currency). */
  grants: number;
  equity: number;
  /** Loan principal (currency), interest during construction included when it is capitalised. */
  loanAmount: number;
  /** Interest during construction (currency, cents), owed at year 0; in loanAmount when capitalised. */
  interestDuringConstruction: number;
  /** Loan interest and principal per year (currency), index = year, [0] = 0. */
  interestByYear: number[];
  principalByYear: number[];
  /** Loan balance still owed at H (currency), repaid in year H in the financed view. */
  loanBalanceAtHorizon: number;
  /** Cows bought (+) or sold (−) per year (currency, index = year; bought at the end of the year before they join). */
  herdPurchasesByYear: number[];
  /** The herd change valued at cull value at H (currency). */
  herdValueAtHorizon: number;
}

/** 'ledger' also builds the loan's payment table (for display); 'fast' only its yearly totals (the same cents). */
export type PlanMode = 'ledger' | 'fast';

/**
 * Manure storage volume (m³) for an option's design herd: manure collected, wash water and
 * bedding per day, rain on the open store, over the storage period, plus freeboard.
 */
export function optionStorageM3(scenario: Scenario, option: Option, designCows: number, stalls: number): number {
  const { herd } = scenario;
  const manureKgPerDay = designCows * herd.manureExcretion.massKgPerCowDay * option.manure.collectionEfficiency;
  const beddingTonnesPerDay = beddingTonnesPerYear(option.bedding.kgPerStallDay, stalls, 1);
  return manureStorageVolumeM3({
    manureM3PerDay: manureKgPerDay / herd.manureDensityKgPerM3,
    washWaterM3PerDay: option.manure.washWaterDiverted ? 0 : option.manure.washWaterM3PerCowDay * designCows,
    beddingM3PerDay: beddingToStorageM3PerYear(beddingTonnesPerDay, option.bedding.shareToManureStorage, option.bedding.bulkDensityTonnesPerM3),
    netRainMPerYear: option.manure.netRainMPerYear,
    openStorageAreaM2: option.manure.openStorageAreaM2,
    storageDays: option.manure.storageDays,
    freeboardM: option.manure.freeboardM,
  });
}

/** Stalls of an option (count): none without beds, else from the largest herd of the horizon and the stocking rate. */
export function optionStalls(option: Option, designCows: number): number {
  return option.bed === 'none' ? 0 : stallsFor(designCows, option.stockingRate);
}

// The float twins give the same cents as the decimal.js schedules in tests/oracles (tests pin them) at a fraction of the cost.
function depreciationSchedule(scenario: Scenario): DepreciationSchedule {
  const { depreciation, decliningBalanceFactor } = scenario.finance;
  if (depreciation === 'declining-balance') return (cost, life) => decliningBalanceFast(cost, life, decliningBalanceFactor);
  return straightLineFast;
}

const MACRS_TABLES = { 'macrs-10-200db': MACRS_10_YEAR_200DB, 'macrs-10-150db': MACRS_10_YEAR_150DB, 'macrs-20-150db': MACRS_20_YEAR_150DB } as const;

/** A capital asset's own tax schedule when its tax class is not its economic life (else none: the scenario's method). */
function taxClassSchedule(asset: CapitalAsset): ((cost: number) => number[]) | undefined {
  if (asset.taxClass === 'economic-life') return undefined;
  if (asset.taxClass === 'straight-line') {
    const life = asset.taxLifeYears;
    return (cost) => straightLineFast(cost, life);
  }
  const { percentages } = MACRS_TABLES[asset.taxClass];
  return (cost) => macrsFast(cost, percentages);
}

/**
 * Loan principal (currency): the override, or capital − equity − grants, floored at 0 and never
 * more than the capital left after grants (an option without capital borrows nothing).
 */
export function loanAmountFor(capital: number, grants: number, equity: number, override: number | null): number {
  const needed = Math.max(0, capital - grants);
  if (override !== null) return Math.min(override, needed);
  return Math.max(0, needed - equity);
}

type LoanLines = Pick<OptionPlan, 'loanAmount' | 'interestDuringConstruction' | 'interestByYear' | 'principalByYear' | 'loanBalanceAtHorizon'>;

/** The loan's principal (currency): the capital's loan, with the interest during construction (cents, owed at year 0) when it is capitalised. */
function loanWithConstruction(capitalLoan: number, finance: Scenario['finance']): { loanAmount: number; constructionInterest: number } {
  // Interest during construction is owed at year 0: added to the loan, or paid from farm cash.
  const constructionInterest = roundCentsFast(interestDuringConstruction(capitalLoan, finance));
  const loanAmount = finance.interestDuringConstruction === 'capitalised' ? capitalLoan + constructionInterest : capitalLoan;
  return { loanAmount, constructionInterest };
}

/** A plan's loan lines from the loan's years (index = loan year − 1): interest and principal per year (index = year), balance at H. */
function loanLinesOf(loan: { loanAmount: number; constructionInterest: number }, loanYears: LoanYearsFast, finance: Scenario['finance'], horizon: number): LoanLines {
  const interestByYear = new Array<number>(horizon + 1).fill(0);
  const principalByYear = new Array<number>(horizon + 1).fill(0);
  // Years past the term owe nothing: read only the loan's own years (a read past an array's end is slow).
  const loanYearsInHorizon = Math.min(horizon, loanYears.interest.length, loanYears.principal.length);
  for (let year = 1; year <= loanYearsInHorizon; year++) {
    interestByYear[year] = loanYears.interest[year - 1] as number;
    principalByYear[year] = loanYears.principal[year - 1] as number;
  }
  const loanBalanceAtHorizon = loan.loanAmount > 0 && finance.termYears > horizon ? (loanYears.closingBalance[horizon - 1] ?? 0) : 0;
  return { loanAmount: loan.loanAmount, interestDuringConstruction: loan.constructionInterest, interestByYear, principalByYear, loanBalanceAtHorizon };
}

/** The loan of a plan at the scenario's finance terms: amount, interest and principal per year (index = year), balance at H. */
function loanPlan(capitalLoan: number, finance: Scenario['finance'], horizon: number, mode: PlanMode): LoanLines & { loan: LoanSchedule | null } {
  const withConstruction = loanWithConstruction(capitalLoan, finance);
  const { loanAmount } = withConstruction;
  if (mode === 'fast') {
    const loanYears = loanYearsFast(loanAmount, finance.interestRate, finance.termYears, finance.paymentsPerYear, finance.interestOnlyMonths);
    return { ...loanLinesOf(withConstruction, loanYears, finance, horizon), loan: null };
  }
  const loan = loanScheduleFast({
    principal: loanAmount,
    annualRate: finance.interestRate,
    years: finance.termYears,
    paymentsPerYear: finance.paymentsPerYear,
    interestOnlyMonths: finance.interestOnlyMonths,
  });
  const loanYears: LoanYearsFast = {
    interest: loan.years.map((y) => y.interest),
    principal: loan.years.map((y) => y.principal),
    closingBalance: loan.years.map((y) => y.closingBalance),
  };
  return { ...loanLinesOf(withConstruction, loanYears, finance, horizon), loan };
}

/**
 * The plan with its loan at other finance terms (e.g. a shocked interest rate): capital, tax
 * depreciation, herd and salvage do not depend on the loan, so only the loan lines are rebuilt
 * (yearly totals, as mode 'fast').
 */
export function withFinanceTerms(plan: OptionPlan, finance: Scenario['finance']): OptionPlan {
  const capitalLoan = loanAmountFor(plan.capitalTotal, plan.grants, finance.equity, finance.loanAmount);
  const { loan: _schedule, ...loanLines } = loanPlan(capitalLoan, finance, plan.horizon, 'fast');
  return { ...plan, ...loanLines };
}

/**
 * A plan already built for the same herd, housing and general inflation (a Monte Carlo run's
 * unperturbed plan), with the capital lines and finance terms it was built on: a draw that moves
 * neither reuses its capital, tax depreciation and loan as they are, and every draw its herd,
 * sizing and storage.
 */
export interface PlanBasis {
  plan: OptionPlan;
  capitalLines: readonly CapitalLine[];
  finance: Scenario['finance'];
}

/** The plan's herd, sizing and storage: what follows the herd and the housing alone. */
type HerdPlan = Pick<OptionPlan, 'horizon' | 'cows' | 'milkCows' | 'designCows' | 'stalls' | 'housedDays' | 'grazingDays' | 'storageM3' | 'herdPurchasesByYear' | 'herdValueAtHorizon'>;

function herdPlan(scenario: Scenario, option: Option): HerdPlan {
  const { herd } = scenario;
  const horizon = scenario.horizonYears;
  const inflation = herd.growth.general;
  const cows = cowsPerYear(herd.cows, option.herdChange, horizon);
  let designCows = 0;
  for (let year = 1; year <= horizon; year++) designCows = Math.max(designCows, cows[year] ?? 0);
  const stalls = optionStalls(option, designCows);
  const addedCowCost = option.herdChange.addedCowCost ?? herd.replacementHeiferCost;
  const housedDays = effectiveHousedDays(option.housedDaysPerYear);
  return {
    horizon,
    cows,
    milkCows: milkCowEquivalents(cows, herd.firstLactationYieldFactor),
    designCows,
    stalls,
    housedDays,
    grazingDays: grazingDaysPerYear(housedDays),
    storageM3: optionStorageM3(scenario, option, designCows, stalls),
    herdPurchasesByYear: herdPurchasesByYear(cows, addedCowCost, herd.cullCowValue, inflation),
    herdValueAtHorizon: herdValueAtHorizon(cows, herd.cullCowValue, inflation),
  };
}

/** The plan's capital: assets, replacements, salvage, grants and tax depreciation. */
type CapitalPlan = Pick<OptionPlan, 'assets' | 'capitalTotal' | 'replacementsByYear' | 'salvage' | 'depreciationByYear' | 'taxBookValueAtHorizon' | 'grants'>;

function capitalPlan(scenario: Scenario, option: Option, sized: HerdPlan): CapitalPlan {
  const { finance } = scenario;
  const { horizon } = sized;
  const assets = capitalAssets(option.capitalLines, { stalls: sized.stalls, storageM3: sized.storageM3, troughs: option.water.troughs });
  const capital = capitalTotal(assets);
  const purchases = purchaseSchedule(assets, horizon, scenario.herd.growth.general);
  const grants = Math.min(finance.grants, capital);
  // With grants reducing the depreciable base, each year-0 purchase carries its share of them.
  const year0Base = finance.grantsReduceDepreciableBase && capital > 0 ? 1 - grants / capital : 1;
  const schedules = assets.map(taxClassSchedule);
  const tax = new TaxDepreciationSum(horizon, depreciationSchedule(scenario));
  for (const p of purchases) tax.add(p.year, p.year === 0 ? p.cost * year0Base : p.cost, assets[p.asset]?.lifeYears ?? 1, schedules[p.asset]);
  const depreciation = tax.result();
  return {
    assets,
    capitalTotal: capital,
    replacementsByYear: replacementsByYear(purchases, horizon),
    salvage: salvageAtHorizon(assets, purchases, horizon),
    depreciationByYear: depreciation.byYear,
    taxBookValueAtHorizon: depreciation.bookValueAtHorizon,
    grants,
  };
}

/** True when two finance terms give the same grants and tax depreciation on the same capital. */
function sameTaxTerms(a: Scenario['finance'], b: Scenario['finance']): boolean {
  return a === b || (a.grants === b.grants && a.grantsReduceDepreciableBase === b.grantsReduceDepreciableBase && a.depreciation === b.depreciation && a.decliningBalanceFactor === b.decliningBalanceFactor);
}

/** The plan before its loan: herd, sizing, capital, and what the capital leaves to borrow (currency). */
interface UnfinancedPlan {
  sized: HerdPlan;
  capital: CapitalPlan;
  capitalLoan: number;
}

/** The basis's own plan when the option and the finance terms are the ones it was built on (the same inputs, so the same figures). */
function reusedPlan(scenario: Scenario, option: Option, basis: PlanBasis | undefined): OptionPlan | null {
  return basis !== undefined && option.capitalLines === basis.capitalLines && scenario.finance === basis.finance ? basis.plan : null;
}

function unfinancedPlan(scenario: Scenario, option: Option, basis: PlanBasis | undefined): UnfinancedPlan {
  const { finance } = scenario;
  const base = basis?.plan;
  const sized: HerdPlan = base ?? herdPlan(scenario, option);
  const sameCapital = basis !== undefined && option.capitalLines === basis.capitalLines && sameTaxTerms(finance, basis.finance);
  const capital: CapitalPlan = sameCapital && base ? base : capitalPlan(scenario, option, sized);
  return { sized, capital, capitalLoan: loanAmountFor(capital.capitalTotal, capital.grants, finance.equity, finance.loanAmount) };
}

function financedPlan({ sized, capital, capitalLoan }: UnfinancedPlan, loanLines: LoanLines): OptionPlan {
  return {
    horizon: sized.horizon,
    cows: sized.cows,
    milkCows: sized.milkCows,
    designCows: sized.designCows,
    stalls: sized.stalls,
    housedDays: sized.housedDays,
    grazingDays: sized.grazingDays,
    storageM3: sized.storageM3,
    assets: capital.assets,
    capitalTotal: capital.capitalTotal,
    replacementsByYear: capital.replacementsByYear,
    salvage: capital.salvage,
    depreciationByYear: capital.depreciationByYear,
    taxBookValueAtHorizon: capital.taxBookValueAtHorizon,
    grants: capital.grants,
    equity: Math.max(0, capital.capitalTotal - capital.grants - capitalLoan),
    ...loanLines,
    herdPurchasesByYear: sized.herdPurchasesByYear,
    herdValueAtHorizon: sized.herdValueAtHorizon,
  };
}

/**
 * Builds an option's plan; with mode 'ledger' it also returns the loan schedule in exact cents.
 * With a `basis` built for the same herd, housing and inflation it takes the herd, sizing and storage from
 * it, and its capital and loan too when the capital lines (the same list) and the terms they
 * depend on are the basis's own: the same inputs, so the same figures.
 */
export function planOption(scenario: Scenario, option: Option, mode: PlanMode, basis?: PlanBasis): { plan: OptionPlan; loan: LoanSchedule | null } {
  const reused = mode === 'fast' ? reusedPlan(scenario, option, basis) : null;
  if (reused) return { plan: reused, loan: null };
  const unfinanced = unfinancedPlan(scenario, option, basis);
  const { loan, ...loanLines } = loanPlan(unfinanced.capitalLoan, scenario.finance, unfinanced.sized.horizon, mode);
  return { plan: financedPlan(unfinanced, loanLines), loan };
}

/**
 * Every option's plan as planOption 'fast' builds it (index = option, `bases` likewise), the
 * loans walked side by side (cents.ts loanYearsSideBySide): the same figures, in less time
 * than one loan after another (a Monte Carlo draw plans every option).
 */
export function planOptionsFast(scenario: Scenario, bases?: readonly (PlanBasis | undefined)[]): OptionPlan[] {
  const { finance } = scenario;
  const reused = scenario.options.map((option, i) => reusedPlan(scenario, option, bases?.[i]));
  const unfinanced = scenario.options.map((option, i) => (reused[i] ? null : unfinancedPlan(scenario, option, bases?.[i])));
  const loans = unfinanced.map((plan) => (plan ? loanWithConstruction(plan.capitalLoan, finance) : null));
  const walked: number[] = [];
  for (const loan of loans) if (loan) walked.push(loan.loanAmount);
  const years = loanYearsSideBySide(walked, finance.interestRate, finance.termYears, finance.paymentsPerYear, finance.interestOnlyMonths);
  let next = 0;
  return unfinanced.map((plan, i) => {
    const loan = loans[i];
    if (!plan || !loan) return reused[i] as OptionPlan;
    return financedPlan(plan, loanLinesOf(loan, years[next++] as LoanYearsFast, finance, plan.sized.horizon));
  });
}

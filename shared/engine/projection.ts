import type { Option, Scenario } from '../schema';
import { beddingCostPerYear, beddingToStorageM3PerYear, beddingTonnesPerYear } from './bedding';
import {
  capitalAssets,
  capitalTotal,
  maintenanceCostPerYear,
  purchaseSchedule,
  replacementsByYear,
  salvageAtHorizon,
  type CapitalAsset,
} from './capital';
import { decliningBalanceFast, loanScheduleFast, loanYearsFast, macrsFast, roundCentsFast, straightLineFast, type LoanYearsFast } from './cents';
import { interestDuringConstruction } from './construction';
import { MACRS_10_YEAR_150DB, MACRS_10_YEAR_200DB, MACRS_20_YEAR_150DB } from './depreciation';
import { baseFeedCostPerYear, effectiveHousedDays, grazingDaysPerYear, marginalFeedCostPerYear } from './feed';
import type { LoanSchedule } from './finance';
import { cullingCostPerYear, extraCullsPer100Cows, healthCostPerYear } from './health';
import { cowsPerYear, herdPurchasesByYear, herdValueAtHorizon } from './herd-size';
import {
  bedCareHoursPerYear,
  beddingTopUpHoursPerYear,
  grazingHoursPerYear,
  labourCost,
  scrapingHoursPerYear,
  troughHoursPerYear,
} from './labour';
import { collectedManurePerYear, creditedNutrients, creditedValue, cropNeedCap, K_TO_K2O, manureHandlingCostPerYear, P_TO_P2O5, scaleManure, storedVolumeM3PerYear } from './manure';
import { resolvedGrowth } from './growth';
import type { YearLine } from './results';
import { manureStorageVolumeM3, stallsFor } from './sizing';
import { taxableIncome, taxDepreciation, taxForYear, type DepreciationSchedule, type PurchaseForTax } from './tax';
import { cappedLyingHours, lactatingShare, MILK_DAYS_PER_YEAR, milkSoldKgPerYear, rampFraction, stockedLyingHours, yieldPerCowDay } from './yield';

/** Everything about an option that does not change with prices: herd, sizing, capital, tax depreciation, loan. */
export interface OptionPlan {
  horizon: number;
  cows: number[];
  designCows: number;
  stalls: number;
  housedDays: number;
  grazingDays: number;
  storageM3: number;
  assets: CapitalAsset[];
  capitalTotal: number;
  replacementsByYear: number[];
  salvage: number;
  depreciationByYear: number[];
  taxBookValueAtHorizon: number;
  grants: number;
  equity: number;
  /** Loan principal (currency), interest during construction included when it is capitalised. */
  loanAmount: number;
  /** Interest during construction (currency, cents), owed at year 0; in loanAmount when capitalised. */
  interestDuringConstruction: number;
  /** Loan interest and principal per year (currency), index = year, [0] = 0. */
  interestByYear: number[];
  principalByYear: number[];
  loanBalanceAtHorizon: number;
  herdPurchasesByYear: number[];
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

// The float twins give the same cents as depreciation.ts (tests pin them) at a fraction of the cost.
function depreciationSchedule(scenario: Scenario): DepreciationSchedule {
  const { depreciation, decliningBalanceFactor } = scenario.finance;
  if (depreciation === 'declining-balance') return (cost, life) => decliningBalanceFast(cost, life, decliningBalanceFactor);
  return straightLineFast;
}

const MACRS_TABLES = { 'macrs-10-200db': MACRS_10_YEAR_200DB, 'macrs-10-150db': MACRS_10_YEAR_150DB, 'macrs-20-150db': MACRS_20_YEAR_150DB } as const;

/** A capital asset's own tax schedule when its tax class is not its economic life (else none: the scenario's method). */
function taxClassSchedule(asset: CapitalAsset | undefined): Pick<PurchaseForTax, 'schedule'> {
  if (!asset || asset.taxClass === 'economic-life') return {};
  if (asset.taxClass === 'straight-line') {
    const life = asset.taxLifeYears;
    return { schedule: (cost) => straightLineFast(cost, life) };
  }
  const { percentages } = MACRS_TABLES[asset.taxClass];
  return { schedule: (cost) => macrsFast(cost, percentages) };
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

/** The loan of a plan at the scenario's finance terms: amount, interest and principal per year (index = year), balance at H. */
function loanPlan(capitalLoan: number, finance: Scenario['finance'], horizon: number, mode: PlanMode): LoanLines & { loan: LoanSchedule | null } {
  // Interest during construction is owed at year 0: added to the loan, or paid from farm cash.
  const constructionInterest = roundCentsFast(interestDuringConstruction(capitalLoan, finance));
  const loanAmount = finance.interestDuringConstruction === 'capitalised' ? capitalLoan + constructionInterest : capitalLoan;

  const interestByYear = new Array<number>(horizon + 1).fill(0);
  const principalByYear = new Array<number>(horizon + 1).fill(0);
  let loanBalanceAtHorizon = 0;
  let loan: LoanSchedule | null = null;
  const loanInput = {
    principal: loanAmount,
    annualRate: finance.interestRate,
    years: finance.termYears,
    paymentsPerYear: finance.paymentsPerYear,
    interestOnlyMonths: finance.interestOnlyMonths,
  };
  let loanYears: LoanYearsFast;
  if (mode === 'ledger') {
    loan = loanScheduleFast(loanInput);
    loanYears = {
      interest: loan.years.map((y) => y.interest),
      principal: loan.years.map((y) => y.principal),
      closingBalance: loan.years.map((y) => y.closingBalance),
    };
  } else {
    loanYears = loanYearsFast(loanAmount, finance.interestRate, finance.termYears, finance.paymentsPerYear, finance.interestOnlyMonths);
  }
  for (let year = 1; year <= horizon; year++) {
    interestByYear[year] = loanYears.interest[year - 1] ?? 0;
    principalByYear[year] = loanYears.principal[year - 1] ?? 0;
  }
  if (loanAmount > 0 && finance.termYears > horizon) loanBalanceAtHorizon = loanYears.closingBalance[horizon - 1] ?? 0;
  return { loanAmount, interestDuringConstruction: constructionInterest, interestByYear, principalByYear, loanBalanceAtHorizon, loan };
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

/** Builds an option's plan; with mode 'ledger' it also returns the loan schedule in exact cents. */
export function planOption(scenario: Scenario, option: Option, mode: PlanMode): { plan: OptionPlan; loan: LoanSchedule | null } {
  const { herd, finance } = scenario;
  const horizon = scenario.horizonYears;
  const inflation = herd.growth.general;
  const cows = cowsPerYear(herd.cows, option.herdChange, horizon);
  let designCows = 0;
  for (let year = 1; year <= horizon; year++) designCows = Math.max(designCows, cows[year] ?? 0);
  const stalls = optionStalls(option, designCows);
  const storageM3 = optionStorageM3(scenario, option, designCows, stalls);
  const assets = capitalAssets(option.capitalLines, { stalls, storageM3, troughs: option.water.troughs });
  const capital = capitalTotal(assets);
  const purchases = purchaseSchedule(assets, horizon, inflation);
  const grants = Math.min(finance.grants, capital);
  // With grants reducing the depreciable base, each year-0 purchase carries its share of them.
  const year0Base = finance.grantsReduceDepreciableBase && capital > 0 ? 1 - grants / capital : 1;
  const depreciation = taxDepreciation(
    purchases.map((p) => {
      const asset = assets[p.asset];
      return { year: p.year, cost: p.year === 0 ? p.cost * year0Base : p.cost, lifeYears: asset?.lifeYears ?? 1, ...taxClassSchedule(asset) };
    }),
    horizon,
    depreciationSchedule(scenario),
  );
  const capitalLoan = loanAmountFor(capital, grants, finance.equity, finance.loanAmount);
  const equity = Math.max(0, capital - grants - capitalLoan);
  const { loan, ...loanLines } = loanPlan(capitalLoan, finance, horizon, mode);

  const addedCowCost = option.herdChange.addedCowCost ?? herd.replacementHeiferCost;
  const housedDays = effectiveHousedDays(option.housedDaysPerYear);
  return {
    plan: {
      horizon,
      cows,
      designCows,
      stalls,
      housedDays,
      grazingDays: grazingDaysPerYear(housedDays),
      storageM3,
      assets,
      capitalTotal: capital,
      replacementsByYear: replacementsByYear(purchases, horizon),
      salvage: salvageAtHorizon(assets, purchases, horizon),
      depreciationByYear: depreciation.byYear,
      taxBookValueAtHorizon: depreciation.bookValueAtHorizon,
      grants,
      equity,
      ...loanLines,
      herdPurchasesByYear: herdPurchasesByYear(cows, addedCowCost, herd.cullCowValue, inflation),
      herdValueAtHorizon: herdValueAtHorizon(cows, herd.cullCowValue, inflation),
    },
    loan,
  };
}

export interface Projection {
  /** Project (unlevered) net cash flow per year, index = year. */
  cashFlows: number[];
  /** Cash available for debt service per year (operating margin − tax), index = year, [0] = 0. */
  cashForDebtService: number[];
  /** The yearly lines, when asked for. */
  lines: YearLine[] | null;
  /** The flows with milk income and feed left open, when asked for. */
  milk: MilkModel | null;
}

/**
 * An option's flows with milk income and feed left open: everything else per year, so the
 * break-even searches can move the milk price or the lying-time response without projecting
 * the whole option again (currency, unrounded; index = year).
 */
export interface MilkModel {
  cows: number[];
  /** Operating margin without milk income and feed. */
  otherMargin: number[];
  milkGrowth: number[];
  feedGrowth: number[];
  /** Base feed per cow per year in today's money, baseline milk per cow per year (kg), marginal feed cost per kg. */
  feedPerCow: number;
  baselineMilkPerCow: number;
  marginalFeedCostPerKg: number;
  /**
   * Yield per cow-day (kg) = max(0, yieldFixed + g × yieldPerResponse…), as yield.ts
   * yieldPerCowDay: Y + a_o, and (L_o − L_current) × ramp in year 1 and later.
   */
  yieldFixed: number;
  yieldPerResponseYear1: number;
  yieldPerResponseLater: number;
}

type Rounding = (amount: number) => number;

const identity: Rounding = (amount) => amount;

/**
 * A sum of amounts already in whole cents, freed of binary noise (currency). No half-cent can
 * arise in such a sum, so this decides nothing that half-up rounding would.
 */
const noiseFreeCents: Rounding = (sum) => Math.round(sum * 100) / 100;

/** Tax and net flows of one year, written into by {@link settleYear} (currency). */
interface Settlement {
  taxable: number;
  tax: number;
  net: number;
  cashForDebtService: number;
  lossCarried: number;
  replacements: number;
  herdPurchases: number;
  salvage: number;
  herdValue: number;
  depreciation: number;
}

const emptySettlement = (): Settlement => ({ taxable: 0, tax: 0, net: 0, cashForDebtService: 0, lossCarried: 0, replacements: 0, herdPurchases: 0, salvage: 0, herdValue: 0, depreciation: 0 });

/**
 * Year t after the operating margin: tax (with losses carried from earlier years), the project's
 * net cash flow and the cash available for debt service (currency). The disposal at the horizon
 * is a valuation, not an operating receipt: its salvage stays out of the cash available for debt
 * service, and so does the tax on its gain (the tax on the year's operations alone).
 */
function settleYear(out: Settlement, plan: OptionPlan, finance: Scenario['finance'], t: number, operatingMargin: number, lossCarried: number, round: Rounding, centsTotal: Rounding): void {
  const last = t === plan.horizon;
  out.replacements = round(plan.replacementsByYear[t] ?? 0);
  out.herdPurchases = round(plan.herdPurchasesByYear[t] ?? 0);
  out.salvage = last ? round(plan.salvage) : 0;
  out.herdValue = last ? round(plan.herdValueAtHorizon) : 0;
  out.depreciation = round(plan.depreciationByYear[t] ?? 0);
  const interest = plan.interestByYear[t] ?? 0;
  const disposalGain = last ? out.salvage - round(plan.taxBookValueAtHorizon) : 0;
  out.taxable = centsTotal(taxableIncome(operatingMargin, out.depreciation, interest, disposalGain));
  const step = taxForYear(out.taxable, finance.taxRate, finance.lossesOffsetOtherIncome, lossCarried);
  out.lossCarried = step.lossCarried;
  out.tax = round(step.tax);
  out.net = centsTotal(operatingMargin - out.replacements - out.herdPurchases - out.tax + out.salvage + out.herdValue);
  let operatingTax = out.tax;
  if (disposalGain !== 0) {
    operatingTax = round(taxForYear(centsTotal(out.taxable - disposalGain), finance.taxRate, finance.lossesOffsetOtherIncome, lossCarried).tax);
  }
  out.cashForDebtService = centsTotal(operatingMargin - operatingTax);
}

/**
 * The lying time of an option that earns milk (h/day): its expected lying time, less what
 * overstocking costs, up to the herd's cap. The current option's is the reference L_current.
 */
export function milkingLyingHours(herd: Scenario['herd'], option: Option): number {
  return cappedLyingHours(stockedLyingHours(option.lyingHoursPerDay, option.stockingRate, herd.lyingLossPer10PctOverstocking), herd.lyingResponseCapHours);
}

/** Yield per cow-day (kg) of an option at a lying-time response, with the ramp of `year`. */
function optionYield(scenario: Scenario, option: Option, currentLyingHours: number, response: number, year: number): number {
  const { herd } = scenario;
  return yieldPerCowDay({
    baselineKgPerCowDay: herd.yieldKgPerCowDay,
    lyingResponseKgPerHour: response,
    lyingHours: milkingLyingHours(herd, option),
    currentLyingHours,
    systemAdjustmentKgPerCowDay: option.systemYieldAdjustment,
    rampFraction: rampFraction(year, herd.lyingResponseYear1Fraction),
    lactatingShare: lactatingShare(herd.dryDaysPerCowYear),
  });
}

/**
 * The yearly flows of one option, t = 0..H (currency, nominal). Every money line is rounded to
 * cents half-up exactly as decimal.js does (cents.ts roundCentsFast) before it enters a total, so
 * net = Σ lines exactly. With `withMilkModel` it also returns the option's milk model for the
 * break-even searches.
 */
export function projectOption(
  scenario: Scenario,
  option: Option,
  plan: OptionPlan,
  currentLyingHours: number,
  detail: boolean,
  withMilkModel = false,
): Projection {
  const round = roundCentsFast;
  const centsTotal = noiseFreeCents;
  const { herd, finance } = scenario;
  const growth = resolvedGrowth(herd.growth);
  const H = plan.horizon;
  const milkPrice = herd.milkPricePerKg;
  const response = herd.lyingResponseKgPerHour;
  const { housedDays, grazingDays, stalls } = plan;
  const labour = option.labour;

  // Price-independent pieces of each line, per cow or per year in today's money.
  let energyToday = 0;
  for (const line of option.energyLines) energyToday += line.kwhPerYear * line.pricePerKwh;
  const runningByGrowth = { milkPrice: 0, feed: 0, wages: 0, bedding: 0, fertiliser: 0, general: 0, none: 0 };
  for (const line of option.runningCosts) runningByGrowth[line.growth] += line.amountPerYear;
  // Maintenance and insurance fall on the new capital and on any existing housing the option keeps using.
  const maintenanceToday = maintenanceCostPerYear(option.maintenanceRate + option.insuranceRate, plan.capitalTotal + option.existingHousingValue);
  const scrapingHours = scrapingHoursPerYear(labour.scrapingPassesPerDay, labour.minutesPerScrapingPass, housedDays);
  const bedCareHours = bedCareHoursPerYear(labour.bedCleaningsPerDay, labour.secondsPerStallCleaning, stalls, housedDays);
  const troughHours = troughHoursPerYear(labour.troughCleaningsPerDay, labour.minutesPerTroughCleaning, option.water.troughs, housedDays);
  const grazingHours = grazingHoursPerYear(labour.grazingHoursPerGrazingDay, grazingDays);
  const beddingTonnes = beddingTonnesPerYear(option.bedding.kgPerStallDay, stalls, housedDays);
  const beddingTopUpHours = beddingTopUpHoursPerYear(beddingTonnes, labour.beddingTonnesPerHour);
  const beddingToday = beddingCostPerYear(beddingTonnes, option.bedding.pricePerTonne);
  const beddingStoredM3 = beddingToStorageM3PerYear(beddingTonnes, option.bedding.shareToManureStorage, option.bedding.bulkDensityTonnesPerM3);
  const labourHoursTotal = scrapingHours + bedCareHours + beddingTopUpHours + troughHours + grazingHours;

  const cashFlows = new Array<number>(H + 1);
  const cashForDebtService = new Array<number>(H + 1).fill(0);
  const lines: YearLine[] | null = detail ? [] : null;

  const capital0 = round(plan.capitalTotal);
  const grants0 = round(plan.grants);
  const herd0 = round(plan.herdPurchasesByYear[0] ?? 0);
  cashFlows[0] = centsTotal(grants0 - capital0 - herd0);
  // Financed year 0: loan proceeds less the interest during construction paid out of them or beside them.
  const financed0 = centsTotal(round(plan.loanAmount) - plan.interestDuringConstruction + cashFlows[0]);
  if (lines) lines.push(yearZeroLine(plan, cashFlows[0], capital0, grants0, herd0, financed0));

  // Every line is linear in the cows of the year: per-cow amounts in today's money, hoisted.
  const yieldYear1 = optionYield(scenario, option, currentLyingHours, response, 1);
  const yieldLater = optionYield(scenario, option, currentLyingHours, response, 2);
  const baselineMilkPerCow = milkSoldKgPerYear(1, herd.yieldKgPerCowDay);
  const feedPerCow = baseFeedCostPerYear(1, housedDays, option.feedCostPerCowDay.housed, option.feedCostPerCowDay.grazing);
  const healthPerCow = healthCostPerYear(1, option.health);
  const cullingPerCow = cullingCostPerYear(extraCullsPer100Cows(option.health), 1, herd.replacementHeiferCost, herd.cullCowValue);
  const manurePerCow = collectedManurePerYear(herd.manureExcretion, 1, housedDays, option.manure.collectionEfficiency);
  // Dung dropped on grazing days, of which the credited share counts as fertiliser saved.
  const pasturePerCow = collectedManurePerYear(herd.manureExcretion, 1, grazingDays, option.manure.pastureDungCredit);
  const nutrientCap = {
    phosphateKg: cropNeedCap(herd.land.phosphateNeedKgPerHa, herd.land.hectares),
    potashKg: cropNeedCap(herd.land.potashNeedKgPerHa, herd.land.hectares),
  };
  const manureValueToday = (cows: number): number =>
    creditedValue(
      creditedNutrients(scaleManure(manurePerCow, cows), scaleManure(pasturePerCow, cows), option.manure.storageNitrogenLoss, herd.nutrientAvailability, nutrientCap),
      herd.fertiliserPrices,
    );
  const storedVolume = (cows: number): number =>
    storedVolumeM3PerYear({
      manureKgPerYear: manurePerCow.massKg * cows,
      manureDensityKgPerM3: herd.manureDensityKgPerM3,
      washWaterM3PerCowDay: option.manure.washWaterM3PerCowDay,
      cows,
      washWaterDays: option.manure.washWaterDiverted ? 0 : MILK_DAYS_PER_YEAR,
      beddingM3PerYear: beddingStoredM3,
      openStorageAreaM2: option.manure.openStorageAreaM2,
      netRainMPerYear: option.manure.netRainMPerYear,
    });
  const storedFixedM3 = storedVolume(0);
  const storedPerCowM3 = storedVolume(1) - storedFixedM3;
  const handlingPerM3 = manureHandlingCostPerYear(1, option.manure.handlingCostPerM3, option.manure.sandExtraHandlingCostPerM3);

  const settled = emptySettlement();
  const lyingGain = (milkingLyingHours(herd, option) - currentLyingHours) * lactatingShare(herd.dryDaysPerCowYear);
  const milk: MilkModel | null = withMilkModel
    ? {
        cows: plan.cows,
        otherMargin: new Array<number>(H + 1).fill(0),
        milkGrowth: new Array<number>(H + 1).fill(1),
        feedGrowth: new Array<number>(H + 1).fill(1),
        feedPerCow,
        baselineMilkPerCow,
        marginalFeedCostPerKg: herd.marginalFeedCostPerKgMilk,
        yieldFixed: herd.yieldKgPerCowDay + option.systemYieldAdjustment,
        yieldPerResponseYear1: lyingGain * rampFraction(1, herd.lyingResponseYear1Fraction),
        yieldPerResponseLater: lyingGain * rampFraction(2, herd.lyingResponseYear1Fraction),
      }
    : null;
  let grownMilk = 1, grownFeed = 1, gWage = 1, gBedding = 1, gFert = 1, gGeneral = 1;
  let lossCarried = 0;
  const { milkPrice: milkIndex, feed: feedIndex } = herd.yearlyPriceIndex;
  for (let t = 1; t <= H; t++) {
    grownMilk *= 1 + growth.milkPrice;
    grownFeed *= 1 + growth.feed;
    // A year's price index (a trough, a spike) scales that year alone; growth carries on from the grown path.
    const gMilk = grownMilk * (milkIndex?.[t - 1] ?? 1);
    const gFeed = grownFeed * (feedIndex?.[t - 1] ?? 1);
    gWage *= 1 + growth.wages;
    gBedding *= 1 + growth.bedding;
    gFert *= 1 + growth.fertiliser;
    gGeneral *= 1 + growth.general;
    if (milk) {
      milk.milkGrowth[t] = gMilk;
      milk.feedGrowth[t] = gFeed;
    }
    const cows = plan.cows[t] ?? 0;
    const yieldKg = t === 1 ? yieldYear1 : yieldLater;
    const milkKg = milkSoldKgPerYear(cows, yieldKg);
    const extraMilkKg = milkKg - baselineMilkPerCow * cows;

    const milkIncome = round(milkKg * milkPrice * gMilk);
    const feed = round((feedPerCow * cows + marginalFeedCostPerYear(extraMilkKg, herd.marginalFeedCostPerKgMilk)) * gFeed);
    const wage = herd.wagePerHour;
    const labourScraping = round(labourCost(scrapingHours, wage, gWage));
    const labourBedCare = round(labourCost(bedCareHours, wage, gWage));
    const labourBeddingTopUp = round(labourCost(beddingTopUpHours, wage, gWage));
    const labourTroughs = round(labourCost(troughHours, wage, gWage));
    const labourGrazing = round(labourCost(grazingHours, wage, gWage));
    const bedding = round(beddingToday * gBedding);
    const health = round(healthPerCow * cows * gGeneral);
    const culling = round(cullingPerCow * cows * gGeneral);
    const maintenance = round(maintenanceToday * gGeneral);
    const energy = round(energyToday * gGeneral);
    const runningCosts = round(
      runningByGrowth.milkPrice * gMilk +
        runningByGrowth.feed * gFeed +
        runningByGrowth.wages * gWage +
        runningByGrowth.bedding * gBedding +
        runningByGrowth.fertiliser * gFert +
        runningByGrowth.general * gGeneral +
        runningByGrowth.none,
    );
    const manureValue = round(manureValueToday(cows) * gFert);
    const storedM3 = storedFixedM3 + storedPerCowM3 * cows;
    const manureHandling = round(storedM3 * handlingPerM3 * gGeneral);
    const operatingMargin = centsTotal(
      milkIncome + manureValue - feed - labourScraping - labourBedCare - labourBeddingTopUp - labourTroughs - labourGrazing -
        bedding - health - culling - maintenance - energy - runningCosts - manureHandling,
    );

    settleYear(settled, plan, finance, t, operatingMargin, lossCarried, round, centsTotal);
    lossCarried = settled.lossCarried;
    const { replacements, herdPurchases, salvage, herdValue, depreciation, taxable, tax, net } = settled;
    const interest = plan.interestByYear[t] ?? 0;
    const principal = plan.principalByYear[t] ?? 0;
    cashFlows[t] = net;
    cashForDebtService[t] = settled.cashForDebtService;
    if (milk) milk.otherMargin[t] = operatingMargin - milkIncome + feed;

    if (lines) {
      const repaidAtHorizon = t === H ? round(plan.loanBalanceAtHorizon) : 0;
      lines.push({
        year: t,
        cows,
        yieldKgPerCowDay: yieldKg,
        milkSoldKg: milkKg,
        milkIncome,
        feed,
        labourScraping,
        labourBedCare,
        labourBeddingTopUp,
        labourTroughs,
        labourGrazing,
        bedding,
        health,
        culling,
        maintenance,
        energy,
        runningCosts,
        manureValue,
        manureHandling,
        operatingMargin,
        capital: 0,
        grants: 0,
        replacements,
        herdPurchases,
        salvage,
        herdValueAtHorizon: herdValue,
        depreciation,
        taxableIncome: taxable,
        tax,
        netCashFlow: net,
        loanInterest: interest,
        loanPrincipal: principal,
        financedCashFlow: centsTotal(net - interest - principal - repaidAtHorizon),
        cashAvailableForDebtService: cashForDebtService[t] ?? 0,
        labourHours: {
          scraping: scrapingHours,
          bedCare: bedCareHours,
          beddingTopUp: beddingTopUpHours,
          troughs: troughHours,
          grazing: grazingHours,
          total: labourHoursTotal,
        },
        beddingTonnes: beddingTonnes,
        manure: {
          storedM3,
          nitrogenKg: manurePerCow.nitrogenKg * cows,
          phosphateKg: manurePerCow.phosphorusKg * cows * P_TO_P2O5,
          potashKg: manurePerCow.potassiumKg * cows * K_TO_K2O,
        },
      });
    }
  }
  return { cashFlows, cashForDebtService, lines, milk };
}

function yearZeroLine(plan: OptionPlan, net: number, capital: number, grants: number, herdPurchases: number, financed: number): YearLine {
  return {
    year: 0,
    cows: plan.cows[0] ?? 0,
    yieldKgPerCowDay: 0,
    milkSoldKg: 0,
    milkIncome: 0,
    feed: 0,
    labourScraping: 0,
    labourBedCare: 0,
    labourBeddingTopUp: 0,
    labourTroughs: 0,
    labourGrazing: 0,
    bedding: 0,
    health: 0,
    culling: 0,
    maintenance: 0,
    energy: 0,
    runningCosts: 0,
    manureValue: 0,
    manureHandling: 0,
    operatingMargin: 0,
    capital,
    grants,
    replacements: 0,
    herdPurchases,
    salvage: 0,
    herdValueAtHorizon: 0,
    depreciation: 0,
    taxableIncome: 0,
    tax: 0,
    netCashFlow: net,
    loanInterest: 0,
    loanPrincipal: 0,
    financedCashFlow: financed,
    cashAvailableForDebtService: 0,
    labourHours: { scraping: 0, bedCare: 0, beddingTopUp: 0, troughs: 0, grazing: 0, total: 0 },
    beddingTonnes: 0,
    manure: { storedM3: 0, nitrogenKg: 0, phosphateKg: 0, potashKg: 0 },
  };
}

/** Operating margin of year t (currency, unrounded) from a milk model at a milk price and lying-time response. */
function marginAtMilk(model: MilkModel, t: number, milkPrice: number, response: number): number {
  const cows = model.cows[t] ?? 0;
  const yieldKg = Math.max(0, model.yieldFixed + response * (t === 1 ? model.yieldPerResponseYear1 : model.yieldPerResponseLater));
  const milkKg = milkSoldKgPerYear(cows, yieldKg);
  const milkIncome = milkKg * milkPrice * (model.milkGrowth[t] ?? 1);
  const feed = (model.feedPerCow * cows + marginalFeedCostPerYear(milkKg - model.baselineMilkPerCow * cows, model.marginalFeedCostPerKg)) * (model.feedGrowth[t] ?? 1);
  return (model.otherMargin[t] ?? 0) + milkIncome - feed;
}

/**
 * NPV (currency, flows[0] at t = 0) of an option's project flows at another milk price (currency
 * per kg) and lying-time response (kg/cow/day per hour), from its milk model: the same sums as
 * projectOption without rounding, in a single pass over the years.
 */
export function npvAtMilk(model: MilkModel, plan: OptionPlan, finance: Scenario['finance'], yearZero: number, milkPrice: number, response: number): number {
  const factor = 1 / (1 + finance.discountRate);
  const out = scratch;
  let discount = factor;
  let total = yearZero;
  let lossCarried = 0;
  for (let t = 1; t <= plan.horizon; t++) {
    settleYear(out, plan, finance, t, marginAtMilk(model, t, milkPrice, response), lossCarried, identity, identity);
    lossCarried = out.lossCarried;
    total += out.net * discount;
    discount *= factor;
  }
  return total;
}

// npvAtMilk runs synchronously and never re-enters, so one settlement record serves every call.
const scratch = emptySettlement();

/**
 * Cash available for debt service per year (currency, index = year, [0] = 0; written into `into`)
 * of an option at another milk price and lying-time response, from its milk model, and the NPV
 * of its project flows (returned; flows[0] = yearZero at t = 0; each year's flow into `netInto`
 * when given): the same sums as projectOption without rounding (the stress table and the
 * coverage break-evens), one pass over the years.
 */
export function cashAtMilk(
  model: MilkModel,
  plan: OptionPlan,
  finance: Scenario['finance'],
  yearZero: number,
  milkPrice: number,
  response: number,
  into: number[],
  netInto?: number[],
): number {
  const factor = 1 / (1 + finance.discountRate);
  const out = scratch;
  let discount = factor;
  let total = yearZero;
  let lossCarried = 0;
  into[0] = 0;
  if (netInto) netInto[0] = yearZero;
  for (let t = 1; t <= plan.horizon; t++) {
    settleYear(out, plan, finance, t, marginAtMilk(model, t, milkPrice, response), lossCarried, identity, identity);
    lossCarried = out.lossCarried;
    into[t] = out.cashForDebtService;
    if (netInto) netInto[t] = out.net;
    total += out.net * discount;
    discount *= factor;
  }
  return total;
}

/**
 * An option's milk model: its yearly flows with milk income and feed left open, so the
 * break-even searches and the stress table can move the milk price or the lying-time response
 * without projecting the whole option again. Also the lying time and yield each option earns.
 */
import type { Option, Scenario } from '../schema';
import { presentValue } from './discounting';
import { baseFeedCostPerYear, marginalFeedCostPerYear } from './feed';
import type { OptionPlan } from './plan';
import { lossCarriedOn, taxableIncome, taxOfYear } from './tax';
import { cappedLyingHours, lactatingShare, milkSoldKgPerYear, rampFraction, stockedLyingHours, yieldPerCowDay } from './yield';

/**
 * An option's flows with milk income and feed left open: everything else per year, so the
 * break-even searches can move the milk price or the lying-time response without projecting
 * the whole option again (currency, unrounded; index = year).
 */
export interface MilkModel {
  cows: number[];
  /** Cows in milk at the herd's yield (cow equivalents), as OptionPlan.milkCows. */
  milkCows: number[];
  /** The option's milk quality premium (+) or penalty (−) on the milk price (currency per kg, today). */
  qualityPricePerKg: number;
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

/**
 * The lying time of an option that earns milk (h/day): its expected lying time, less what
 * overstocking costs, up to the herd's cap. The current option's is the reference L_current.
 */
export function milkingLyingHours(herd: Scenario['herd'], option: Option): number {
  return cappedLyingHours(stockedLyingHours(option.lyingHoursPerDay, option.stockingRate, herd.lyingLossPer10PctOverstocking), herd.lyingResponseCapHours);
}

/** Yield per cow-day (kg) of an option at a lying-time response (kg/cow/day per h), with the ramp of operating year `year`. */
export function optionYield(scenario: Scenario, option: Option, currentLyingHours: number, response: number, year: number): number {
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
 * An option's milk model before its yearly margins are filled in (the ledger writes
 * otherMargin, milkGrowth and feedGrowth year by year): per-cow feed and milk in today's money
 * and kg, the yield terms from the lying-time gain over the current option.
 */
export function openMilkModel(scenario: Scenario, option: Option, plan: OptionPlan, currentLyingHours: number): MilkModel {
  const { herd } = scenario;
  const H = plan.horizon;
  const lyingGain = (milkingLyingHours(herd, option) - currentLyingHours) * lactatingShare(herd.dryDaysPerCowYear);
  return {
    cows: plan.cows,
    milkCows: plan.milkCows,
    qualityPricePerKg: option.milkQualityPricePerKg,
    otherMargin: new Array<number>(H + 1).fill(0),
    milkGrowth: new Array<number>(H + 1).fill(1),
    feedGrowth: new Array<number>(H + 1).fill(1),
    feedPerCow: baseFeedCostPerYear(1, plan.housedDays, option.feedCostPerCowDay.housed, option.feedCostPerCowDay.grazing),
    baselineMilkPerCow: milkSoldKgPerYear(1, herd.yieldKgPerCowDay),
    marginalFeedCostPerKg: herd.marginalFeedCostPerKgMilk,
    yieldFixed: herd.yieldKgPerCowDay + option.systemYieldAdjustment,
    yieldPerResponseYear1: lyingGain * rampFraction(1, herd.lyingResponseYear1Fraction),
    yieldPerResponseLater: lyingGain * rampFraction(2, herd.lyingResponseYear1Fraction),
  };
}

/**
 * A milk model at one lying-time response (kg/cow/day per hour): each year's milk sold (kg) and
 * feed (currency, unrounded), which no milk price moves, so a search over the price or the
 * stress table's price shocks work them out once instead of at every price (index = year).
 */
export interface MilkAtResponse {
  model: MilkModel;
  response: number;
  milkKg: Float64Array;
  feed: Float64Array;
}

/** A milk model's milk sold and feed per year at a lying-time response, for years 1..H. */
export function milkAtResponse(model: MilkModel, horizon: number, response: number): MilkAtResponse {
  const milkKg = new Float64Array(horizon + 1);
  const feed = new Float64Array(horizon + 1);
  for (let t = 1; t <= horizon; t++) {
    const cows = model.cows[t] as number;
    const yieldKg = Math.max(0, model.yieldFixed + response * (t === 1 ? model.yieldPerResponseYear1 : model.yieldPerResponseLater));
    const kg = milkSoldKgPerYear(model.milkCows[t] as number, yieldKg);
    milkKg[t] = kg;
    feed[t] = (model.feedPerCow * cows + marginalFeedCostPerYear(kg - model.baselineMilkPerCow * cows, model.marginalFeedCostPerKg)) * (model.feedGrowth[t] as number);
  }
  return { model, response, milkKg, feed };
}

/**
 * Project flows (currency, index = year, [0] = yearZero; into `flowsInto`) and cash available for
 * debt service per year ([0] = 0; into `cashInto`) of an option at another milk price (currency
 * per kg), from its milk model at a response: the same sums as the ledger without rounding, one
 * pass over the years. Either target may be null when not wanted.
 */
export function flowsAtPrice(
  milk: MilkAtResponse,
  plan: OptionPlan,
  finance: Scenario['finance'],
  yearZero: number,
  milkPrice: number,
  flowsInto: number[] | null,
  cashInto: number[] | null,
): void {
  const { model, milkKg, feed } = milk;
  const { otherMargin, milkGrowth } = model;
  const { taxRate, lossesOffsetOtherIncome } = finance;
  const { horizon, depreciationByYear, interestByYear, replacementsByYear, herdPurchasesByYear } = plan;
  const price = milkPrice + model.qualityPricePerKg;
  if (flowsInto) flowsInto[0] = yearZero;
  if (cashInto) cashInto[0] = 0;
  let lossCarried = 0;
  for (let t = 1; t <= horizon; t++) {
    const margin = (otherMargin[t] as number) + (milkKg[t] as number) * price * (milkGrowth[t] as number) - (feed[t] as number);
    // The year settled as settle-year.ts settles the ledger's, term for term but unrounded (a
    // smooth function of the price), inline for speed: the searches run this ~100 times an evaluation.
    // The disposal at H is taxed in the net flow and left out of the cash for debt service.
    const last = t === horizon;
    const salvage = last ? plan.salvage : 0;
    const disposalGain = last ? salvage - plan.taxBookValueAtHorizon : 0;
    const taxable = taxableIncome(margin, depreciationByYear[t] as number, interestByYear[t] as number, disposalGain);
    const tax = taxOfYear(taxable, taxRate, lossesOffsetOtherIncome, lossCarried);
    if (flowsInto) flowsInto[t] = margin - (replacementsByYear[t] as number) - (herdPurchasesByYear[t] as number) - tax + salvage + (last ? plan.herdValueAtHorizon : 0);
    if (cashInto) cashInto[t] = margin - (disposalGain !== 0 ? taxOfYear(taxable - disposalGain, taxRate, lossesOffsetOtherIncome, lossCarried) : tax);
    lossCarried = lossCarriedOn(taxable, taxRate, lossesOffsetOtherIncome, lossCarried);
  }
}

/**
 * NPV (currency, flows[0] at t = 0) of an option's project flows at another milk price (currency
 * per kg), from its milk model at a response (the break-even searches); `flows` is scratch of H + 1 years.
 */
export function npvAtPrice(milk: MilkAtResponse, plan: OptionPlan, finance: Scenario['finance'], yearZero: number, milkPrice: number, flows: number[] = new Array<number>(plan.horizon + 1)): number {
  flowsAtPrice(milk, plan, finance, yearZero, milkPrice, flows, null);
  return presentValue(finance.discountRate, flows);
}

/**
 * NPV (currency, flows[0] at t = 0) of an option's project flows at another milk price (currency
 * per kg) and lying-time response (kg/cow/day per hour), from its milk model.
 */
export function npvAtMilk(model: MilkModel, plan: OptionPlan, finance: Scenario['finance'], yearZero: number, milkPrice: number, response: number): number {
  return npvAtPrice(milkAtResponse(model, plan.horizon, response), plan, finance, yearZero, milkPrice);
}

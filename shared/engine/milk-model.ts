/**
 * An option's milk model: its yearly flows with milk income and feed left open, so the
 * break-even searches and the stress table can move the milk price or the lying-time response
 * without projecting the whole option again. Also the lying time and yield each option earns.
 */
import type { Option, Scenario } from '../schema';
import { presentValue } from './discounting';
import { baseFeedCostPerYear, marginalFeedCostPerYear } from './feed';
import type { OptionPlan } from './plan';
import { emptySettlement, settleYear } from './settle-year';
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

/** Operating margin of year t (currency, unrounded) from a milk model at a milk price and lying-time response. */
function marginAtMilk(model: MilkModel, t: number, milkPrice: number, response: number): number {
  const cows = model.cows[t] as number;
  const yieldKg = Math.max(0, model.yieldFixed + response * (t === 1 ? model.yieldPerResponseYear1 : model.yieldPerResponseLater));
  const milkKg = milkSoldKgPerYear(model.milkCows[t] as number, yieldKg);
  const milkIncome = milkKg * (milkPrice + model.qualityPricePerKg) * (model.milkGrowth[t] as number);
  const feed = (model.feedPerCow * cows + marginalFeedCostPerYear(milkKg - model.baselineMilkPerCow * cows, model.marginalFeedCostPerKg)) * (model.feedGrowth[t] as number);
  return (model.otherMargin[t] as number) + milkIncome - feed;
}

/**
 * Project flows (currency, index = year, flows[0] = yearZero) of an option at another milk price
 * (currency per kg) and lying-time response (kg/cow/day per hour), from its milk model: the same
 * sums as the ledger without rounding, one pass over the years. With `cashInto` it also writes
 * the cash available for debt service per year there ([0] = 0).
 */
function flowsAtMilk(model: MilkModel, plan: OptionPlan, finance: Scenario['finance'], yearZero: number, milkPrice: number, response: number, cashInto?: number[]): number[] {
  const flows = new Array<number>(plan.horizon + 1);
  flows[0] = yearZero;
  if (cashInto) cashInto[0] = 0;
  const out = emptySettlement();
  let lossCarried = 0;
  for (let t = 1; t <= plan.horizon; t++) {
    settleYear(out, plan, finance, t, marginAtMilk(model, t, milkPrice, response), lossCarried, false);
    lossCarried = out.lossCarried;
    flows[t] = out.net;
    if (cashInto) cashInto[t] = out.cashForDebtService;
  }
  return flows;
}

/**
 * NPV (currency, flows[0] at t = 0) of an option's project flows at another milk price (currency
 * per kg) and lying-time response (kg/cow/day per hour), from its milk model (the break-even searches).
 */
export function npvAtMilk(model: MilkModel, plan: OptionPlan, finance: Scenario['finance'], yearZero: number, milkPrice: number, response: number): number {
  return presentValue(finance.discountRate, flowsAtMilk(model, plan, finance, yearZero, milkPrice, response));
}

/**
 * Cash available for debt service per year (currency, index = year, [0] = 0; written into `into`)
 * of an option at another milk price and lying-time response, from its milk model, and the NPV
 * of its project flows (returned; flows[0] = yearZero at t = 0; each year's flow into `netInto`
 * when given): the stress table and the coverage break-evens.
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
  const flows = flowsAtMilk(model, plan, finance, yearZero, milkPrice, response, into);
  if (netInto) flows.forEach((net, t) => (netInto[t] = net));
  return presentValue(finance.discountRate, flows);
}

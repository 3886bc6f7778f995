/**
 * The yearly lines that follow only the herd, the housing and the bedding, general and
 * fertiliser price groups: bedding, health, culling, herd replacement, other cow costs, energy,
 * manure value and handling. No price, yield, wage or capital draw moves them, so a Monte Carlo
 * run that draws only those builds them once per option instead of once per draw.
 */
import type { Option, Scenario } from '../schema';
import { energyCostToday } from './energy';
import { resolvedGrowth } from './growth';
import { cullingCostPerYear, extraCullsPer100Cows, healthCostPerYear } from './health';
import { herdReplacementCostPerYear, otherCowCostsPerYear } from './herd-costs';
import type { HousingWork } from './housing-work';
import { optionManure, type OptionManure } from './option-manure';
import type { OptionPlan, PlanBasis } from './plan';
import { runningCostsByGrowth, type RunningCostsByGrowth } from './running-costs';
import { roundCentsFast } from './cents';
import { noiseFreeCents } from './settle-year';

/** Each line per year in cents (currency, index = year, [0] = 0), the stored manure (m³/yr) and their net. */
export interface SteadyLines {
  bedding: Float64Array;
  health: Float64Array;
  culling: Float64Array;
  herdReplacement: Float64Array;
  otherCowCosts: Float64Array;
  energy: Float64Array;
  manureValue: Float64Array;
  manureHandling: Float64Array;
  storedM3: Float64Array;
  /** Manure value less the seven costs (currency, whole cents). */
  net: Float64Array;
  manure: OptionManure;
  /** What the ledger reads besides the lines, as unmoved: the housing's work, the running costs per price group and the plan with its inputs. */
  work: HousingWork;
  runningByGrowth: RunningCostsByGrowth;
  basis: PlanBasis;
}

/** The steady lines of one option over years 0..H, each rounded to cents as the ledger rounds it. */
export function steadyLines(scenario: Scenario, option: Option, plan: OptionPlan, work: HousingWork): SteadyLines {
  const round = roundCentsFast;
  const { herd } = scenario;
  const growth = resolvedGrowth(herd.growth);
  const size = plan.horizon + 1;
  const lines: SteadyLines = {
    bedding: new Float64Array(size),
    health: new Float64Array(size),
    culling: new Float64Array(size),
    herdReplacement: new Float64Array(size),
    otherCowCosts: new Float64Array(size),
    energy: new Float64Array(size),
    manureValue: new Float64Array(size),
    manureHandling: new Float64Array(size),
    storedM3: new Float64Array(size),
    net: new Float64Array(size),
    manure: optionManure(herd, option, plan, work.beddingStoredM3),
    work,
    runningByGrowth: runningCostsByGrowth(option.runningCosts),
    basis: { plan, capitalLines: option.capitalLines, finance: scenario.finance },
  };
  const { manure } = lines;
  const energyToday = energyCostToday(option.energyLines);
  const healthPerCow = healthCostPerYear(1, option.health);
  const cullingPerCow = cullingCostPerYear(extraCullsPer100Cows(option.health), 1, herd.replacementHeiferCost, herd.cullCowValue);
  const herdReplacementPerCow = herdReplacementCostPerYear(herd.replacementRate, 1, herd.replacementHeiferCost, herd.cullCowValue);
  // The growth factors are built year by year exactly as the ledger builds its own.
  let gBedding = 1, gFert = 1, gGeneral = 1;
  for (let t = 1; t < size; t++) {
    gBedding *= 1 + growth.bedding;
    gFert *= 1 + growth.fertiliser;
    gGeneral *= 1 + growth.general;
    const cows = plan.cows[t] ?? 0;
    const bedding = (lines.bedding[t] = round(work.beddingCostToday * gBedding));
    const health = (lines.health[t] = round(healthPerCow * cows * gGeneral));
    const culling = (lines.culling[t] = round(cullingPerCow * cows * gGeneral));
    const herdReplacement = (lines.herdReplacement[t] = round(herdReplacementPerCow * cows * gGeneral));
    const otherCowCosts = (lines.otherCowCosts[t] = round(otherCowCostsPerYear(herd.otherVariableCostPerCowYear, cows) * gGeneral));
    const energy = (lines.energy[t] = round(energyToday * gGeneral));
    const manureValue = (lines.manureValue[t] = round(manure.valueToday(cows) * gFert));
    const storedM3 = (lines.storedM3[t] = manure.storedM3(cows));
    const manureHandling = (lines.manureHandling[t] = round(storedM3 * manure.handlingPerM3 * gGeneral));
    lines.net[t] = noiseFreeCents(manureValue - bedding - health - culling - herdReplacement - otherCowCosts - energy - manureHandling);
  }
  return lines;
}

/**
 * An option's year ledger: the yearly lines t = 0..H in cents, the project flows and the cash
 * available for debt service, and (when asked) its milk model for the break-even searches.
 */
import type { Option, Scenario } from '../schema';
import { maintenanceCostPerYear } from './capital';
import { roundCentsFast, roundCentsInPlace } from './cents';
import { baseFeedCostPerYear, marginalFeedCostPerYear } from './feed';
import { resolvedGrowth } from './growth';
import { milkingHoursPerYear } from './herd-costs';
import { housingWork } from './housing-work';
import { labourCost } from './labour';
import { K_TO_K2O, P_TO_P2O5 } from './manure';
import { openMilkModel, optionYield, type MilkModel } from './milk-model';
import type { OptionPlan } from './plan';
import type { YearLine } from './results';
import { grownRunningCosts, type GrowthFactors } from './running-costs';
import { emptySettlement, noiseFreeCents, settleYear } from './settle-year';
import { steadyLines, type SteadyLines } from './steady-lines';
import { milkSoldKgPerYear } from './yield';

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

// Where each of the year's rounded lines sits in the ledger's scratch array.
const MILK = 0, FEED = 1, SCRAPING = 2, BED_CARE = 3, BEDDING_TOP_UP = 4, TROUGHS = 5, GRAZING = 6, MILKING = 7, MAINTENANCE = 8, RUNNING_COSTS = 9;
const YEAR_LINES = 10;
// One scratch array for every projection: a typed array costs more to allocate than a year's lines
// to fill, and nothing the year loop calls projects another option.
const year = new Float64Array(YEAR_LINES);

/**
 * The yearly flows of one option, t = 0..H (currency, nominal). Every money line is rounded to
 * cents half-up exactly as decimal.js does (cents.ts roundCentsFast) before it enters a total, so
 * net = Σ lines exactly. With `withMilkModel` it also returns the option's milk model for the
 * break-even searches. `steady` (from {@link steadyLines}) may carry the option's steady lines
 * already built for inputs that move none of them.
 */
export function projectOption(
  scenario: Scenario,
  option: Option,
  plan: OptionPlan,
  currentLyingHours: number,
  detail: boolean,
  withMilkModel = false,
  steady: SteadyLines | null = null,
): Projection {
  const round = roundCentsFast;
  const centsTotal = noiseFreeCents;
  const { herd, finance } = scenario;
  const growth = resolvedGrowth(herd.growth);
  const H = plan.horizon;
  const milkPrice = herd.milkPricePerKg;
  const response = herd.lyingResponseKgPerHour;

  // Price-independent pieces of each line, per cow or per year in today's money.
  const work = steady?.work ?? housingWork(option, plan);
  const fixed = steady ?? steadyLines(scenario, option, plan, work);
  const runningByGrowth = fixed.runningByGrowth;
  const maintenanceToday = maintenanceTodayOf(option, plan);
  const manure = fixed.manure;
  const { scrapingHours, bedCareHours, beddingTopUpHours, troughHours, grazingHours, beddingTonnes } = work;

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
  const milk: MilkModel | null = withMilkModel ? openMilkModel(scenario, option, plan, currentLyingHours) : null;
  const baselineMilkPerCow = milkSoldKgPerYear(1, herd.yieldKgPerCowDay);
  const feedPerCow = baseFeedCostPerYear(1, plan.housedDays, option.feedCostPerCowDay.housed, option.feedCostPerCowDay.grazing);

  const settled = emptySettlement();
  // This year's growth factors per price group, updated in place year by year.
  const factors: GrowthFactors = { milkPrice: 1, feed: 1, wages: 1, bedding: 1, fertiliser: 1, general: 1 };
  let grownMilk = 1, grownFeed = 1, gWage = 1, gBedding = 1, gFert = 1, gGeneral = 1;
  let lossCarried = 0;
  const { milkPrice: milkIndex, feed: feedIndex } = herd.yearlyPriceIndex;
  for (let t = 1; t <= H; t++) {
    grownMilk *= 1 + growth.milkPrice;
    grownFeed *= 1 + growth.feed;
    // A year's price index (a trough, a spike) scales that year alone; growth carries on from the grown path.
    const gMilk = milkIndex ? grownMilk * (milkIndex[t - 1] ?? 1) : grownMilk;
    const gFeed = feedIndex ? grownFeed * (feedIndex[t - 1] ?? 1) : grownFeed;
    gWage *= 1 + growth.wages;
    gBedding *= 1 + growth.bedding;
    gFert *= 1 + growth.fertiliser;
    gGeneral *= 1 + growth.general;
    if (milk) {
      milk.milkGrowth[t] = gMilk;
      milk.feedGrowth[t] = gFeed;
    }
    const cows = plan.cows[t] as number;
    const yieldKg = t === 1 ? yieldYear1 : yieldLater;
    const milkKg = milkSoldKgPerYear(plan.milkCows[t] as number, yieldKg);
    const extraMilkKg = milkKg - baselineMilkPerCow * cows;

    // The year's lines before rounding, then rounded in one pass over the scratch array: no line
    // passes through a call as a boxed double (this runs for every year of every Monte Carlo draw).
    const wage = herd.wagePerHour;
    const milkingHours = milkingHoursPerYear(herd.milkingHoursPerCowYear, cows);
    factors.milkPrice = gMilk;
    factors.feed = gFeed;
    factors.wages = gWage;
    factors.bedding = gBedding;
    factors.fertiliser = gFert;
    factors.general = gGeneral;
    year[MILK] = milkKg * (milkPrice + option.milkQualityPricePerKg) * gMilk;
    year[FEED] = (feedPerCow * cows + marginalFeedCostPerYear(extraMilkKg, herd.marginalFeedCostPerKgMilk)) * gFeed;
    year[SCRAPING] = labourCost(scrapingHours, wage, gWage);
    year[BED_CARE] = labourCost(bedCareHours, wage, gWage);
    year[BEDDING_TOP_UP] = labourCost(beddingTopUpHours, wage, gWage);
    year[TROUGHS] = labourCost(troughHours, wage, gWage);
    year[GRAZING] = labourCost(grazingHours, wage, gWage);
    year[MILKING] = labourCost(milkingHours, wage, gWage);
    year[MAINTENANCE] = maintenanceToday * gGeneral;
    year[RUNNING_COSTS] = grownRunningCosts(runningByGrowth, factors);
    roundCentsInPlace(year);
    const milkIncome = year[MILK] as number;
    const feed = year[FEED] as number;
    const labourScraping = year[SCRAPING] as number;
    const labourBedCare = year[BED_CARE] as number;
    const labourBeddingTopUp = year[BEDDING_TOP_UP] as number;
    const labourTroughs = year[TROUGHS] as number;
    const labourGrazing = year[GRAZING] as number;
    const labourMilking = year[MILKING] as number;
    const maintenance = year[MAINTENANCE] as number;
    const runningCosts = year[RUNNING_COSTS] as number;
    // Every term is in whole cents, so grouping the steady lines changes no cent of the total.
    const operatingMargin = centsTotal(
      milkIncome - feed - labourScraping - labourBedCare - labourBeddingTopUp - labourTroughs - labourGrazing - labourMilking - maintenance - runningCosts + (fixed.net[t] as number),
    );

    settleYear(settled, plan, finance, t, operatingMargin, lossCarried, true);
    lossCarried = settled.lossCarried;
    const { replacements, herdPurchases, salvage, herdValue, depreciation, taxable, tax, net } = settled;
    cashFlows[t] = net;
    cashForDebtService[t] = settled.cashForDebtService;
    if (milk) milk.otherMargin[t] = operatingMargin - milkIncome + feed;

    if (lines) {
      const interest = plan.interestByYear[t] ?? 0;
      const principal = plan.principalByYear[t] ?? 0;
      const storedM3 = fixed.storedM3[t] ?? 0;
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
        labourMilking,
        bedding: fixed.bedding[t] ?? 0,
        health: fixed.health[t] ?? 0,
        culling: fixed.culling[t] ?? 0,
        herdReplacement: fixed.herdReplacement[t] ?? 0,
        otherCowCosts: fixed.otherCowCosts[t] ?? 0,
        maintenance,
        energy: fixed.energy[t] ?? 0,
        runningCosts,
        manureValue: fixed.manureValue[t] ?? 0,
        manureHandling: fixed.manureHandling[t] ?? 0,
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
          milking: milkingHours,
          total: work.totalHours + milkingHours,
        },
        beddingTonnes: beddingTonnes,
        manure: {
          storedM3,
          nitrogenKg: manure.perCow.nitrogenKg * cows,
          phosphateKg: manure.perCow.phosphorusKg * cows * P_TO_P2O5,
          potashKg: manure.perCow.potassiumKg * cows * K_TO_K2O,
        },
      });
    }
  }
  return { cashFlows, cashForDebtService, lines, milk };
}

/** Maintenance and insurance in today's money (currency per year): on the new capital and on any existing housing the option keeps using. */
function maintenanceTodayOf(option: Option, plan: OptionPlan): number {
  return maintenanceCostPerYear(option.maintenanceRate + option.insuranceRate, plan.capitalTotal + option.existingHousingValue);
}

/**
 * The milk model and year-0 flow of an option on `plan`, from its projection (`lines`, `model`)
 * on a plan that differs from it in the capital alone (a capital shock: same herd, housing and
 * steady lines). In the ledger only year 0 and the maintenance line follow the capital, and every
 * line is in whole cents, so each year's margin is the old one with the maintenance's cents
 * swapped: exactly the cents projectOption would sum, without projecting the option again.
 */
export function withCapitalOf(scenario: Scenario, option: Option, plan: OptionPlan, lines: readonly YearLine[], model: MilkModel): { model: MilkModel; yearZero: number } {
  const growth = resolvedGrowth(scenario.herd.growth);
  const maintenanceToday = maintenanceTodayOf(option, plan);
  const otherMargin = new Array<number>(plan.horizon + 1).fill(0);
  // The general growth factor built year by year as projectOption builds it.
  let gGeneral = 1;
  for (let t = 1; t <= plan.horizon; t++) {
    gGeneral *= 1 + growth.general;
    const line = lines[t] as YearLine;
    const operatingMargin = noiseFreeCents(line.operatingMargin + line.maintenance - roundCentsFast(maintenanceToday * gGeneral));
    otherMargin[t] = operatingMargin - line.milkIncome + line.feed;
  }
  // Year 0 as projectOption's: grants − capital − cows bought, each in cents.
  const yearZero = noiseFreeCents(roundCentsFast(plan.grants) - roundCentsFast(plan.capitalTotal) - roundCentsFast(plan.herdPurchasesByYear[0] ?? 0));
  return { model: { ...model, otherMargin }, yearZero };
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
    labourMilking: 0,
    bedding: 0,
    health: 0,
    culling: 0,
    herdReplacement: 0,
    otherCowCosts: 0,
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
    labourHours: { scraping: 0, bedCare: 0, beddingTopUp: 0, troughs: 0, grazing: 0, milking: 0, total: 0 },
    beddingTonnes: 0,
    manure: { storedM3: 0, nitrogenKg: 0, phosphateKg: 0, potashKg: 0 },
  };
}

/**
 * The family's one-page summary in everyday words: each option ranked by what it changes against
 * the current option, what that means day to day, and the assumptions that drive the answer with
 * their break-evens. Pure: reads the engine's results and the sensitivity as they are.
 */
import type { MonteCarloResult, OptionResult, ScenarioResults, SensitivityResult } from '@shared/engine';
import type { Scenario } from '@shared/schema';
import { candidatesByChange } from '@shared/candidates';
import type { ReadingFormat } from '@/components/results/readings';
import { RISK_INPUT_LABELS } from '@/components/risk/risk-labels';

export interface FamilyOption {
  id: string;
  name: string;
  /** One sentence: better or worse than the current option, in today's money. */
  headline: string;
  better: boolean;
  /** What the farm's kept risk run says about the change; null without a kept run. */
  risk: string | null;
  /** Everyday consequences: hours a day, bedding a week, cash left after the loans each year. */
  dayToDay: string[];
}

export interface FamilySummary {
  question: string;
  /** The current option's cash left after the loans, as the yardstick. */
  staying: string | null;
  options: FamilyOption[];
  drivers: string[];
  /** Said once when no risk run is kept on this version; null when one is. */
  riskNotRun: string | null;
}

const DAYS_PER_YEAR = 365;
const WEEKS_PER_YEAR = 52;

/** Whole-farm cash left in year t after every loan payment (currency): existing farm + the change − existing debt − this loan. */
export function cashLeftAfterLoans(results: ScenarioResults, option: OptionResult, current: OptionResult, t: number): number {
  const farm = results.existingFarm;
  const change = option.current ? 0 : (option.years[t]?.cashAvailableForDebtService ?? 0) - (current.years[t]?.cashAvailableForDebtService ?? 0);
  const loanPayment = option.loan.years[t - 1]?.payment ?? 0;
  return (farm.cashForDebtServiceByYear[t] ?? 0) + change - (farm.debtPaymentsByYear[t] ?? 0) - loanPayment;
}

/** "2.0 hours a day more than today", "the same hours a day as today" (unit plural, e.g. "hours a day"). */
function moreOrLess(value: number, f: ReadingFormat, digits: number, unit: string): string {
  if (Math.abs(value) < 0.5 * 10 ** -digits) return `the same ${unit} as today`;
  return `${f.number(Math.abs(value), digits)} ${unit} ${value > 0 ? 'more' : 'less'} than today`;
}

function dayToDay(results: ScenarioResults, option: OptionResult, current: OptionResult, horizon: number, f: ReadingFormat): string[] {
  const hoursPerDay = ((option.labourHoursPerYear[1] ?? 0) - (current.labourHoursPerYear[1] ?? 0)) / DAYS_PER_YEAR;
  const beddingPerWeek = ((option.beddingTonnesPerYear[1] ?? 0) - (current.beddingTonnesPerYear[1] ?? 0)) / WEEKS_PER_YEAR;
  const lines = [`Work: ${moreOrLess(hoursPerDay, f, 1, 'hours a day')}.`, `Bedding to buy and spread: ${moreOrLess(beddingPerWeek, f, 1, 'tonnes a week')}.`];
  let lowest = { year: 1, cash: Number.POSITIVE_INFINITY };
  for (let t = 1; t <= horizon; t++) {
    const cash = cashLeftAfterLoans(results, option, current, t);
    if (cash < lowest.cash) lowest = { year: t, cash };
  }
  const first = cashLeftAfterLoans(results, option, current, 1);
  const tail = lowest.year === 1 ? '' : `; the tightest year is year ${lowest.year} with ${f.money(lowest.cash)}`;
  lines.push(`Cash left for the farm after every loan payment: ${f.money(first)} in year 1${tail}.`);
  return lines;
}

/** The two or three inputs that move the best option's answer most, with the break-evens in words. */
function drivers(scenario: Scenario, best: OptionResult | undefined, currentName: string, sens: SensitivityResult | null, f: ReadingFormat, perKg: (price: number) => string): string[] {
  if (!best?.incremental) return [];
  const inc = best.incremental;
  const price = scenario.herd.milkPricePerKg;
  const out: string[] = [];
  const swings = sens?.options.find((o) => o.optionId === best.id)?.incrementalNpv ?? [];
  for (const swing of swings.slice(0, 3)) {
    const label = RISK_INPUT_LABELS[swing.key];
    let sentence = `${label}: from its low to its high value the ${best.name} ends between ${f.money(swing.atLow)} and ${f.money(swing.atHigh)} against ${currentName}.`;
    if (swing.key === 'milkPrice') {
      sentence +=
        inc.breakEvenMilkPrice === null
          ? ` No milk price up to ten times today's makes it as good as ${currentName}.`
          : inc.npv >= 0
            ? ` It stays ahead of ${currentName} while milk pays more than ${perKg(inc.breakEvenMilkPrice)} (today ${perKg(price)}).`
            : ` It only catches up with ${currentName} if milk pays ${perKg(inc.breakEvenMilkPrice)} (today ${perKg(price)}).`;
      const atThreshold = best.breakEvenMilkPriceForCoverage.atThreshold;
      if (atThreshold !== null) sentence += ` The bank's coverage of ${f.number(scenario.finance.coverageThreshold, 2)} holds while milk pays at least ${perKg(atThreshold)}.`;
    }
    if (swing.key === 'yieldResponse' && inc.breakEvenLyingResponse !== null) {
      sentence += ` Cows would need to give ${f.number(inc.breakEvenLyingResponse, 2)} kg more milk a day for each extra hour lying down for it to break even; ${f.number(scenario.herd.lyingResponseKgPerHour, 2)} kg is assumed.`;
    }
    out.push(sentence);
  }
  return out;
}

/** The kept risk run on one option's change: how often it loses money and where the middle run ends. */
function riskReading(risk: MonteCarloResult, optionId: string, currentName: string, f: ReadingFormat): string | null {
  const change = risk.options.find((o) => o.optionId === optionId)?.incrementalNpv;
  if (!change || change.probabilityNegative === null || change.p50 === null) return null;
  const middle = change.p50 >= 0 ? `${f.money(change.p50)} better off` : `${f.money(-change.p50)} worse off`;
  return `In the farm's risk run (${f.number(risk.drawsDone)} runs with prices, costs and yields varied) it leaves the family worse off than ${currentName} in ${f.percent(change.probabilityNegative)} of the runs; the middle run ends ${middle}.`;
}

/**
 * The summary; the options other than the current one ranked by the NPV of the change, best
 * first. `perKg` writes a milk price (money per kg, to the tenth of a cent); `risk` is the run
 * the farm kept on this version (null when none is kept or it is out of date).
 */
export function familySummary(
  scenario: Scenario,
  results: ScenarioResults,
  sens: SensitivityResult | null,
  f: ReadingFormat,
  perKg: (price: number) => string,
  risk: MonteCarloResult | null = null,
): FamilySummary {
  const current = results.options.find((o) => o.current) ?? results.options[0];
  const currentName = current?.name ?? 'the current option';
  const horizon = results.horizonYears;
  const ranked = candidatesByChange(results.options);
  const options = current
    ? ranked.map((o): FamilyOption => {
        const npv = o.incremental.npv;
        const better = npv >= 0;
        return {
          id: o.id,
          name: o.name,
          better,
          headline: better
            ? `leaves the family ${f.money(npv)} better off than ${currentName} over ${horizon} years, in today's money.`
            : `leaves the family ${f.money(-npv)} worse off than ${currentName} over ${horizon} years, in today's money.`,
          risk: risk ? riskReading(risk, o.id, currentName, f) : null,
          dayToDay: dayToDay(results, o, current, horizon, f),
        };
      })
    : [];
  const staying = current ? `Staying with ${currentName}: ${f.money(cashLeftAfterLoans(results, current, current, 1))} left for the farm after every loan payment in year 1.` : null;
  return {
    staying,
    question:
      ranked.length === 1
        ? `Should the farm stay with ${currentName} or change to ${ranked[0]?.name ?? 'the other option'}?`
        : `Should the farm stay with ${currentName} or change to one of these ${ranked.length} options?`,
    options,
    drivers: drivers(scenario, ranked[0], currentName, sens, f, perKg),
    riskNotRun: risk ? null : 'No risk run is kept on this version yet: how often each choice could lose money is not shown.',
  };
}

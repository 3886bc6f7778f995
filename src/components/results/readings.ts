/**
 * One-line plain readings of the engine's metrics ("pays back in year 7 of 20"), and the reason
 * a metric is not defined. Pure: the numbers come in, the words go out; formatting is passed in
 * so the farm's locale and currency are used.
 */
import { type IrrReason, type PaybackReason, signChanges } from '@shared/engine';

/** Formatters the readings use: money to the cent, percentages, plain numbers. */
export interface ReadingFormat {
  money(value: number): string;
  percent(fraction: number): string;
  number(value: number, digits?: number): string;
}

const WORDS = ['no', 'once', 'twice', 'three times', 'four times', 'five times', 'six times', 'seven times', 'eight times', 'nine times'];

/** "once", "twice", "three times" … "12 times": how often something happens, in words up to nine. */
export function timesInWords(count: number): string {
  return WORDS[count] ?? `${count} times`;
}

/** Sign changes along a cash-flow series, zeros skipped: the engine's own count. */
export { signChanges as countSignChanges } from '@shared/engine';

/**
 * Operating year (1-based) in which a payback of `years` falls: 6.3 → 7, 7 → 7. Cash flows fall
 * at the end of each year (docs/model.md), so a payback of exactly t years is reached in year t.
 */
export function paybackYear(years: number): number {
  return Math.max(1, Math.ceil(years - 1e-9));
}

/** Reading of a simple or discounted payback in years (null = never within the horizon). */
export function paybackReading(years: number | null, horizon: number, discounted = false, reason?: PaybackReason): string {
  const how = discounted ? ' on discounted cash flows' : '';
  if (reason === 'no-net-investment') return 'nothing to pay back: the change saves money at year 0';
  if (years === null) return `does not pay back${how} within the ${horizon}-year horizon`;
  if (years === 0) return 'nothing to pay back: no money is out at year 0';
  return `pays back${how} in year ${paybackYear(years)} of ${horizon}`;
}

/**
 * Payback from operations alone (no salvage or herd value at the end), in words: when it is
 * not reached, how much of the outlay the operations win back over the horizon.
 */
export function operationsPaybackReading(years: number | null, reason: PaybackReason | undefined, recoveredShare: number | null, horizon: number, f: ReadingFormat): string {
  if (reason === 'no-net-investment') return 'nothing to pay back: the change saves money at year 0';
  if (years !== null) return `the extra cash from running it pays the outlay back in year ${paybackYear(years)} of ${horizon}, before anything is sold at the end`;
  if (recoveredShare === null) return `not paid back from operations within the ${horizon}-year horizon`;
  if (recoveredShare <= 0) return `not paid back from operations: over ${horizon} years running it earns less cash than staying put, so none of the outlay comes back`;
  return `not paid back from operations: over ${horizon} years running it wins back ${f.percent(recoveredShare)} of the outlay; the rest rests on salvage and herd value at the end`;
}

/** Why an IRR is missing, in words, from the engine's reason and the flows themselves. */
export function irrUndefinedReading(reason: IrrReason | undefined, flows: readonly number[]): string {
  const changes = signChanges(flows);
  if (reason === 'no-sign-change' || changes === 0) {
    return 'IRR not defined: the cash flows never change sign, so no rate makes NPV zero';
  }
  if (reason === 'multiple-roots') {
    return `IRR not defined: cash flows change sign ${timesInWords(changes)}, so more than one rate makes NPV zero`;
  }
  return `IRR not defined: cash flows change sign ${timesInWords(changes)} but no rate between −99 % and 1 000 % makes NPV zero`;
}

/** Reading of an IRR against the discount rate. */
export function irrReading(irr: number | null, reason: IrrReason | undefined, flows: readonly number[], discountRate: number, f: ReadingFormat): string {
  if (irr === null) return irrUndefinedReading(reason, flows);
  if ((flows.find((cf) => cf !== 0) ?? 0) > 0) return `a borrowing rate of ${f.percent(irr)} a year: the change saves money first and pays it back later, so lower is better`;
  const compare = irr > discountRate ? 'above' : irr < discountRate ? 'below' : 'equal to';
  return `earns ${f.percent(irr)} a year, ${compare} the ${f.percent(discountRate)} discount rate`;
}

/** Reading of an NPV at the discount rate over the horizon. */
export function npvReading(npv: number, discountRate: number, horizon: number, f: ReadingFormat): string {
  if (npv === 0) return `the cash flows over ${horizon} years exactly repay their cost at ${f.percent(discountRate)}`;
  const more = npv > 0 ? 'more' : 'less';
  return `at ${f.percent(discountRate)}, the cash flows over ${horizon} years are worth ${f.money(Math.abs(npv))} ${more} than today's outlay`;
}

/** Reading of a MIRR (finance rate = loan rate, reinvestment rate = discount rate). */
export function mirrReading(mirr: number | null, financeRate: number, reinvestRate: number, f: ReadingFormat): string {
  if (mirr === null) return 'MIRR not defined: it needs at least one negative and one positive cash flow';
  return `${f.percent(mirr)} a year with outlays financed at ${f.percent(financeRate)} and returns reinvested at ${f.percent(reinvestRate)}`;
}

/** Reading of a profitability index. */
export function profitabilityIndexReading(index: number | null, f: ReadingFormat): string {
  if (index === null) return 'not defined: no money is out at year 0 to divide by';
  return `each ${f.money(1)} put in at year 0 brings back ${f.money(index)} in today's money`;
}

/** Reading of capital per stall. */
export function capitalPerStallReading(perStall: number | null, stalls: number, capitalTotal: number, f: ReadingFormat): string {
  if (perStall === null) return 'not defined: this option has no stalls';
  return `${f.money(capitalTotal)} in all for ${f.number(stalls)} stalls`;
}

/** Reading of the equivalent annual cost of capital per stall. */
export function equivalentAnnualCostReading(perStall: number | null, horizon: number, discountRate: number, f: ReadingFormat): string {
  if (perStall === null) return 'not defined: this option has no stalls';
  return `the capital, its replacements less salvage, costs ${f.money(perStall)} per stall each year over ${horizon} years at ${f.percent(discountRate)}`;
}

/** Reading of the lowest debt-service coverage against the lender's threshold. */
export function coverageReading(lowest: { year: number; value: number } | null, threshold: number, f: ReadingFormat): string {
  if (lowest === null) return 'not defined: no debt service falls due in any year';
  const value = f.number(lowest.value, 2);
  const limit = f.number(threshold, 2);
  const side = lowest.value < threshold ? `below the lender's ${limit}` : `at or above the lender's ${limit}`;
  return `coverage lowest in year ${lowest.year} at ${value} — ${side}`;
}

/** Reading of the break-even milk price against today's price. */
export function breakEvenMilkPriceReading(price: number | null, todayPrice: number, currentName: string, f: ReadingFormat): string {
  if (price === null) return `no milk price between 0 and ten times today's makes this option break even against ${currentName}`;
  const side = price <= todayPrice ? 'below' : 'above';
  return `breaks even against ${currentName} at ${f.money(price)} per kg, ${side} today's ${f.money(todayPrice)} per kg`;
}

/** Reading of the break-even lying-time milk response against the response assumed. */
export function breakEvenLyingResponseReading(
  response: number | null,
  reason: 'none-in-range' | 'same-lying-time' | undefined,
  assumed: number,
  currentName: string,
  f: ReadingFormat,
): string {
  if (reason === 'same-lying-time') return `not defined: the same lying time as ${currentName}, so the response does not matter`;
  if (response === null) return `no response between 0 and 5 kg/cow/day per hour makes this option break even against ${currentName}`;
  return `breaks even at ${f.number(response, 2)} kg/cow/day per extra hour of lying; ${f.number(assumed, 2)} is assumed`;
}

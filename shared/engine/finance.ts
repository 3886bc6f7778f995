import type Decimal from 'decimal.js';
import {
  Money,
  requireFinite,
  requireNonNegative,
  requirePositiveInteger,
  requireRate,
} from './money';
import { presentValue, presentValues, presentValueSignReach, signChanges, type SignReach } from './discounting';
import { findRoot } from './root';

// Conventions: rates are decimal fractions per period (0.08 = 8 %); flows[t] falls at the end of
// period t, flows[0] at t = 0 (today, not discounted) unless a function says otherwise.

function requireFlows(flows: readonly number[]): void {
  // The field's name is only written for a flow that fails: every IRR, payback and MIRR checks its flows.
  for (let t = 0; t < flows.length; t++) if (!Number.isFinite(flows[t])) requireFinite(`flows[${t}]`, flows[t] as number);
}

function requireNonEmptyFlows(flows: readonly number[]): void {
  if (flows.length === 0) throw new RangeError('flows must hold at least the year-0 flow');
  requireFlows(flows);
}

/** Present value of flows[t] / (1 + rate)^t for each t: flows[0] is at t = 0 (numpy / `financial` npv convention). */
export function discount(rate: number, flows: readonly number[]): number[] {
  requireRate('rate', rate);
  requireFlows(flows);
  return presentValues(rate, flows);
}

/** Running totals: element t is flows[0] + … + flows[t], same currency as the flows. */
export function cumulative(flows: readonly number[]): number[] {
  requireFlows(flows);
  let sum = 0;
  return flows.map((cf) => (sum += cf));
}

/** Net present value Σ flows[t] / (1 + rate)^t with flows[0] at t = 0, undiscounted (numpy / `financial` convention). */
export function npv(rate: number, flows: readonly number[]): number {
  requireRate('rate', rate);
  requireFlows(flows);
  return presentValue(rate, flows);
}

/**
 * Spreadsheet NPV(): Σ flows[i] / (1 + rate)^(i + 1), so the first value is discounted one
 * period; equals npv(rate, flows) / (1 + rate).
 */
export function spreadsheetNpv(rate: number, flows: readonly number[]): number {
  return npv(rate, flows) / (1 + rate);
}

export type IrrResult =
  | { value: number }
  | { value: null; reason: 'no-sign-change' | 'multiple-roots' | 'no-root'; roots?: number[] };

/** Lowest and highest rate searched for an IRR: −99 % to +1 000 % per period. */
export const IRR_RANGE = { lo: -0.99, hi: 10 } as const;

// Dense near the rates investments actually earn, coarse where NPV moves slowly.
const IRR_GRID: readonly number[] = (() => {
  const grid: number[] = [];
  for (let i = -99; i < -50; i++) grid.push(i / 100);
  for (let i = -500; i < 1000; i++) grid.push(i / 1000);
  for (let i = 50; i <= 500; i++) grid.push(i / 50);
  return grid;
})();

const ROOT_TOLERANCE = 1e-12;
const SAME_ROOT = 1e-9;

/**
 * Every root of NPV on the grid's brackets; signs are presentValue's (presentValueSignReach), each
 * root from a search on `f`. A rate inside the reach of the last rate evaluated has that rate's sign
 * (presentValueSignReach), so only the rates past it are evaluated: the same signs, brackets and
 * roots as evaluating every rate of the grid, at a fraction of the cost.
 */
function rootsOnGrid(flows: readonly number[], f: (rate: number) => number): number[] {
  const roots: number[] = [];
  const known: SignReach = { sign: 0, reach: 0 };
  let lo = IRR_GRID[0] ?? IRR_RANGE.lo;
  presentValueSignReach(lo, flows, known);
  let knownFrom = lo;
  let signLo = known.sign;
  if (signLo === 0) roots.push(lo);
  for (let i = 1; i < IRR_GRID.length; i++) {
    const hi = IRR_GRID[i] ?? IRR_RANGE.hi;
    if (!(hi - knownFrom <= known.reach)) {
      presentValueSignReach(hi, flows, known);
      knownFrom = hi;
    }
    const signHi = known.sign;
    if (signHi === 0) roots.push(hi);
    else if (signLo !== 0 && signLo !== signHi) {
      const root = findRoot(f, lo, hi, { tolerance: ROOT_TOLERANCE });
      if (root.value !== null) roots.push(root.value);
    }
    lo = hi;
    signLo = signHi;
  }
  return roots.filter((r, i) => i === 0 || r - (roots[i - 1] ?? r) > SAME_ROOT);
}

/**
 * Internal rate of return per period (flows[0] at t = 0): the rate in [−0.99, 10] where NPV = 0.
 * One sign change in the flows allows at most one root (Descartes' rule of signs on the
 * polynomial in 1/(1 + r)), so it is solved directly on the whole range; with several sign
 * changes NPV is scanned on a grid and every bracketed root refined. Returns `null` with a
 * reason, never NaN: 'no-sign-change', 'multiple-roots' (with the roots) or 'no-root'.
 */
export function irr(flows: readonly number[]): IrrResult {
  requireFlows(flows);
  const changes = signChanges(flows);
  if (changes === 0) return { value: null, reason: 'no-sign-change' };
  const f = (rate: number): number => presentValue(rate, flows);

  if (changes === 1) {
    const root = findRoot(f, IRR_RANGE.lo, IRR_RANGE.hi, { tolerance: ROOT_TOLERANCE });
    return root.value === null ? { value: null, reason: 'no-root' } : { value: root.value };
  }

  const roots = rootsOnGrid(flows, f);
  const [only] = roots;
  if (roots.length === 1 && only !== undefined) return { value: only };
  if (roots.length === 0) return { value: null, reason: 'no-root' };
  return { value: null, reason: 'multiple-roots', roots };
}

/**
 * Modified IRR per period, as spreadsheets define MIRR(): negative flows discounted to t = 0 at
 * financeRate, positive flows compounded to t = n at reinvestRate (n = flows.length − 1), then
 * (FV⁺ / |PV⁻|)^(1/n) − 1. `null` when the flows hold no positive or no negative value.
 */
export function mirr(flows: readonly number[], financeRate: number, reinvestRate: number): number | null {
  requireFlows(flows);
  requireRate('financeRate', financeRate);
  requireRate('reinvestRate', reinvestRate);
  const n = flows.length - 1;
  let pvNegative = 0;
  let fvPositive = 0;
  flows.forEach((cf, t) => {
    if (cf < 0) pvNegative += cf / (1 + financeRate) ** t;
    else fvPositive += cf * (1 + reinvestRate) ** (n - t);
  });
  if (pvNegative === 0 || fvPositive === 0) return null;
  return (fvPositive / -pvNegative) ** (1 / n) - 1;
}

/**
 * Simple payback in years (flows[0] at t = 0): the first year t whose cumulative flow is ≥ 0,
 * interpolated inside it as (t − 1) + remaining / flows[t], where remaining is the shortfall at
 * the end of year t − 1. 0 when flows[0] ≥ 0; `null` when never reached within the flows given.
 * A later dip back below zero does not undo the first payback.
 */
export function paybackYears(flows: readonly number[]): number | null {
  requireNonEmptyFlows(flows);
  let total = flows[0] ?? 0;
  if (total >= 0) return 0;
  for (let t = 1; t < flows.length; t++) {
    const cf = flows[t] ?? 0;
    const remaining = -total;
    total += cf;
    if (total >= 0) return t - 1 + remaining / cf;
  }
  return null;
}

/** Discounted payback in years: {@link paybackYears} on flows[t] / (1 + rate)^t. */
export function discountedPaybackYears(rate: number, flows: readonly number[]): number | null {
  requireNonEmptyFlows(flows);
  return paybackYears(discount(rate, flows));
}

/**
 * Profitability index (unitless): present value of flows[1..] at `rate`, divided by the
 * year-0 outlay |flows[0]|; above 1 means NPV > 0. `null` when flows[0] ≥ 0 (no outlay to divide by).
 */
export function profitabilityIndex(rate: number, flows: readonly number[]): number | null {
  requireRate('rate', rate);
  requireNonEmptyFlows(flows);
  const outlay = flows[0] ?? 0;
  if (outlay >= 0) return null;
  return (presentValue(rate, flows) - outlay) / -outlay;
}

function requireTerm(field: string, value: number): void {
  requireFinite(field, value);
  if (value <= 0) throw new RangeError(`${field} must be > 0 (got ${value})`);
}

/**
 * Capital recovery factor (per period): r / (1 − (1 + r)^−n), the level end-of-period payment
 * that repays 1 unit today over n periods; 1/n when r = 0.
 */
export function capitalRecoveryFactor(rate: number, years: number): number {
  requireRate('rate', rate);
  requireTerm('years', years);
  if (rate === 0) return 1 / years;
  // expm1/log1p keep precision for rates near zero, where (1 + r)^n − 1 would cancel.
  return rate / -Math.expm1(-years * Math.log1p(rate));
}

/** Equivalent annual cost (currency per year): presentCost × capital recovery factor at `rate` over `years`. */
export function equivalentAnnualCost(presentCost: number, rate: number, years: number): number {
  requireFinite('presentCost', presentCost);
  return presentCost * capitalRecoveryFactor(rate, years);
}

/**
 * Level end-of-period payment (currency per period, positive) that repays `principal` over
 * `periods` at `ratePerPeriod`; numpy's / `financial`'s pmt returns the same amount negated.
 */
export function levelPayment(principal: number, ratePerPeriod: number, periods: number): number {
  requireFinite('principal', principal);
  requireRate('ratePerPeriod', ratePerPeriod);
  requirePositiveInteger('periods', periods);
  return principal * capitalRecoveryFactor(ratePerPeriod, periods);
}

export type LoanInput = {
  /** Amount borrowed, currency ≥ 0. */
  principal: number;
  /** Nominal annual rate, e.g. 0.06; the periodic rate is annualRate / paymentsPerYear. */
  annualRate: number;
  /** Term in whole years, interest-only months included. */
  years: number;
  paymentsPerYear: 1 | 2 | 4 | 12;
  /** Months of interest only at the start; rounded up to whole payment periods. */
  interestOnlyMonths?: number;
};

export type LoanPayment = {
  /** Payment number, 1-based. */
  number: number;
  /** Loan year the payment falls in, 1-based. */
  year: number;
  payment: number;
  interest: number;
  principal: number;
  /** Balance after this payment. */
  balance: number;
};

export type LoanYear = {
  year: number;
  payment: number;
  interest: number;
  principal: number;
  closingBalance: number;
};

export type LoanSchedule = {
  payments: LoanPayment[];
  years: LoanYear[];
  totalInterest: number;
  totalPrincipal: number;
};

const PAYMENTS_PER_YEAR = [1, 2, 4, 12] as const;

/**
 * Checks a loan's inputs (a RangeError naming the field) and counts its payment periods: all of
 * them, and the interest-only ones at the start (ceil(months × paymentsPerYear / 12)).
 */
export function loanPeriods(input: LoanInput): { totalPeriods: number; interestOnlyPeriods: number } {
  const { principal, annualRate, years, paymentsPerYear, interestOnlyMonths = 0 } = input;
  requireNonNegative('principal', principal);
  requireNonNegative('annualRate', annualRate);
  requirePositiveInteger('years', years);
  if (!PAYMENTS_PER_YEAR.includes(paymentsPerYear)) {
    throw new RangeError(`paymentsPerYear must be 1, 2, 4 or 12 (got ${String(paymentsPerYear)})`);
  }
  requireNonNegative('interestOnlyMonths', interestOnlyMonths);
  const totalPeriods = years * paymentsPerYear;
  // Whole months × 1, 2, 4 or 12 over 12 is exact or at least 1/12 from a whole number, so
  // Math.ceil is exact there; other months go through decimal.js.
  const interestOnlyPeriods = Number.isInteger(interestOnlyMonths)
    ? Math.ceil((interestOnlyMonths * paymentsPerYear) / 12)
    : new Money(interestOnlyMonths).times(paymentsPerYear).div(12).ceil().toNumber();
  if (interestOnlyPeriods >= totalPeriods) {
    throw new RangeError(
      `interestOnlyMonths must leave at least one repayment period (got ${interestOnlyMonths} months in a ${years}-year loan)`,
    );
  }
  return { totalPeriods, interestOnlyPeriods };
}

/** Decimal level payment P·r / (1 − (1 + r)^−m), or P/m at r = 0, before rounding (currency per period). */
export function decimalLevelPayment(principal: Decimal, rate: Decimal, periods: number): Decimal {
  if (rate.isZero()) return principal.div(periods);
  return principal.times(rate).div(new Money(1).minus(rate.plus(1).pow(-periods)));
}

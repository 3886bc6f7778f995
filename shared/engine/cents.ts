// The ledger's rounding, tax depreciation and loan in whole cents held in doubles: they match the
// decimal.js references under tests/oracles (toCents, straightLine, decliningBalance,
// macrsSchedule, loanSchedule) to the cent without their cost, and property tests pin them there.
// decimal.js itself settles the rare half-cent ties here.

import Decimal from 'decimal.js';
import { decimalLevelPayment, loanPeriods, type LoanInput, type LoanPayment, type LoanSchedule } from './finance';
import { Money, roundCents } from './money';

/**
 * Whole cents (integer) of a currency amount, half-up with ties away from zero, read as decimal.js
 * reads a number (its shortest decimal form): 1.005 → 101, 570.37499999999994 → 57037. The
 * decimal ties k ± ½ cent, divided by 100 in binary, are the doubles those decimals parse to.
 * That holds while no other decimal of three places reads as the same double (|amount| < 2⁴²);
 * larger amounts go through decimal.js itself (exact while the cents stay below 2⁵³).
 */
export function wholeCents(amount: number): number {
  const magnitude = Math.abs(amount);
  if (!(magnitude < EXACT_BELOW)) return toWholeCents(roundCents(amount));
  const scaled = magnitude * 100;
  let cents = Math.round(scaled);
  // Far from a half cent the product's rounding error (under 2⁻⁵¹ of it) cannot change the answer.
  if (Math.abs(scaled - cents) < 0.5 - scaled * NEAR_HALF_RELATIVE) return amount < 0 ? -cents : cents;
  if (magnitude < (cents - 0.5) / 100) cents -= 1;
  else if (magnitude >= (cents + 0.5) / 100) cents += 1;
  return amount < 0 ? -cents : cents;
}

// Below 2⁴² a double's spacing is under 0.001, so a three-place decimal tie has a double of its own.
const EXACT_BELOW = 2 ** 42;
const NEAR_HALF_RELATIVE = 2 ** -48;

/** A currency amount rounded to cents (currency), half-up with ties away from zero, in floating point; equals the decimal.js toCents (tests/oracles/cents.ts). */
export function roundCentsFast(amount: number): number {
  // The common case in as little code as can be inlined at every call (this runs for every line
  // of every year of every Monte Carlo draw): below 2³⁶ the product errs by under 0.005 cents, so
  // an amount more than 0.025 cents away from a half cent rounds as Math.round says, and the same
  // away from zero on either side (a product and Math.round off a half are odd functions).
  // wholeNear, not Math.round: V8 settles Math.round's half with a branch taken half the time.
  const scaled = amount * 100;
  const cents = wholeNear(scaled);
  const off = scaled - cents;
  // Math.round's zero keeps the amount's sign (−0.001 → −0), and so does the amount × 0.
  if (off < QUICK_MARGIN && off > -QUICK_MARGIN && amount < QUICK_BELOW && amount > -QUICK_BELOW) return cents === 0 ? amount * 0 : cents / 100;
  return roundCentsNearHalf(amount);
}

/**
 * The whole number nearest x (ties to even) for |x| < 2⁵¹ (WHOLE_NEAR_BELOW), in two additions
 * and no branch: adding 1.5 × 2⁵² puts the sum where a double's spacing is 1, taking it away
 * again is exact. Beyond that range the result may miss or not be whole at all.
 */
export function wholeNear(x: number): number {
  return x + ROUNDER - ROUNDER;
}

const ROUNDER = 1.5 * 2 ** 52;
export const WHOLE_NEAR_BELOW = 2 ** 51;

/** Each amount rounded to cents in place, as {@link roundCentsFast} rounds it. */
export function roundCentsInPlace(amounts: Float64Array): void {
  for (let i = 0; i < amounts.length; i++) amounts[i] = roundCentsFast(amounts[i] as number);
}

/** {@link roundCentsFast} near a half cent, for large amounts and for NaN. */
function roundCentsNearHalf(amount: number): number {
  const magnitude = amount < 0 ? -amount : amount;
  // Past 2⁴² the cents themselves may pass 2⁵³, where a double no longer holds every whole number.
  return magnitude < EXACT_BELOW ? wholeCents(amount) / 100 : roundCents(amount).toNumber();
}

const QUICK_BELOW = 2 ** 36;
const QUICK_MARGIN = 0.475;

// Products of whole cents and a short decimal rate sit at least 1e-5 cents away from a half cent
// unless they are on it, far above the float error of the product. Large amounts widen the
// window with their own rounding error (a few parts in 1e16 per operation).
const TIE_WINDOW = 1e-6;
const TIE_RELATIVE = 1e-14;

/**
 * True when a non-negative amount in cents is (or may be, within float error) a half-cent tie.
 * There the answer depends on how the ledger's 40-digit decimals fell, so the caller computes
 * the ledger's own expression with decimal.js (rare: a handful of times per thousand
 * schedules); elsewhere Math.round is exact.
 */
function isTie(cents: number, window = Math.max(TIE_WINDOW, cents * TIE_RELATIVE)): boolean {
  return Math.abs(cents - Math.floor(cents) - 0.5) < window;
}

const currency = (cents: number): Decimal => new Money(cents).div(100);
const toWholeCents = (amount: Decimal): number => amount.times(100).toNumber();

/** Straight-line depreciation (currency/yr, cents), as the decimal.js straightLine (tests/oracles/depreciation.ts) with no salvage. */
export function straightLineFast(cost: number, life: number): number[] {
  const base = wholeCents(cost);
  // Whole cents over a whole life: a half cent there is exact in binary too (k + ½ needs only one
  // binary place), and anything else sits at least 1/(2 × life) cents from one, so Math.round
  // rounds exactly as decimal.js half-up does.
  const yearly = Math.round(base / life);
  const amounts = new Array<number>(life);
  for (let i = 0; i < life - 1; i++) amounts[i] = yearly / 100;
  amounts[life - 1] = (base - yearly * (life - 1)) / 100;
  return amounts;
}

/**
 * A US MACRS table's depreciation (currency/yr, cents), as the decimal.js macrsSchedule (tests/oracles/depreciation.ts): the
 * cost in whole cents × each year's percentage, rounded half-up, the last year taking the rest.
 */
export function macrsFast(cost: number, percentages: readonly number[]): number[] {
  const total = wholeCents(cost);
  let booked = 0;
  return percentages.map((pct, i) => {
    const amount = i === percentages.length - 1 ? total - booked : wholeCents((total * pct) / 10000);
    booked += amount;
    return amount / 100;
  });
}

// The decimal.js decliningBalance's amount for one year, in decimal.js (tie years only).
function ledgerDecliningAmount(book: number, life: number, factor: number, year: number): number {
  const exactBook = currency(book);
  const larger = Money.max(exactBook.times(new Money(factor).div(life)), exactBook.div(life - year + 1));
  return toWholeCents(roundCents(Money.min(larger, exactBook)));
}

/** Declining balance with a switch to straight line (currency/yr, cents), as the decimal.js decliningBalance (tests/oracles/depreciation.ts). */
export function decliningBalanceFast(cost: number, life: number, factor: number): number[] {
  const total = wholeCents(cost);
  const amounts = new Array<number>(life);
  let book = total;
  for (let year = 1; year <= life; year++) {
    let amount: number;
    if (year === life) amount = book;
    else {
      const larger = Math.max((book * factor) / life, book / (life - year + 1));
      amount = Math.min(isTie(larger) ? ledgerDecliningAmount(book, life, factor, year) : Math.round(larger), book);
    }
    book -= amount;
    amounts[year - 1] = amount / 100;
  }
  return amounts;
}

export interface LoanYearsFast {
  /** Interest, principal and closing balance per loan year 1..term (currency), index = year − 1. */
  interest: number[];
  principal: number[];
  closingBalance: number[];
}

/**
 * The decimal.js loanSchedule's interest for one period, in decimal.js (tie periods only), on a
 * balance in whole cents at the period rate `new Money(annualRate).div(paymentsPerYear)`: the
 * balance in cents × the rate is the ledger's product in currency × 100 to the same 40
 * significant digits, so rounding it to a whole number is the ledger's rounding to cents.
 */
function ledgerInterest(balance: number, periodRate: Decimal): number {
  return new Money(balance).times(periodRate).toDecimalPlaces(0, Decimal.ROUND_HALF_UP).toNumber();
}

/**
 * The ledger's period rate `new Money(annualRate).div(paymentsPerYear)`, remembered for the last
 * rate asked: every loan of a Monte Carlo run shares it, and the division is most of what a tie
 * costs. A decimal.js value never changes, so the answer is the same whatever was asked before.
 */
function ledgerPeriodRate(annualRate: number, paymentsPerYear: number): Decimal {
  if (!Object.is(annualRate, remembered.annualRate) || paymentsPerYear !== remembered.paymentsPerYear || !remembered.rate) {
    remembered.annualRate = annualRate;
    remembered.paymentsPerYear = paymentsPerYear;
    remembered.rate = new Money(annualRate).div(paymentsPerYear);
  }
  return remembered.rate;
}

const remembered: { annualRate: number; paymentsPerYear: number; rate: Decimal | null } = { annualRate: Number.NaN, paymentsPerYear: 0, rate: null };

// The level payment's float formula errs by up to a few parts in 1e14 over 480 periods.
const LEVEL_TIE_RELATIVE = 1e-12;
const TINY_RATE = 1e-9;

/** The decimal.js loanSchedule's level payment (whole cents) on `balance` cents over `periods`. */
function levelPaymentCents(balance: number, annualRate: number, paymentsPerYear: number, periods: number): number {
  const rate = annualRate / paymentsPerYear;
  const raw = rate === 0 ? balance / periods : (balance * rate) / -Math.expm1(-periods * Math.log1p(rate));
  // Below a rate of 1e-9 the 40-digit (1 + r)^−m is no longer distinct from 1 the way a double's is.
  const tinyRate = annualRate > 0 && annualRate < TINY_RATE;
  if (!tinyRate && !isTie(raw, Math.max(TIE_WINDOW, raw * LEVEL_TIE_RELATIVE))) return Math.round(raw);
  return toWholeCents(roundCents(decimalLevelPayment(currency(balance), new Money(annualRate).div(paymentsPerYear), periods)));
}

/**
 * The decimal.js loanSchedule's interest for one period (whole cents) on `balance` cents. Every
 * period of a loan waits on the last, so the walk is latency-bound: the nearest whole cent by
 * wholeNear, with no Math.floor or unpredictable branch on that path. Off a tie the nearest cent
 * is the half-up one; the tie test is isTie's, |fraction − ½| < window. From 2⁵¹ cents of
 * interest up (the product is never negative), where wholeNear may miss, the window (from the
 * first, largest balance) is over 22 cents, so every period goes to decimal.js.
 */
function periodInterestCents(balance: number, periodRate: number, window: number, annualRate: number, paymentsPerYear: number): number {
  // A product instead of the ledger's quotient: the two differ by an ulp or so, far inside the
  // tie window, so the rounding and the tie test decide every period alike.
  const raw = balance * periodRate;
  const nearest = wholeNear(raw);
  const off = raw - nearest;
  return 0.5 - Math.abs(off) < window ? ledgerInterest(balance, ledgerPeriodRate(annualRate, paymentsPerYear)) : nearest;
}

/** Principal repaid in payment `number` (1-based, whole cents): none while interest only, the whole balance at the last. */
function periodPrincipalCents(number: number, balance: number, interest: number, level: number, interestOnlyPeriods: number, totalPeriods: number): number {
  if (number <= interestOnlyPeriods) return 0;
  if (number === totalPeriods) return balance;
  // A rounded-up level payment on a tiny loan could overpay before the last period.
  const principal = level - interest;
  return principal > balance ? balance : principal;
}

/** The first period's tie window: the balance only falls, so it covers every later one. */
function tieWindowOf(balance: number, annualRate: number, paymentsPerYear: number): number {
  return Math.max(TIE_WINDOW, ((balance * annualRate) / paymentsPerYear) * TIE_RELATIVE);
}

/** One loan walked period by period in whole cents, with its payment table. */
interface CentsSchedule {
  /** Per loan year, index = year − 1 (currency, whole cents). */
  interest: number[];
  principal: number[];
  payment: number[];
  closingBalance: number[];
  payments: LoanPayment[];
  /** Whole cents. */
  totalInterest: number;
  loan: number;
}

function scheduleInCents(input: LoanInput, totalPeriods: number, interestOnlyPeriods: number): CentsSchedule {
  const { annualRate, years, paymentsPerYear } = input;
  const interest = new Array<number>(years).fill(0);
  const principal = new Array<number>(years).fill(0);
  const payment = new Array<number>(years).fill(0);
  const closingBalance = new Array<number>(years).fill(0);
  const payments: LoanPayment[] = [];
  const loan = wholeCents(input.principal);
  let balance = loan;
  let totalInterest = 0;
  if (balance === 0) return { interest, principal, payment, closingBalance, payments, totalInterest, loan };
  const level = levelPaymentCents(balance, annualRate, paymentsPerYear, totalPeriods - interestOnlyPeriods);
  const window = tieWindowOf(balance, annualRate, paymentsPerYear);
  const periodRate = annualRate / paymentsPerYear;
  let number = 0;
  for (let year = 0; year < years; year++) {
    let yearInterest = 0;
    let yearPrincipal = 0;
    for (let k = 0; k < paymentsPerYear; k++) {
      number++;
      const periodInterest = periodInterestCents(balance, periodRate, window, annualRate, paymentsPerYear);
      const periodPrincipal = periodPrincipalCents(number, balance, periodInterest, level, interestOnlyPeriods, totalPeriods);
      balance -= periodPrincipal;
      yearInterest += periodInterest;
      yearPrincipal += periodPrincipal;
      payments.push({
        number,
        year: year + 1,
        payment: (periodInterest + periodPrincipal) / 100,
        interest: periodInterest / 100,
        principal: periodPrincipal / 100,
        balance: balance / 100,
      });
    }
    interest[year] = yearInterest / 100;
    principal[year] = yearPrincipal / 100;
    payment[year] = (yearInterest + yearPrincipal) / 100;
    closingBalance[year] = balance / 100;
    totalInterest += yearInterest;
  }
  return { interest, principal, payment, closingBalance, payments, totalInterest, loan };
}

/**
 * Yearly interest and principal of a level-payment loan (currency, cents), as loanScheduleFast
 * gives them, without the payment table; inputs as the scenario schema allows them.
 */
export function loanYearsFast(principal: number, annualRate: number, years: number, paymentsPerYear: 1 | 2 | 4 | 12, interestOnlyMonths: number): LoanYearsFast {
  return loanYearsSideBySide([principal], annualRate, years, paymentsPerYear, interestOnlyMonths)[0] as LoanYearsFast;
}

/**
 * {@link loanYearsFast} of several loans on the same terms (index = loan), the same cents, walked
 * side by side a year at a time: each loan's periods wait on one another, the loans' do not, so
 * the processor works on several at once (a Monte Carlo draw walks every option's loan at its terms).
 */
export function loanYearsSideBySide(principals: readonly number[], annualRate: number, years: number, paymentsPerYear: 1 | 2 | 4 | 12, interestOnlyMonths: number): LoanYearsFast[] {
  const loans = principals.length;
  let totalPeriods = 0;
  let interestOnlyPeriods = 0;
  for (const principal of principals) ({ totalPeriods, interestOnlyPeriods } = loanPeriods({ principal, annualRate, years, paymentsPerYear, interestOnlyMonths }));
  const results = principals.map((): LoanYearsFast => ({ interest: new Array<number>(years).fill(0), principal: new Array<number>(years).fill(0), closingBalance: new Array<number>(years).fill(0) }));
  // Only the loans that borrow something are walked (a loan of 0 owes nothing any year).
  const walked: number[] = [];
  const balance = new Float64Array(loans);
  const level = new Float64Array(loans);
  const window = new Float64Array(loans);
  for (let j = 0; j < loans; j++) {
    const cents = wholeCents(principals[j] as number);
    if (cents === 0) continue;
    walked.push(j);
    balance[j] = cents;
    level[j] = levelPaymentCents(cents, annualRate, paymentsPerYear, totalPeriods - interestOnlyPeriods);
    window[j] = tieWindowOf(cents, annualRate, paymentsPerYear);
  }
  const periodRate = annualRate / paymentsPerYear;
  for (let year = 0; year < years; year++) {
    // Year by year, each loan's periods of the year with its balance in a local: the processor
    // overlaps one loan's periods with the next loan's as far as it reaches.
    for (const j of walked) {
      let owed = balance[j] as number;
      let yearInterest = 0;
      let yearPrincipal = 0;
      const loanLevel = level[j] as number;
      const loanWindow = window[j] as number;
      for (let k = 0, number = year * paymentsPerYear + 1; k < paymentsPerYear; k++, number++) {
        const interest = periodInterestCents(owed, periodRate, loanWindow, annualRate, paymentsPerYear);
        const principal = periodPrincipalCents(number, owed, interest, loanLevel, interestOnlyPeriods, totalPeriods);
        owed -= principal;
        yearInterest += interest;
        yearPrincipal += principal;
      }
      balance[j] = owed;
      const result = results[j] as LoanYearsFast;
      result.interest[year] = yearInterest / 100;
      result.principal[year] = yearPrincipal / 100;
      result.closingBalance[year] = owed / 100;
    }
  }
  return results;
}

/**
 * The loan schedule in whole cents held in doubles (currency, every amount in cents), equal to
 * the decimal.js loanSchedule in tests/oracles/loan-schedule.ts: the same payments, years and totals to the last cent, and the same RangeErrors.
 * Interest-only periods first, the level payment rounded to cents, interest rounded each
 * period half-up, the last payment clearing the balance; decimal.js settles half-cent ties.
 */
export function loanScheduleFast(input: LoanInput): LoanSchedule {
  const { totalPeriods, interestOnlyPeriods } = loanPeriods(input);
  const cents = scheduleInCents(input, totalPeriods, interestOnlyPeriods);
  if (cents.loan === 0) return { payments: [], years: [], totalInterest: 0, totalPrincipal: 0 };
  return {
    payments: cents.payments,
    years: cents.interest.map((interest, i) => ({
      year: i + 1,
      payment: cents.payment[i] ?? 0,
      interest,
      principal: cents.principal[i] ?? 0,
      closingBalance: cents.closingBalance[i] ?? 0,
    })),
    totalInterest: cents.totalInterest / 100,
    totalPrincipal: cents.loan / 100,
  };
}

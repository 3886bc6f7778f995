// Floating-point twins of the decimal.js ledger functions (money.ts, depreciation.ts,
// finance.ts loanSchedule) for the fast path and the break-even search: they work in whole
// cents held in doubles, so they match the decimal ledger to the cent without its cost.
// Tests pin them to the decimal originals.

import Decimal from 'decimal.js';
import { Money, roundCents } from './money';

/**
 * Whole cents (integer) of a currency amount, half-up with ties away from zero, read as decimal.js
 * reads a number (its shortest decimal form): 1.005 → 101, 570.37499999999994 → 57037. The
 * decimal ties k ± ½ cent, divided by 100 in binary, are the doubles those decimals parse to.
 */
export function wholeCents(amount: number): number {
  const magnitude = Math.abs(amount);
  let cents = Math.round(magnitude * 100);
  if (magnitude < (cents - 0.5) / 100) cents -= 1;
  else if (magnitude >= (cents + 0.5) / 100) cents += 1;
  return amount < 0 ? -cents : cents;
}

/** A currency amount rounded to cents (currency), half-up with ties away from zero, in floating point. */
export function roundCentsFast(amount: number): number {
  return wholeCents(amount) / 100;
}

// Products of whole cents and a short decimal rate sit at least 1e-5 cents away from a half cent
// unless they are on it, far above the float error of the product.
const TIE_WINDOW = 1e-6;

/**
 * True when a non-negative amount in cents is a half-cent tie. There the answer depends on how
 * the ledger's 40-digit decimals fell, so the caller computes the ledger's own expression with
 * decimal.js (rare: a handful of times per thousand schedules); elsewhere Math.round is exact.
 */
function isTie(cents: number): boolean {
  return Math.abs(cents - Math.floor(cents) - 0.5) < TIE_WINDOW;
}

const currency = (cents: number): Decimal => new Money(cents).div(100);
const toWholeCents = (amount: Decimal): number => amount.times(100).toNumber();

/** Straight-line depreciation (currency/yr, cents), as depreciation.ts straightLine with no salvage. */
export function straightLineFast(cost: number, life: number): number[] {
  const base = wholeCents(cost);
  const raw = base / life;
  const yearly = isTie(raw) ? toWholeCents(roundCents(currency(base).div(life))) : Math.round(raw);
  const amounts = new Array<number>(life);
  for (let i = 0; i < life - 1; i++) amounts[i] = yearly / 100;
  amounts[life - 1] = (base - yearly * (life - 1)) / 100;
  return amounts;
}

// depreciation.ts decliningBalance's amount for one year, in decimal.js (tie years only).
function ledgerDecliningAmount(book: number, life: number, factor: number, year: number): number {
  const exactBook = currency(book);
  const larger = Money.max(exactBook.times(new Money(factor).div(life)), exactBook.div(life - year + 1));
  return toWholeCents(roundCents(Money.min(larger, exactBook)));
}

/** Declining balance with a switch to straight line (currency/yr, cents), as depreciation.ts decliningBalance. */
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

// finance.ts loanSchedule's interest for one period, in decimal.js (tie periods only).
function ledgerInterest(balance: number, annualRate: number, paymentsPerYear: number): number {
  return toWholeCents(roundCents(currency(balance).times(new Money(annualRate).div(paymentsPerYear))));
}

/**
 * Yearly interest and principal of a level-payment loan (currency, cents), as finance.ts
 * loanSchedule: interest-only periods first, the level payment rounded to cents, interest
 * rounded each period, the last payment clearing the balance.
 */
export function loanYearsFast(principal: number, annualRate: number, years: number, paymentsPerYear: number, interestOnlyMonths: number): LoanYearsFast {
  const interest = new Array<number>(years).fill(0);
  const repaid = new Array<number>(years).fill(0);
  const closingBalance = new Array<number>(years).fill(0);
  let balance = wholeCents(principal);
  if (balance === 0) return { interest, principal: repaid, closingBalance };
  const totalPeriods = years * paymentsPerYear;
  const interestOnlyPeriods = Math.ceil((interestOnlyMonths * paymentsPerYear) / 12);
  const rate = annualRate / paymentsPerYear;
  const periods = totalPeriods - interestOnlyPeriods;
  const level = Math.round(rate === 0 ? balance / periods : (balance * rate) / -Math.expm1(-periods * Math.log1p(rate)));
  let number = 0;
  for (let year = 0; year < years; year++) {
    let yearInterest = 0;
    let yearPrincipal = 0;
    for (let k = 0; k < paymentsPerYear; k++) {
      number++;
      const raw = (balance * annualRate) / paymentsPerYear;
      const periodInterest = isTie(raw) ? ledgerInterest(balance, annualRate, paymentsPerYear) : Math.round(raw);
      let periodPrincipal: number;
      if (number <= interestOnlyPeriods) periodPrincipal = 0;
      else if (number === totalPeriods) periodPrincipal = balance;
      else periodPrincipal = Math.min(level - periodInterest, balance);
      balance -= periodPrincipal;
      yearInterest += periodInterest;
      yearPrincipal += periodPrincipal;
    }
    interest[year] = yearInterest / 100;
    repaid[year] = yearPrincipal / 100;
    closingBalance[year] = balance / 100;
  }
  return { interest, principal: repaid, closingBalance };
}

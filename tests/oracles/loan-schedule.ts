/**
 * The decimal.js loan schedule: the reference `loanScheduleFast` (shared/engine/cents.ts) is
 * pinned to by property tests. Kept under tests: the product runs the fast schedule.
 */
import type Decimal from 'decimal.js';
import { decimalLevelPayment, loanPeriods, type LoanInput, type LoanPayment, type LoanSchedule, type LoanYear } from '../../shared/engine/finance';
import { Money, roundCents } from '../../shared/engine/money';

/**
 * Loan schedule in currency units, every amount in exact cents (decimal.js, half-up; the
 * principal itself is first rounded to cents).
 * Interest-only periods (ceil(months × paymentsPerYear / 12)) pay interest and no principal;
 * the rest pay the level payment for the remaining periods rounded to cents, with interest
 * rounded to cents each period; the last payment absorbs rounding so principal repaid equals
 * the loan exactly and the closing balance is 0.00. Payments fall at the end of each period.
 */
export function loanSchedule(input: LoanInput): LoanSchedule {
  const { principal, annualRate, paymentsPerYear } = input;
  const { totalPeriods, interestOnlyPeriods } = loanPeriods(input);

  let balance = roundCents(principal);
  if (balance.isZero()) return { payments: [], years: [], totalInterest: 0, totalPrincipal: 0 };

  const rate = new Money(annualRate).div(paymentsPerYear);
  const loan = balance;
  const level = roundCents(decimalLevelPayment(balance, rate, totalPeriods - interestOnlyPeriods));
  const payments: LoanPayment[] = [];
  const yearly: LoanYear[] = [];
  let totalInterest = new Money(0);
  let yearPayment = new Money(0);
  let yearInterest = new Money(0);
  let yearPrincipal = new Money(0);

  for (let number = 1; number <= totalPeriods; number++) {
    const interest = roundCents(balance.times(rate));
    let repaid: Decimal;
    if (number <= interestOnlyPeriods) repaid = new Money(0);
    else if (number === totalPeriods) repaid = balance;
    // A rounded-up level payment on a tiny loan could overpay before the last period.
    else repaid = Money.min(level.minus(interest), balance);
    const payment = interest.plus(repaid);
    balance = balance.minus(repaid);
    totalInterest = totalInterest.plus(interest);
    yearPayment = yearPayment.plus(payment);
    yearInterest = yearInterest.plus(interest);
    yearPrincipal = yearPrincipal.plus(repaid);
    const year = Math.ceil(number / paymentsPerYear);
    payments.push({
      number,
      year,
      payment: payment.toNumber(),
      interest: interest.toNumber(),
      principal: repaid.toNumber(),
      balance: balance.toNumber(),
    });
    if (number % paymentsPerYear === 0) {
      yearly.push({
        year,
        payment: yearPayment.toNumber(),
        interest: yearInterest.toNumber(),
        principal: yearPrincipal.toNumber(),
        closingBalance: balance.toNumber(),
      });
      yearPayment = new Money(0);
      yearInterest = new Money(0);
      yearPrincipal = new Money(0);
    }
  }

  return {
    payments,
    years: yearly,
    totalInterest: totalInterest.toNumber(),
    totalPrincipal: loan.toNumber(),
  };
}

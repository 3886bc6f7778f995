import type { Finance } from '../schema';

/**
 * Interest during construction (currency): the loan drawn evenly over the construction period,
 * so on average half of it is out, at the loan rate: loan × rate × months ÷ 12 ÷ 2 (simple
 * interest on the average drawn balance; common practice, no source). 0 without a period.
 */
export function interestDuringConstruction(loan: number, finance: Pick<Finance, 'interestRate' | 'constructionMonths'>): number {
  if (loan <= 0 || finance.constructionMonths <= 0) return 0;
  return (loan * finance.interestRate * finance.constructionMonths) / 12 / 2;
}

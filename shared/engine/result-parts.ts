/**
 * A scenario's results in two parts: the summary every screen reads (metrics, coverage, stress,
 * sources and uses, the loan by year) and the detail only the yearly and loan tables need (each
 * option's yearly lines and its loan payment by payment), which is most of the bytes.
 */
import type { LoanPayment } from './finance';
import type { OptionResult, ScenarioResults, YearLine } from './results';

/** An option without its yearly lines and its loan's payments. */
export type OptionSummary = Omit<OptionResult, 'years' | 'loan'> & { loan: Omit<OptionResult['loan'], 'payments'> };

export interface ScenarioResultsSummary extends Omit<ScenarioResults, 'options'> {
  options: OptionSummary[];
}

/** One option's yearly lines and loan payments. */
export interface OptionDetail {
  id: string;
  years: YearLine[];
  loanPayments: LoanPayment[];
}

export function splitResults(results: ScenarioResults): { summary: ScenarioResultsSummary; detail: OptionDetail[] } {
  const options: OptionSummary[] = [];
  const detail: OptionDetail[] = [];
  for (const option of results.options) {
    const { years, loan, ...rest } = option;
    const { payments, ...loanByYear } = loan;
    options.push({ ...rest, loan: loanByYear });
    detail.push({ id: option.id, years, loanPayments: payments });
  }
  return { summary: { ...results, options }, detail };
}

/** The whole option again from its summary and its detail. */
export function joinOption(summary: OptionSummary, detail: OptionDetail): OptionResult {
  return { ...summary, years: detail.years, loan: { ...summary.loan, payments: detail.loanPayments } };
}

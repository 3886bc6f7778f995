import { z } from 'zod';
import { choice, flag, money, quantity, rate } from './fields';
import type { Source } from './option';

/** Lender's minimum debt-service coverage when the farm has not entered its lender's (ratio; common practice, no source). */
export const DEFAULT_COVERAGE_THRESHOLD = 1.25;

export const financeSchema = z
  .object({
    equity: money('Equity', 'Own cash put into the capital (currency)').default(0),
    grants: money('Grants', 'Capital grants received at year 0 (currency)').default(0),
    loanAmount: money('Loan amount', 'Loan principal (currency)')
      .nullable()
      .default(null)
      .describe('Loan principal; null = capital − equity − grants, floored at 0; never more than capital − grants (currency)'),
    interestRate: rate('Interest rate', 0, 0.3, 'Nominal loan interest rate (fraction per year, 0.06 = 6 %)'),
    termYears: quantity('Loan term', 'years', 1, 40, 'Loan term (years)', { int: true }),
    paymentsPerYear: z
      .union([z.literal(1), z.literal(2), z.literal(4), z.literal(12)], {
        error: 'Payments per year must be 1, 2, 4 or 12',
      })
      .default(12)
      .describe('Loan payments per year (1, 2, 4 or 12)'),
    interestOnlyMonths: quantity('Interest-only period', 'months', 0, 479, 'Months at the start of the loan with interest only (months)', { int: true }).default(0),
    discountRate: rate('Discount rate', 0, 0.3, 'Nominal discount rate for NPV (fraction per year)'),
    taxRate: rate('Tax rate', 0, 0.6, 'Income tax rate; 0 = pre-tax analysis (fraction)').default(0),
    depreciation: choice('Depreciation method', ['straight-line', 'declining-balance'], 'Tax depreciation of capital lines over each life').default('straight-line'),
    decliningBalanceFactor: quantity('Declining-balance factor', '', 1, 3, 'Declining-balance factor (2 = 200 % DB), switching to straight line when larger').default(2),
    grantsReduceDepreciableBase: flag('Grants reduce the depreciable base', 'True: grants reduce the tax depreciation of the year-0 capital pro rata').default(false),
    lossesOffsetOtherIncome: flag('Losses offset other income', 'True: a taxable loss saves tax that year against other farm income; false: losses carry forward').default(true),
    constructionMonths: quantity('Construction period', 'months', 0, 36, 'Months from the first loan draw to the end of construction (year 0); 0 = no interest during construction', { int: true }).default(0),
    interestDuringConstruction: choice('Interest during construction', ['capitalised', 'paid'], "'capitalised' = added to the loan; 'paid' = paid from farm cash at year 0").default('capitalised'),
    feedStockMonths: quantity('Feed stock', 'months', 0, 12, "Months of the first year's extra feed (against the current option) bought into store before year 1: working capital", { int: true }).default(6),
    coverageThreshold: quantity('Coverage threshold', '', 0.5, 5, "Lender's minimum debt-service coverage ratio (ratio)").default(DEFAULT_COVERAGE_THRESHOLD),
  }, { error: 'Finance must be an object with its fields' })
  .superRefine((finance, ctx) => {
    // The schedule pays interest only for whole payment periods, rounded up.
    const interestOnlyPeriods = Math.ceil((finance.interestOnlyMonths * finance.paymentsPerYear) / 12);
    if (interestOnlyPeriods >= finance.termYears * finance.paymentsPerYear) {
      ctx.addIssue({
        code: 'custom',
        path: ['interestOnlyMonths'],
        message: `Interest-only period must leave at least one repayment in the ${finance.termYears}-year loan term`,
      });
    }
  })
  .describe('Finance, discounting and tax');

export type Finance = z.infer<typeof financeSchema>;

/**
 * Finance terms of a new scenario before the farm enters its own (rates as fractions per year,
 * term in years): planning assumptions, each tagged in DEFAULT_FINANCE_SOURCES.
 */
export const DEFAULT_FINANCE: Finance = {
  equity: 0,
  grants: 0,
  loanAmount: null,
  interestRate: 0.055,
  termYears: 20,
  paymentsPerYear: 12,
  interestOnlyMonths: 0,
  discountRate: 0.06,
  taxRate: 0,
  depreciation: 'straight-line',
  decliningBalanceFactor: 2,
  grantsReduceDepreciableBase: false,
  lossesOffsetOtherIncome: true,
  constructionMonths: 0,
  interestDuringConstruction: 'capitalised',
  feedStockMonths: 6,
  coverageThreshold: DEFAULT_COVERAGE_THRESHOLD,
};

const assumption = (note: string): Source => ({ kind: 'assumption', note });

/** Where each default finance term comes from. */
export const DEFAULT_FINANCE_SOURCES: Record<keyof Finance, Source> = {
  equity: assumption('no own cash put in until the farm enters it'),
  grants: assumption('no grant until the farm enters one'),
  loanAmount: assumption('borrow what the capital needs after equity and grants'),
  interestRate: assumption('a planning rate for a farm building loan, 5.5 % a year'),
  termYears: assumption('a 20-year building loan'),
  paymentsPerYear: assumption('monthly payments'),
  interestOnlyMonths: assumption('repayments start at once'),
  discountRate: assumption('a planning discount rate of 6 % a year, above the loan rate'),
  taxRate: assumption('pre-tax analysis until the farm enters its tax rate'),
  depreciation: assumption('straight line over each line’s life'),
  decliningBalanceFactor: assumption('200 % declining balance when that method is chosen'),
  grantsReduceDepreciableBase: assumption('grants do not reduce the depreciable base'),
  lossesOffsetOtherIncome: assumption('a loss on the project saves tax on other farm income'),
  constructionMonths: assumption('no construction period entered: no interest during construction'),
  interestDuringConstruction: assumption('interest during construction is added to the loan'),
  feedStockMonths: assumption('half a year of the extra feed in store before the first housed season'),
  coverageThreshold: { kind: 'common-practice', note: 'lenders commonly ask for a debt-service coverage of at least 1.25; common practice, no source' },
};

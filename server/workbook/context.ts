/** What every sheet builder of the lender workbook shares: inputs, formats, sheet names and defined names. */
import type ExcelJS from 'exceljs';
import type { OptionResult, ScenarioResults } from '../../shared/engine/index.js';
import type { Scenario } from '../../shared/schema/index.js';
import { safeSheetName, wholeWordSheetName, type Formats } from './layout.js';

/** One option as the workbook lays it out: its engine result and the names of its sheets and cells. */
export interface OptionLayout {
  /** 1-based position, used in defined names (Opt1_NPV). */
  number: number;
  result: OptionResult;
  /** Name of its cash-flow sheet. */
  cashFlowSheet: string;
}

export interface WorkbookContext {
  workbook: ExcelJS.Workbook;
  scenario: Scenario;
  results: ScenarioResults;
  formats: Formats;
  horizon: number;
  options: OptionLayout[];
  current: OptionLayout;
  /** Capital lines backed by quotes with an amount, by line id: the Assumptions sheet tags their cost "Quote". */
  quotes?: ReadonlyMap<string, { total: number; files: string[] }>;
}

/** Named input cells on the Assumptions sheet that formulas use (workbook-level defined names). */
export const INPUT_NAMES = {
  discountRate: 'DiscountRate',
  interestRate: 'InterestRate',
  paymentsPerYear: 'PaymentsPerYear',
  termYears: 'LoanTermYears',
  coverageThreshold: 'CoverageThreshold',
  milkPrice: 'MilkPrice',
  milkPriceGrowth: 'MilkPriceGrowth',
  existingCash: 'ExistingCashForDebtService',
  existingDebt: 'ExistingDebtPayments',
  herdMarginInExistingCash: 'HerdMarginInExistingCash',
  milkPriceIndex: 'MilkPriceIndex',
} as const;

/** Defined-name suffix of each option's milk quality premium or penalty (Opt1_MilkQualityPrice). */
export const MILK_QUALITY_PRICE = 'MilkQualityPrice';

/** Defined name of one option's key cell or row, e.g. optionName(2, 'NPV') → 'Opt2_NPV'. */
export function optionName(option: OptionLayout | number, key: string): string {
  const n = typeof option === 'number' ? option : option.number;
  return `Opt${n}_${key}`;
}

/** Adds a workbook-level defined name for an absolute reference such as `'Cover'!$B$3`. */
export function defineName(workbook: ExcelJS.Workbook, name: string, reference: string): void {
  workbook.definedNames.add(reference, name);
}

/** Lays the options out in scenario order, each with a unique cash-flow sheet name. */
export function layoutOptions(results: ScenarioResults): OptionLayout[] {
  const used = new Set<string>();
  return results.options.map((result, index) => {
    const number = index + 1;
    let sheet = wholeWordSheetName(`${number}. ${result.name}`);
    while (used.has(sheet.toLowerCase())) sheet = safeSheetName(`Option ${number}`);
    used.add(sheet.toLowerCase());
    return { number, result, cashFlowSheet: sheet };
  });
}

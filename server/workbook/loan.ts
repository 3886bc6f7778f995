/**
 * The loan of each option: per payment (live interest, level payment via PMT(), balance) and per
 * year (sums of the payments), all driven by the named interest rate on Assumptions.
 */
import type ExcelJS from 'exceljs';
import type { LoanPayment } from '../../shared/engine/index.js';
import { INPUT_NAMES as N, defineName, optionName, type OptionLayout, type WorkbookContext } from './context.js';
import {
  address,
  BASE_FONT,
  COUNT_FORMAT,
  freeze,
  PERCENT_FORMAT,
  setFormula,
  setupPrint,
  sheetRef,
  styleHeaderRow,
  styleNote,
  styleSection,
  styleTotal,
  writeTitle,
} from './layout.js';

export const LOAN_BY_YEAR_SHEET = 'Loan by year';
export const LOAN_PAYMENTS_SHEET = 'Loan payments';
const PAYMENT_HEADER = ['Payment', 'Loan year', 'Opening balance', 'Payment', 'Interest', 'Principal', 'Closing balance'];

/** Where one option's loan sits on the by-year sheet, for the coverage sheet to refer to. */
export interface LoanYearRows {
  /** Row of loan year y (1-based) on the by-year sheet, or undefined past the term. */
  yearRow(year: number): number | undefined;
  /** Column of the yearly payment (principal + interest). */
  paymentColumn: number;
}

/** Interest-only periods the engine uses: months × payments per year ÷ 12, rounded up. */
export function interestOnlyPeriods(context: WorkbookContext): number {
  const { interestOnlyMonths, paymentsPerYear } = context.scenario.finance;
  return Math.ceil((interestOnlyMonths * paymentsPerYear) / 12);
}

/** Builds both loan sheets; returns where each option's years are. */
export function addLoanSheets(context: WorkbookContext): Map<number, LoanYearRows> {
  const byYear = context.workbook.addWorksheet(LOAN_BY_YEAR_SHEET);
  const payments = context.workbook.addWorksheet(LOAN_PAYMENTS_SHEET);
  const { finance } = context.scenario;
  const note =
    `Level repayments via PMT() at the named InterestRate over ${finance.termYears} years, ${finance.paymentsPerYear} payment(s) a year, ` +
    'interest rounded to cents each period, the last payment absorbing rounding. Change InterestRate on Assumptions and the schedule, debt service and coverage follow; ' +
    'the term, payments per year and loan amounts are fixed by the export.';
  writeTitle(byYear, 'Loan schedule by year', note);
  writeTitle(payments, 'Loan schedule by payment', note);

  const rows = new Map<number, LoanYearRows>();
  let yearRow = 4;
  let paymentRow = 4;
  for (const layout of context.options) {
    const placed = writeOptionLoan(context, layout, byYear, payments, yearRow, paymentRow);
    rows.set(layout.number, placed.rows);
    yearRow = placed.nextYearRow + 1;
    paymentRow = placed.nextPaymentRow + 1;
  }

  byYear.getColumn(1).width = 30;
  for (let c = 2; c <= 5; c++) byYear.getColumn(c).width = 17;
  payments.getColumn(1).width = 30;
  for (let c = 2; c <= 7; c++) payments.getColumn(c).width = 15;
  freeze(byYear, 3);
  freeze(payments, 3);
  // The last written row, not the spacer after it: a blank last row can start a page of its own.
  setupPrint(byYear, { lastRow: byYear.lastRow?.number ?? 4, lastColumn: 5 });
  // One header in row 3, repeated on every printed page of the long per-payment schedule.
  PAYMENT_HEADER.forEach((h, i) => (payments.getCell(3, i + 1).value = h));
  styleHeaderRow(payments, 3, 1, PAYMENT_HEADER.length);
  setupPrint(payments, { lastRow: payments.lastRow?.number ?? 4, lastColumn: 7, titleRows: '3:3' });
  for (const ws of [byYear, payments]) ws.eachRow((r) => r.eachCell((cell) => (cell.font ??= BASE_FONT)));
  return rows;
}

interface Placed {
  rows: LoanYearRows;
  nextYearRow: number;
  nextPaymentRow: number;
}

function writeOptionLoan(
  context: WorkbookContext,
  layout: OptionLayout,
  byYear: ExcelJS.Worksheet,
  payments: ExcelJS.Worksheet,
  startYearRow: number,
  startPaymentRow: number,
): Placed {
  const { loan } = layout.result;
  const money = context.formats.money;
  const heading = `${layout.result.name}${layout.result.current ? ' (current option)' : ''}`;
  styleSection(byYear.getCell(startYearRow, 1));
  byYear.getCell(startYearRow, 1).value = heading;
  styleSection(payments.getCell(startPaymentRow, 1));
  payments.getCell(startPaymentRow, 1).value = heading;

  if (loan.amount <= 0 || loan.payments.length === 0) {
    for (const [ws, r] of [[byYear, startYearRow + 1], [payments, startPaymentRow + 1]] as const) {
      ws.getCell(r, 1).value = 'No loan: the capital is met by equity and grants.';
      styleNote(ws.getCell(r, 1));
    }
    return { rows: { yearRow: () => undefined, paymentColumn: 3 }, nextYearRow: startYearRow + 2, nextPaymentRow: startPaymentRow + 2 };
  }

  const ioPeriods = interestOnlyPeriods(context);
  const totalPeriods = loan.payments.length;
  const level = levelPaymentOf(loan.payments, ioPeriods);
  let r = startYearRow + 1;
  const param = (label: string, value: number | { live: string; result: number }, fmt: string, name?: string) => {
    byYear.getCell(r, 1).value = label;
    const cell = byYear.getCell(r, 2);
    if (typeof value === 'number') cell.value = value;
    else setFormula(cell, value.live, value.result);
    cell.numFmt = fmt;
    if (name) defineName(context.workbook, optionName(layout, name), sheetRef(LOAN_BY_YEAR_SHEET, r, 2));
    const at = address(r, 2, true);
    r++;
    return at;
  };
  const amountRef = param('Loan amount (capital − equity − grants)', loan.amount, money, 'LoanAmount');
  param('Interest rate (nominal, per year)', { live: N.interestRate, result: context.scenario.finance.interestRate }, PERCENT_FORMAT);
  param('Payments per year', { live: N.paymentsPerYear, result: context.scenario.finance.paymentsPerYear }, COUNT_FORMAT);
  const ioRef = param('Interest-only periods', ioPeriods, COUNT_FORMAT);
  const levelRef = param(
    'Level payment per period',
    {
      live: `ROUND(PMT(${N.interestRate}/${N.paymentsPerYear},${N.termYears}*${N.paymentsPerYear}-${ioRef},-${amountRef}),2)`,
      result: level,
    },
    money,
    'LevelPayment',
  );

  // Per payment.
  let p = startPaymentRow + 1;
  PAYMENT_HEADER.forEach((h, i) => (payments.getCell(p, i + 1).value = h));
  styleHeaderRow(payments, p, 1, PAYMENT_HEADER.length);
  p++;
  const firstPaymentRow = p;
  const periodRate = `${N.interestRate}/${N.paymentsPerYear}`;
  loan.payments.forEach((payment, index) => {
    const rowNo = firstPaymentRow + index;
    const opening = index === 0 ? `${quoteByYear()}!${amountRef}` : address(rowNo - 1, 7);
    const openingValue = index === 0 ? loan.amount : (loan.payments[index - 1]?.balance ?? 0);
    payments.getCell(rowNo, 1).value = payment.number;
    payments.getCell(rowNo, 2).value = payment.year;
    setFormula(payments.getCell(rowNo, 3), opening, openingValue);
    setFormula(payments.getCell(rowNo, 5), `ROUND(${address(rowNo, 3)}*${periodRate},2)`, payment.interest);
    const principal =
      index < ioPeriods
        ? '0'
        : index === totalPeriods - 1
          ? address(rowNo, 3)
          : `MIN(${quoteByYear()}!${levelRef}-${address(rowNo, 5)},${address(rowNo, 3)})`;
    setFormula(payments.getCell(rowNo, 6), principal, payment.principal);
    setFormula(payments.getCell(rowNo, 4), `${address(rowNo, 5)}+${address(rowNo, 6)}`, payment.payment);
    setFormula(payments.getCell(rowNo, 7), `ROUND(${address(rowNo, 3)}-${address(rowNo, 6)},2)`, payment.balance);
    for (let c = 3; c <= 7; c++) payments.getCell(rowNo, c).numFmt = money;
  });
  p = firstPaymentRow + totalPeriods;

  // Per year: sums over that year's payments.
  const yearHeader = ['Loan year', 'Payments (P + I)', 'Interest', 'Principal', 'Closing balance'];
  yearHeader.forEach((h, i) => (byYear.getCell(r, i + 1).value = h));
  styleHeaderRow(byYear, r, 1, yearHeader.length);
  r++;
  const firstYearRow = r;
  const perYear = context.scenario.finance.paymentsPerYear;
  const paymentsRef = (column: number, fromRow: number, toRow: number) =>
    `SUM(${quotePayments()}!${address(fromRow, column)}:${address(toRow, column)})`;
  loan.years.forEach((year, index) => {
    const rowNo = firstYearRow + index;
    const from = firstPaymentRow + index * perYear;
    const to = from + perYear - 1;
    byYear.getCell(rowNo, 1).value = year.year;
    byYear.getCell(rowNo, 1).alignment = { horizontal: 'left' };
    setFormula(byYear.getCell(rowNo, 2), paymentsRef(4, from, to), year.payment);
    setFormula(byYear.getCell(rowNo, 3), paymentsRef(5, from, to), year.interest);
    setFormula(byYear.getCell(rowNo, 4), paymentsRef(6, from, to), year.principal);
    setFormula(byYear.getCell(rowNo, 5), `${quotePayments()}!${address(to, 7)}`, year.closingBalance);
    for (let c = 2; c <= 5; c++) byYear.getCell(rowNo, c).numFmt = money;
  });
  const lastYearRow = firstYearRow + loan.years.length - 1;
  byYear.getCell(lastYearRow + 1, 1).value = 'Total';
  setFormula(byYear.getCell(lastYearRow + 1, 2), `SUM(${address(firstYearRow, 2)}:${address(lastYearRow, 2)})`, loan.totalInterest + loan.totalPrincipal);
  setFormula(byYear.getCell(lastYearRow + 1, 3), `SUM(${address(firstYearRow, 3)}:${address(lastYearRow, 3)})`, loan.totalInterest);
  setFormula(byYear.getCell(lastYearRow + 1, 4), `SUM(${address(firstYearRow, 4)}:${address(lastYearRow, 4)})`, loan.totalPrincipal);
  for (let c = 2; c <= 4; c++) byYear.getCell(lastYearRow + 1, c).numFmt = money;
  styleTotal(byYear, lastYearRow + 1, 1, 5);

  const name = (key: string, column: number) =>
    defineName(context.workbook, optionName(layout, key), sheetRef(LOAN_BY_YEAR_SHEET, firstYearRow, column, lastYearRow, column));
  name('LoanPaymentByYear', 2);
  name('LoanInterestByYear', 3);
  name('LoanPrincipalByYear', 4);
  name('LoanBalanceByYear', 5);

  return {
    rows: { yearRow: (y) => (y >= 1 && y <= loan.years.length ? firstYearRow + y - 1 : undefined), paymentColumn: 2 },
    nextYearRow: lastYearRow + 2,
    nextPaymentRow: p,
  };
}

/**
 * The level payment the engine used: the first repayment after any interest-only periods
 * (every repayment but the last equals it).
 */
function levelPaymentOf(payments: readonly LoanPayment[], ioPeriods: number): number {
  const first = payments[ioPeriods];
  return first?.payment ?? 0;
}

function quoteByYear(): string {
  return `'${LOAN_BY_YEAR_SHEET}'`;
}

function quotePayments(): string {
  return `'${LOAN_PAYMENTS_SHEET}'`;
}

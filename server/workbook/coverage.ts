/**
 * Debt-service coverage per year and option, as live formulas: project coverage = change in
 * cash available for debt service against the current option ÷ the change in principal + interest;
 * whole-farm coverage = (existing farm cash in year t + that change) ÷ (existing debt payments in
 * year t + this loan's P + I), the existing farm's cash moving with the current option's margin.
 */
import type ExcelJS from 'exceljs';
import { COVERAGE_TIE } from '../../shared/engine/index.js';
import { CASH_FLOW_ROW, yearColumn as cashFlowYearColumn } from './cash-flows.js';
import { INPUT_NAMES as N, defineName, optionName, type OptionLayout, type WorkbookContext } from './context.js';
import {
  address,
  BASE_FONT,
  columnLetter,
  COLOURS,
  COUNT_FORMAT,
  freeze,
  quoteSheet,
  RATIO_FORMAT,
  setFormula,
  setupPrint,
  sheetRef,
  styleHeaderRow,
  styleNote,
  styleSection,
  styleTotal,
  writeTitle,
} from './layout.js';
import { LOAN_BY_YEAR_SHEET, type LoanYearRows } from './loan.js';

export const COVERAGE_SHEET = 'Coverage';
const HEADER_ROW = 4;

/** Column of operating year t (1..H) on the coverage sheet. */
function yearColumn(t: number): number {
  return 1 + t;
}

/** Builds the coverage sheet; rows per option, years across, lowest and count below threshold at the right. */
export function addCoverageSheet(context: WorkbookContext, loans: Map<number, LoanYearRows>): ExcelJS.Worksheet {
  const ws = context.workbook.addWorksheet(COVERAGE_SHEET);
  const { horizon } = context;
  writeTitle(
    ws,
    'Debt-service coverage by year',
    'Cash available for debt service = operating margin − tax. Coverage cells below the named CoverageThreshold are shaded. ' +
      'A blank ratio means no debt service is due that year.',
  );
  const lowestColumn = yearColumn(horizon) + 1;
  const lowestYearColumn = lowestColumn + 1;
  const belowColumn = lowestColumn + 2;
  ws.getCell(HEADER_ROW, 1).value = `Option / line (${context.results.currency})`;
  for (let t = 1; t <= horizon; t++) ws.getCell(HEADER_ROW, yearColumn(t)).value = `Year ${t}`;
  ws.getCell(HEADER_ROW, lowestColumn).value = 'Lowest';
  ws.getCell(HEADER_ROW, lowestYearColumn).value = 'In year';
  ws.getCell(HEADER_ROW, belowColumn).value = 'Years below threshold';
  styleHeaderRow(ws, HEADER_ROW, 1, belowColumn);

  let r = HEADER_ROW + 1;
  const currentCash = (t: number) => `${quoteSheet(context.current.cashFlowSheet)}!${address(CASH_FLOW_ROW.cashForDebtService ?? 0, cashFlowYearColumn(t))}`;
  for (const layout of context.options) {
    r = writeOptionBlock(ws, context, layout, { own: loans.get(layout.number), current: loans.get(context.current.number) }, r, currentCash, { lowestColumn, lowestYearColumn, belowColumn }) + 1;
  }

  ws.getColumn(1).width = 40;
  for (let t = 1; t <= horizon; t++) ws.getColumn(yearColumn(t)).width = 12;
  ws.getColumn(lowestColumn).width = 10;
  ws.getColumn(lowestYearColumn).width = 8;
  ws.getColumn(belowColumn).width = 11;
  freeze(ws, HEADER_ROW, 1);
  setupPrint(ws, {
    lastRow: r - 1,
    lastColumn: belowColumn,
    titleRows: `${HEADER_ROW}:${HEADER_ROW}`,
    repeatFirstColumn: true,
    pagesWide: Math.max(1, Math.ceil((horizon + 4) / 13)),
  });
  ws.eachRow((row) => row.eachCell((cell) => (cell.font ??= BASE_FONT)));
  return ws;
}

/** The loan-by-year sheet's payment cell of year t, or null when that option has no loan. */
function loanPayment(loan: LoanYearRows | undefined, t: number): string | null {
  const row = loan?.yearRow(t);
  return loan && row !== undefined ? `${quoteSheet(LOAN_BY_YEAR_SHEET)}!${address(row, loan.paymentColumn)}` : null;
}

interface SummaryColumns {
  lowestColumn: number;
  lowestYearColumn: number;
  belowColumn: number;
}

function writeOptionBlock(
  ws: ExcelJS.Worksheet,
  context: WorkbookContext,
  layout: OptionLayout,
  loans: { own: LoanYearRows | undefined; current: LoanYearRows | undefined },
  startRow: number,
  currentCash: (t: number) => string,
  columns: SummaryColumns,
): number {
  const { horizon } = context;
  const { result } = layout;
  const isCurrent = result.current;
  const money = context.formats.moneyWhole;
  const rows = {
    heading: startRow,
    cash: startRow + 1,
    change: startRow + 2,
    debtService: startRow + 3,
    project: startRow + 4,
    existingCash: startRow + 5,
    existingDebt: startRow + 6,
    wholeFarm: startRow + 7,
  };
  ws.getCell(rows.heading, 1).value = `${result.name}${isCurrent ? ' (current option)' : ''}`;
  styleSection(ws.getCell(rows.heading, 1));
  const labels: [keyof typeof rows, string][] = [
    ['cash', 'Cash available for debt service'],
    ['change', 'Change against the current option'],
    ['debtService', 'Debt service on this loan (P + I)'],
    ['project', 'Project coverage (ratio)'],
    ['existingCash', 'Existing farm cash for debt service (moves with the current option)'],
    ['existingDebt', 'Existing debt payments'],
    ['wholeFarm', 'Whole-farm coverage (ratio)'],
  ];
  for (const [key, label] of labels) ws.getCell(rows[key], 1).value = label;

  const { existingFarm } = context.results;
  const runningDebt = context.scenario.herd.existingDebtPaymentsPerYear;
  for (let t = 1; t <= horizon; t++) {
    const c = yearColumn(t);
    const at = (key: keyof typeof rows) => address(rows[key], c);
    const line = result.years[t];
    const currentLine = context.current.result.years[t];
    const cash = line?.cashAvailableForDebtService ?? 0;
    const change = isCurrent ? 0 : cash - (currentLine?.cashAvailableForDebtService ?? 0);
    const loanYear = result.loan.years[t - 1];
    const debtService = loanYear ? loanYear.payment : 0;
    const coverage = result.coverage[t - 1];

    setFormula(ws.getCell(rows.cash, c), `${quoteSheet(layout.cashFlowSheet)}!${address(CASH_FLOW_ROW.cashForDebtService ?? 0, cashFlowYearColumn(t))}`, cash);
    if (isCurrent) ws.getCell(rows.change, c).value = 0;
    else setFormula(ws.getCell(rows.change, c), `${at('cash')}-${currentCash(t)}`, change);
    const ownPayment = loanPayment(loans.own, t);
    if (ownPayment) setFormula(ws.getCell(rows.debtService, c), ownPayment, debtService);
    else ws.getCell(rows.debtService, c).value = 0;
    if (isCurrent) ws.getCell(rows.project, c).value = '';
    else {
      // The change's debt service: this loan less the current option's own loan, if it has one.
      const currentPayment = loanPayment(loans.current, t);
      const due = currentPayment ? `(${at('debtService')}-${currentPayment})` : at('debtService');
      setFormula(ws.getCell(rows.project, c), `IF(${due}>0,${at('change')}/${due},"")`, coverage?.project ?? null);
    }
    // The existing farm's cash moves with the current option's margin: the figure entered − the herd margin it holds + the current option's cash this year.
    setFormula(ws.getCell(rows.existingCash, c), `${N.existingCash}-${N.herdMarginInExistingCash}+${currentCash(t)}`, existingFarm.cashForDebtServiceByYear[t] ?? 0);
    // Listed existing loans add their payment up to their last year.
    const endingLoans = (existingFarm.debtPaymentsByYear[t] ?? 0) - runningDebt;
    setFormula(ws.getCell(rows.existingDebt, c), endingLoans !== 0 ? `${N.existingDebt}+${endingLoans}` : N.existingDebt, existingFarm.debtPaymentsByYear[t] ?? 0);
    setFormula(
      ws.getCell(rows.wholeFarm, c),
      `IF(${at('existingDebt')}+${at('debtService')}>=0.005,(${at('existingCash')}+${at('change')})/(${at('existingDebt')}+${at('debtService')}),"")`,
      coverage?.wholeFarm ?? null,
    );
    for (const key of ['cash', 'change', 'debtService', 'existingCash', 'existingDebt'] as const) ws.getCell(rows[key], c).numFmt = money;
    for (const key of ['project', 'wholeFarm'] as const) {
      ws.getCell(rows[key], c).numFmt = RATIO_FORMAT;
      ws.getCell(rows[key], c).alignment = { horizontal: 'right' };
    }
  }
  styleTotal(ws, rows.wholeFarm, 1, columns.belowColumn);

  const rangeOf = (key: 'project' | 'wholeFarm') => `${address(rows[key], yearColumn(1))}:${address(rows[key], yearColumn(horizon))}`;
  const summary = (key: 'project' | 'wholeFarm', lowest: { year: number; value: number } | null) => {
    const range = rangeOf(key);
    const r = rows[key];
    setFormula(ws.getCell(r, columns.lowestColumn), `IF(COUNT(${range})=0,"",MIN(${range}))`, lowest?.value ?? null);
    ws.getCell(r, columns.lowestColumn).numFmt = RATIO_FORMAT;
    // The earliest year within COVERAGE_TIE of the lowest, as the engine rules ties (floating-point
    // noise must not move the year). SUMPRODUCT evaluates the comparison per cell without an array
    // formula; a blank ("") ratio compares as text, never as a low.
    const firstYearOffset = yearColumn(1) - 1;
    const tied = `(${range}<=MIN(${range})+${COVERAGE_TIE})`;
    setFormula(
      ws.getCell(r, columns.lowestYearColumn),
      `IF(COUNT(${range})=0,"",SUMPRODUCT(MIN(COLUMN(${range})-${firstYearOffset}+1000*(1-ISNUMBER(${range})*${tied}))))`,
      lowest?.year ?? null,
    );
    ws.getCell(r, columns.lowestYearColumn).numFmt = COUNT_FORMAT;
    const threshold = context.scenario.finance.coverageThreshold;
    const below = result.coverage.filter((c) => {
      const value = key === 'wholeFarm' ? c.wholeFarm : c.project;
      return value !== null && value < threshold;
    }).length;
    setFormula(ws.getCell(r, columns.belowColumn), `COUNTIF(${range},"<"&${N.coverageThreshold})`, below);
    ws.getCell(r, columns.belowColumn).numFmt = COUNT_FORMAT;
    for (const c of [columns.lowestColumn, columns.lowestYearColumn, columns.belowColumn]) ws.getCell(r, c).alignment = { horizontal: 'right' };
    ws.addConditionalFormatting({
      ref: range,
      rules: [
        {
          type: 'expression',
          priority: 1,
          formulae: [`AND(ISNUMBER(${columnLetter(yearColumn(1))}${r}),${columnLetter(yearColumn(1))}${r}<${N.coverageThreshold})`],
          style: { fill: { type: 'pattern', pattern: 'solid', bgColor: { argb: 'FFF4D9CC' } }, font: { color: { argb: COLOURS.clay }, bold: true } },
        },
      ],
    });
  };
  if (isCurrent) {
    for (const c of [columns.lowestColumn, columns.lowestYearColumn, columns.belowColumn]) ws.getCell(rows.project, c).value = '';
    const note = ws.getCell(rows.project, 1);
    note.value = 'Project coverage: not applicable (current option)';
    styleNote(note);
  } else {
    summary('project', result.lowestProjectCoverage);
  }
  summary('wholeFarm', result.lowestCoverage);

  const name = (key: string, r: number, from: number, to: number) =>
    defineName(context.workbook, optionName(layout, key), sheetRef(COVERAGE_SHEET, r, from, r, to));
  name('DebtService', rows.debtService, yearColumn(1), yearColumn(horizon));
  name('WholeFarmCoverage', rows.wholeFarm, yearColumn(1), yearColumn(horizon));
  if (!isCurrent) {
    name('ProjectCoverage', rows.project, yearColumn(1), yearColumn(horizon));
    name('LowestProjectCoverage', rows.project, columns.lowestColumn, columns.lowestColumn);
  }
  name('LowestCoverage', rows.wholeFarm, columns.lowestColumn, columns.lowestColumn);
  name('LowestCoverageYear', rows.wholeFarm, columns.lowestYearColumn, columns.lowestYearColumn);
  name('YearsBelowThreshold', rows.wholeFarm, columns.belowColumn, columns.belowColumn);
  return rows.wholeFarm + 1;
}

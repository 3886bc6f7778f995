/**
 * Debt-service coverage per year and option, as live formulas: project coverage = change in
 * cash available for debt service against the current option ÷ this loan's principal + interest;
 * whole-farm coverage = (existing farm cash + that change) ÷ (existing debt payments + this loan's P + I).
 */
import type ExcelJS from 'exceljs';
import { COVERAGE_TIE } from '../../shared/engine/coverage.js';
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
    r = writeOptionBlock(ws, context, layout, loans.get(layout.number), r, currentCash, { lowestColumn, lowestYearColumn, belowColumn }) + 1;
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

interface SummaryColumns {
  lowestColumn: number;
  lowestYearColumn: number;
  belowColumn: number;
}

function writeOptionBlock(
  ws: ExcelJS.Worksheet,
  context: WorkbookContext,
  layout: OptionLayout,
  loan: LoanYearRows | undefined,
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
    ['existingCash', 'Existing farm cash for debt service'],
    ['existingDebt', 'Existing debt payments'],
    ['wholeFarm', 'Whole-farm coverage (ratio)'],
  ];
  for (const [key, label] of labels) ws.getCell(rows[key], 1).value = label;

  const { existingCashForDebtServicePerYear: existingCash, existingDebtPaymentsPerYear: existingDebt } = context.scenario.herd;
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
    const loanRow = loan?.yearRow(t);
    if (loan && loanRow !== undefined) setFormula(ws.getCell(rows.debtService, c), `${quoteSheet(LOAN_BY_YEAR_SHEET)}!${address(loanRow, loan.paymentColumn)}`, debtService);
    else ws.getCell(rows.debtService, c).value = 0;
    if (isCurrent) ws.getCell(rows.project, c).value = '';
    else setFormula(ws.getCell(rows.project, c), `IF(${at('debtService')}>0,${at('change')}/${at('debtService')},"")`, coverage?.project ?? null);
    setFormula(ws.getCell(rows.existingCash, c), N.existingCash, existingCash);
    setFormula(ws.getCell(rows.existingDebt, c), N.existingDebt, existingDebt);
    setFormula(
      ws.getCell(rows.wholeFarm, c),
      `IF(${at('existingDebt')}+${at('debtService')}>0,(${at('existingCash')}+${at('change')})/(${at('existingDebt')}+${at('debtService')}),"")`,
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
  if (!isCurrent) name('ProjectCoverage', rows.project, yearColumn(1), yearColumn(horizon));
  name('LowestCoverage', rows.wholeFarm, columns.lowestColumn, columns.lowestColumn);
  name('LowestCoverageYear', rows.wholeFarm, columns.lowestYearColumn, columns.lowestYearColumn);
  name('YearsBelowThreshold', rows.wholeFarm, columns.belowColumn, columns.belowColumn);
  return rows.wholeFarm + 1;
}

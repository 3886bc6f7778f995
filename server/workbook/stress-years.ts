/**
 * The stress test's shocks year by year: for each option and shock the change's project flows
 * and the whole-farm cash and debt service, as Byrecast's engine computed them with the inputs
 * shocked, and the whole-farm and project coverage of each year as live ratios of them. The Stress
 * sheet's NPV, lowest coverages and years below the threshold are formulas over these rows.
 */
import type ExcelJS from 'exceljs';
import { evaluateStressYears, STRESS_TESTS, type StressYears } from '../../shared/engine/index.js';
import { INPUT_NAMES as N, type OptionLayout, type WorkbookContext } from './context.js';
import { address, BASE_FONT, COVERAGE_FORMAT, freeze, quoteSheet, setFormula, setupPrint, shadeBelowThreshold, styleHeaderRow, styleNote, styleSection, writeTitle } from './layout.js';

export const STRESS_YEARS_SHEET = 'Stress by year';

// Less than half a cent due is nothing due (shared/engine/coverage.ts NOTHING_DUE).
const NOTHING_DUE = 0.005;
const FIRST_YEAR_COLUMN = 3;

/** Where one option's shock sits on the sheet: references for the Stress sheet's formulas. */
export interface ShockCells {
  /** Year-0 cell and years 1..H range of the change's flows; null for the current option. */
  changeYearZero: string | null;
  changeYears: string | null;
  /** Years 1..H of whole-farm coverage (text "" in a year with nothing due). */
  coverageYears: string;
  /** Years 1..H of project coverage (text "" where the change adds no debt service); null for the current option. */
  projectCoverageYears: string | null;
}

/** Rows of one option's shock on the sheet. */
interface ShockRows {
  cash: number;
  debt: number;
  project: number | null;
}

/** Builds the sheet; returns, per option (index = option) and shock (STRESS_TESTS order), where its rows are. */
export function addStressYearsSheet(context: WorkbookContext): ShockCells[][] {
  const ws = context.workbook.addWorksheet(STRESS_YEARS_SHEET);
  const { horizon } = context;
  const years = evaluateStressYears(context.scenario);
  writeTitle(
    ws,
    "The lender's stress test year by year",
    `${context.results.currency}. Byrecast engine values with each shock applied to the inputs (the model run again), except the coverage rows: whole-farm coverage divides the two rows above it, project coverage the change in those two rows against the current option under the same shock. The Stress sheet discounts the change's flows at ${N.discountRate} and counts years below ${N.coverageThreshold}.`,
  );
  const header = 4;
  ws.getCell(header, 1).value = 'Option and shock';
  ws.getCell(header, 2).value = 'Line';
  for (let t = 0; t <= horizon; t++) ws.getCell(header, FIRST_YEAR_COLUMN + t).value = `Year ${t}`;
  styleHeaderRow(ws, header, 1, FIRST_YEAR_COLUMN + horizon);
  const yearCell = (row: number, t: number, absolute = true): string => address(row, FIRST_YEAR_COLUMN + t, absolute);
  const sheet = quoteSheet(STRESS_YEARS_SHEET);
  const money = context.formats.money;

  let r = header + 1;
  const rows = context.options.map((): ShockRows[] => []);
  const cells = context.options.map((layout: OptionLayout, index): ShockCells[] => {
    ws.getCell(r, 1).value = `${layout.result.name}${layout.result.current ? ' (current option)' : ''}`;
    styleSection(ws.getCell(r, 1));
    r++;
    return STRESS_TESTS.map((test, k): ShockCells => {
      const detail = years[index]?.[k];
      if (!detail || detail.id !== test.id) throw new RangeError(`stress years: no ${test.id} for option ${layout.result.id}`);
      const writeLine = (line: string, values: readonly number[], fromYear: number): number => {
        ws.getCell(r, 1).value = test.label;
        ws.getCell(r, 2).value = line;
        for (let t = fromYear; t <= horizon; t++) {
          const cell = ws.getCell(r, FIRST_YEAR_COLUMN + t);
          cell.value = values[t] ?? 0;
          cell.numFmt = money;
        }
        return r++;
      };
      const changeRow = detail.changeFlows ? writeLine('Change in project cash flow', detail.changeFlows, 0) : null;
      const cashRow = writeLine('Whole-farm cash for debt service', detail.wholeFarmCash, 1);
      const debtRow = writeLine('Whole-farm debt service', detail.wholeFarmDebt, 1);
      ws.getCell(r, 1).value = test.label;
      ws.getCell(r, 2).value = 'Whole-farm coverage';
      for (let t = 1; t <= horizon; t++) {
        const cell = ws.getCell(r, FIRST_YEAR_COLUMN + t);
        const debt = detail.wholeFarmDebt[t] ?? 0;
        const ratio = debt >= NOTHING_DUE ? (detail.wholeFarmCash[t] ?? 0) / debt : '';
        setFormula(cell, `IF(${yearCell(debtRow, t, false)}>=${NOTHING_DUE},${yearCell(cashRow, t, false)}/${yearCell(debtRow, t, false)},"")`, ratio);
        cell.numFmt = COVERAGE_FORMAT;
      }
      shadeBelowThreshold(ws, `${yearCell(r, 1, false)}:${yearCell(r, horizon, false)}`, N.coverageThreshold);
      const coverageRow = r++;
      // Filled below, once the current option's rows of this shock are known.
      const projectRow = layout.result.current ? null : r++;
      rows[index]?.push({ cash: cashRow, debt: debtRow, project: projectRow });
      const yearsOf = (row: number) => `${sheet}!${yearCell(row, 1)}:${yearCell(row, horizon)}`;
      return {
        changeYearZero: changeRow === null ? null : `${sheet}!${yearCell(changeRow, 0)}`,
        changeYears: changeRow === null ? null : yearsOf(changeRow),
        coverageYears: yearsOf(coverageRow),
        projectCoverageYears: projectRow === null ? null : yearsOf(projectRow),
      };
    });
  });
  fillProjectCoverage(ws, context, years, rows);
  r++;
  const note = ws.getCell(r, 1);
  note.value =
    'The shocked lines are values: a new interest rate, price or capital cost typed on Assumptions does not move them (Byrecast runs the model again for that). A new discount rate or coverage threshold moves the Stress sheet, which discounts and counts these rows.';
  styleNote(note);

  ws.getColumn(1).width = 40;
  ws.getColumn(2).width = 30;
  for (let t = 0; t <= horizon; t++) ws.getColumn(FIRST_YEAR_COLUMN + t).width = 13;
  freeze(ws, header, 2);
  // Printed like the cash-flow sheets: about eleven years a page, the shock and line repeated.
  setupPrint(ws, { lastRow: r, lastColumn: FIRST_YEAR_COLUMN + horizon, titleRows: `${header}:${header}`, pagesWide: Math.max(1, Math.ceil((horizon + 1) / 11)) });
  ws.pageSetup.printTitlesColumn = 'A:B';
  ws.eachRow((row) => row.eachCell((cell) => (cell.font ??= BASE_FONT)));
  return cells;
}

/**
 * Project coverage of each shocked year as a live ratio: the change in cash for debt service
 * over the change in debt service, both the difference of this option's whole-farm row and the
 * current option's under the same shock (the existing farm's cash and debt cancel), as
 * shared/engine/farm-coverage.ts coverageInYear computes it.
 */
function fillProjectCoverage(ws: ExcelJS.Worksheet, context: WorkbookContext, years: StressYears[][], rows: ShockRows[][]): void {
  const { horizon } = context;
  const currentIndex = context.options.findIndex((layout) => layout.result.current);
  rows.forEach((shocks, index) =>
    shocks.forEach((own, k) => {
      const current = rows[currentIndex]?.[k];
      const ownYears = years[index]?.[k];
      const currentYears = years[currentIndex]?.[k];
      if (own.project === null || !current || !ownYears || !currentYears) return;
      const test = STRESS_TESTS[k];
      ws.getCell(own.project, 1).value = test?.label ?? '';
      ws.getCell(own.project, 2).value = 'Project coverage';
      for (let t = 1; t <= horizon; t++) {
        const at = (row: number) => address(row, FIRST_YEAR_COLUMN + t, false);
        const changeDue = (ownYears.wholeFarmDebt[t] ?? 0) - (currentYears.wholeFarmDebt[t] ?? 0);
        const changeCash = (ownYears.wholeFarmCash[t] ?? 0) - (currentYears.wholeFarmCash[t] ?? 0);
        const due = `(${at(own.debt)}-${at(current.debt)})`;
        const cell = ws.getCell(own.project, FIRST_YEAR_COLUMN + t);
        setFormula(cell, `IF(${due}>=${NOTHING_DUE},(${at(own.cash)}-${at(current.cash)})/${due},"")`, changeDue >= NOTHING_DUE ? changeCash / changeDue : '');
        cell.numFmt = COVERAGE_FORMAT;
      }
    }),
  );
}

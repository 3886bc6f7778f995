/**
 * The lender's stress table and each option's sources and uses of funds. Each shock re-runs the
 * whole model (yearly lines, tax, loan) with the inputs changed, which the sheet's own flows
 * cannot do: the shocked years are engine values on the "Stress by year" sheet, and the table's
 * NPV of the change, lowest whole-farm coverage and years below the threshold are live formulas
 * over them (the base case links to the option's own cells), and so is the lowest project
 * coverage (not applicable to the current option). Coverage below the named threshold is shaded by a live rule.
 */
import type ExcelJS from 'exceljs';
import { defineName, INPUT_NAMES as N, optionName, type WorkbookContext } from './context.js';
import { BASE_FONT, columnLetter, COLOURS, COUNT_FORMAT, COVERAGE_FORMAT, freeze, setFormula, setupPrint, shadeBelowThreshold, sheetRef, styleHeaderRow, styleNote, styleSection, styleTotal, writeTitle } from './layout.js';
import type { ShockCells } from './stress-years.js';

export const STRESS_SHEET = 'Stress';

/** Fills the stress sheet (added before "Stress by year", which it reads): per option, each shock's lowest coverage, NPV of the change and years below threshold; then sources and uses. */
export function fillStressSheet(ws: ExcelJS.Worksheet, context: WorkbookContext, shocks: readonly ShockCells[][]): ExcelJS.Worksheet {
  const money = context.formats.moneyWhole;
  const threshold = context.scenario.finance.coverageThreshold;
  writeTitle(
    ws,
    "The lender's stress test and the sources and uses of funds",
    `${context.results.currency}. Each shock re-runs the whole model; its years are on "Stress by year", and the NPV of the change, lowest whole-farm and project coverage and years below the threshold here are formulas over them (${N.discountRate}, ${N.coverageThreshold}). The existing farm takes the same prices: its cash moves with the current option's margin. Coverage below ${N.coverageThreshold} (${threshold.toFixed(2)}) is shaded.`,
  );
  let r = 4;
  const header = ['Shock', 'Lowest whole-farm coverage', 'Lowest project coverage', 'NPV of the change', 'Years below threshold'];
  for (const layout of context.options) {
    const { result } = layout;
    ws.getCell(r, 1).value = `${result.name}${result.current ? ' (current option)' : ''}`;
    styleSection(ws.getCell(r, 1));
    r++;
    header.forEach((h, i) => (ws.getCell(r, i + 1).value = h));
    styleHeaderRow(ws, r, 1, header.length);
    ws.getRow(r).height = 28;
    r++;
    const firstRow = r;
    const n = layout.number;
    const right = (cell: ExcelJS.Cell, format: string): void => {
      cell.alignment = { horizontal: 'right' };
      cell.numFmt = format;
    };
    // Base case: the option's own live cells.
    ws.getCell(r, 1).value = 'Base case';
    setFormula(ws.getCell(r, 2), `IF(ISNUMBER(${optionName(n, 'LowestCoverage')}),${optionName(n, 'LowestCoverage')},"no debt")`, result.lowestCoverage?.value ?? 'no debt');
    if (result.current) ws.getCell(r, 3).value = 'n/a';
    else setFormula(ws.getCell(r, 3), `IF(ISNUMBER(${optionName(n, 'LowestProjectCoverage')}),${optionName(n, 'LowestProjectCoverage')},"n/a")`, result.lowestProjectCoverage?.value ?? 'n/a');
    if (result.incremental) setFormula(ws.getCell(r, 4), optionName(n, 'IncrementalNPV'), result.incremental.npv);
    else ws.getCell(r, 4).value = 'n/a';
    setFormula(ws.getCell(r, 5), optionName(n, 'YearsBelowThreshold'), result.yearsBelowCoverageThreshold.length);
    r++;
    result.stress.forEach((row, k) => {
      const cells = shocks[n - 1]?.[k];
      if (!cells) throw new RangeError(`stress: no yearly rows for ${row.id} of option ${result.id}`);
      ws.getCell(r, 1).value = row.label;
      setFormula(ws.getCell(r, 2), `IF(COUNT(${cells.coverageYears})=0,"no debt",MIN(${cells.coverageYears}))`, row.lowestCoverage ?? 'no debt');
      if (cells.projectCoverageYears) setFormula(ws.getCell(r, 3), `IF(COUNT(${cells.projectCoverageYears})=0,"n/a",MIN(${cells.projectCoverageYears}))`, row.lowestProjectCoverage ?? 'n/a');
      else ws.getCell(r, 3).value = 'n/a';
      if (cells.changeYearZero && cells.changeYears) setFormula(ws.getCell(r, 4), `${cells.changeYearZero}+NPV(${N.discountRate},${cells.changeYears})`, row.npvAgainstCurrent);
      else ws.getCell(r, 4).value = 'n/a';
      setFormula(ws.getCell(r, 5), `COUNTIF(${cells.coverageYears},"<"&${N.coverageThreshold})`, row.yearsBelowThreshold);
      r++;
    });
    for (let row = firstRow; row < r; row++) {
      right(ws.getCell(row, 2), COVERAGE_FORMAT);
      right(ws.getCell(row, 3), COVERAGE_FORMAT);
      right(ws.getCell(row, 4), money);
      right(ws.getCell(row, 5), COUNT_FORMAT);
    }
    shadeBelowThreshold(ws, `B${firstRow}:C${r - 1}`, N.coverageThreshold);
    // Base case first, then the shocks in the engine's order (shared/engine/stress.ts STRESS_TESTS).
    defineName(context.workbook, optionName(n, 'StressLowestCoverage'), sheetRef(STRESS_SHEET, firstRow, 2, r - 1, 2));
    defineName(context.workbook, optionName(n, 'StressLowestProjectCoverage'), sheetRef(STRESS_SHEET, firstRow, 3, r - 1, 3));
    defineName(context.workbook, optionName(n, 'StressNPV'), sheetRef(STRESS_SHEET, firstRow, 4, r - 1, 4));
    defineName(context.workbook, optionName(n, 'StressYearsBelowThreshold'), sheetRef(STRESS_SHEET, firstRow, 5, r - 1, 5));
    const cover = result.breakEvenMilkPriceForCoverage;
    const price = (value: number | null) => (value === null ? 'none in range' : `${value.toFixed(3)} per kg`);
    ws.getCell(r, 1).value = `Milk price for lowest whole-farm coverage 1.00: ${price(cover.atOne)}; at the threshold ${threshold.toFixed(2)}: ${price(cover.atThreshold)} (today ${context.scenario.herd.milkPricePerKg.toFixed(3)}).`;
    styleNote(ws.getCell(r, 1));
    r += 2;

    const funds = result.sourcesAndUses;
    if (funds.total > 0) {
      ws.getCell(r, 1).value = 'Uses of funds at year 0';
      ws.getCell(r, 4).value = 'Sources of funds';
      styleHeaderRow(ws, r, 1, 5);
      r++;
      const rows = Math.max(funds.uses.length, funds.sources.length);
      for (let i = 0; i < rows; i++) {
        const use = funds.uses[i];
        const source = funds.sources[i];
        if (use) {
          ws.getCell(r + i, 1).value = use.label;
          ws.getCell(r + i, 2).value = use.amount;
          ws.getCell(r + i, 2).numFmt = context.formats.money;
        }
        if (source) {
          ws.getCell(r + i, 4).value = source.label;
          ws.getCell(r + i, 5).value = source.amount;
          ws.getCell(r + i, 5).numFmt = context.formats.money;
        }
      }
      r += rows;
      ws.getCell(r, 1).value = 'Total uses';
      ws.getCell(r, 2).value = { formula: `SUM(B${r - rows}:B${r - 1})`, result: funds.total };
      ws.getCell(r, 4).value = 'Total sources';
      ws.getCell(r, 5).value = { formula: `SUM(E${r - rows}:E${r - 1})`, result: funds.total };
      for (const c of [2, 5]) ws.getCell(r, c).numFmt = context.formats.money;
      styleTotal(ws, r, 1, 5);
      r++;
      if (funds.termPastLifeWarning) {
        ws.getCell(r, 1).value = `Warning: ${funds.termPastLifeWarning}`;
        ws.getCell(r, 1).font = { ...BASE_FONT, bold: true, color: { argb: COLOURS.clay } };
        r++;
      }
      r++;
    }
  }
  ws.getColumn(1).width = 50;
  for (let c = 2; c <= 5; c++) ws.getColumn(c).width = c === 4 ? 44 : 16;
  ws.getColumn(columnLetter(5)).width = 16;
  freeze(ws, 3);
  setupPrint(ws, { lastRow: r, lastColumn: 5 });
  ws.eachRow((row) => row.eachCell((cell) => (cell.font ??= BASE_FONT)));
  return ws;
}

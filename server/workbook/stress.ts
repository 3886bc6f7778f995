/**
 * The lender's stress table and each option's sources and uses of funds. Stress figures are
 * Byrecast engine values, not formulas: each shock re-runs the whole model (yearly lines, tax,
 * loan) with the inputs changed, which the sheet's flows cannot do. Coverage below the named
 * threshold is shaded by a live rule.
 */
import type ExcelJS from 'exceljs';
import { INPUT_NAMES as N, type WorkbookContext } from './context.js';
import { BASE_FONT, columnLetter, COLOURS, COUNT_FORMAT, freeze, RATIO_FORMAT, setupPrint, styleHeaderRow, styleNote, styleSection, styleTotal, writeTitle } from './layout.js';

export const STRESS_SHEET = 'Stress';

/** Builds the stress sheet: per option, each shock's lowest coverage, NPV of the change and years below threshold; then sources and uses. */
export function addStressSheet(context: WorkbookContext): ExcelJS.Worksheet {
  const ws = context.workbook.addWorksheet(STRESS_SHEET);
  const money = context.formats.moneyWhole;
  const threshold = context.scenario.finance.coverageThreshold;
  writeTitle(
    ws,
    "The lender's stress test and the sources and uses of funds",
    `${context.results.currency}. Each shock re-runs the whole model (engine values). The existing farm takes the same prices: its cash moves with the current option's margin. Coverage below ${N.coverageThreshold} (${threshold.toFixed(2)}) is shaded.`,
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
    const base: [string, number | string, number | string, number | string, number][] = [
      ['Base case', result.lowestCoverage?.value ?? 'no debt', result.lowestProjectCoverage?.value ?? 'n/a', result.incremental?.npv ?? 'n/a', result.yearsBelowCoverageThreshold.length],
      ...result.stress.map((row): [string, number | string, number | string, number | string, number] => [
        row.label,
        row.lowestCoverage ?? 'no debt',
        row.lowestProjectCoverage ?? 'n/a',
        row.npvAgainstCurrent ?? 'n/a',
        row.yearsBelowThreshold,
      ]),
    ];
    for (const cells of base) {
      cells.forEach((value, i) => {
        const cell = ws.getCell(r, i + 1);
        cell.value = value;
        if (i > 0) cell.alignment = { horizontal: 'right' };
        if (typeof value === 'number') cell.numFmt = i === 3 ? money : i === 4 ? COUNT_FORMAT : RATIO_FORMAT;
      });
      r++;
    }
    ws.addConditionalFormatting({
      ref: `B${firstRow}:C${r - 1}`,
      rules: [
        {
          type: 'expression',
          priority: 1,
          formulae: [`AND(ISNUMBER(B${firstRow}),B${firstRow}<${N.coverageThreshold})`],
          style: { fill: { type: 'pattern', pattern: 'solid', bgColor: { argb: 'FFF4D9CC' } }, font: { color: { argb: COLOURS.clay }, bold: true } },
        },
      ],
    });
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

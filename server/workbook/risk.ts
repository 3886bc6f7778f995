/**
 * Sensitivity (NPV at each key input's low and high value) and Monte Carlo percentiles: engine
 * values, not formulas, because each needs the whole model re-run.
 */
import type ExcelJS from 'exceljs';
import type { MonteCarloResult, SensitivityResult } from '../../shared/engine/index.js';
import { RISK_INPUT_LABELS } from '../../shared/schema/index.js';
import type { WorkbookContext } from './context.js';
import { BASE_FONT, freeze, PERCENT_FORMAT, setupPrint, styleHeaderRow, styleNote, styleSection, writeTitle } from './layout.js';

export const RISK_SHEET = 'Risk';

/** Risk results to include; either part may be left out (the sheet then says so). */
export interface WorkbookRisk {
  sensitivity?: SensitivityResult;
  monteCarlo?: MonteCarloResult;
}

const percentOf = (multiplier: number) => `${multiplier >= 1 ? '+' : '−'}${Math.round(Math.abs(multiplier - 1) * 100)} %`;

/** Builds the risk sheet. */
export function addRiskSheet(context: WorkbookContext, risk: WorkbookRisk | undefined): ExcelJS.Worksheet {
  const ws = context.workbook.addWorksheet(RISK_SHEET);
  const money = context.formats.moneyWhole;
  writeTitle(
    ws,
    'Risk summary',
    `${context.results.currency}. Computed by Byrecast at export (values, not formulas): each figure re-runs the whole model with one or more inputs changed.`,
  );
  let r = 4;
  const sensitivity = risk?.sensitivity;
  ws.getCell(r, 1).value = 'Sensitivity of NPV to each key input (others at base)';
  styleSection(ws.getCell(r, 1));
  r++;
  if (!sensitivity) {
    ws.getCell(r, 1).value = 'Not included in this export.';
    styleNote(ws.getCell(r, 1));
    r += 2;
  } else {
    for (const option of sensitivity.options) {
      const useIncremental = !option.current && option.incrementalNpv !== null;
      const swings = useIncremental ? (option.incrementalNpv ?? []) : option.npv;
      const header = [
        `${option.name}${option.current ? ' (current)' : ''}: ${useIncremental ? 'incremental NPV vs current' : 'NPV'}`,
        'Low change',
        'NPV at low',
        'High change',
        'NPV at high',
        'Swing',
      ];
      header.forEach((h, i) => (ws.getCell(r, i + 1).value = h));
      styleHeaderRow(ws, r, 1, header.length);
      r++;
      ws.getCell(r, 1).value = 'Base';
      ws.getCell(r, 3).value = useIncremental ? (option.baseIncrementalNpv ?? 0) : option.baseNpv;
      ws.getCell(r, 3).numFmt = money;
      r++;
      for (const swing of swings) {
        ws.getCell(r, 1).value = RISK_INPUT_LABELS[swing.key];
        ws.getCell(r, 2).value = percentOf(swing.lowMultiplier);
        ws.getCell(r, 3).value = swing.atLow;
        ws.getCell(r, 4).value = percentOf(swing.highMultiplier);
        ws.getCell(r, 5).value = swing.atHigh;
        ws.getCell(r, 6).value = swing.swing;
        for (const c of [3, 5, 6]) ws.getCell(r, c).numFmt = money;
        for (const c of [2, 4]) ws.getCell(r, c).alignment = { horizontal: 'right' };
        r++;
      }
      r++;
    }
  }

  ws.getCell(r, 1).value = 'Monte Carlo';
  styleSection(ws.getCell(r, 1));
  r++;
  const mc = risk?.monteCarlo;
  if (!mc) {
    ws.getCell(r, 1).value = 'Not included in this export.';
    styleNote(ws.getCell(r, 1));
    r++;
  } else {
    const inputs = context.scenario.risk.monteCarlo.inputs;
    ws.getCell(r, 1).value =
      `${mc.drawsDone.toLocaleString('en')} draws, seed ${mc.seed}${mc.cancelled ? ' (stopped early)' : ''}; uncertain inputs: ` +
      (inputs.length === 0 ? 'none (every draw equals the base case)' : inputs.map((input) => `${RISK_INPUT_LABELS[input.key]} (${input.distribution})`).join(', '));
    styleNote(ws.getCell(r, 1));
    r++;
    const header = [
      'Option: the change against the current option',
      'Chance the change loses money',
      'NPV of the change P10',
      'NPV of the change P50',
      'NPV of the change P90',
      'NPV of the change, mean',
      `Chance whole-farm coverage < ${mc.coverageThreshold.toFixed(2)} in any year`,
      "Whole herd's margin NPV P50 (not a return on the barn)",
    ];
    header.forEach((h, i) => (ws.getCell(r, i + 1).value = h));
    styleHeaderRow(ws, r, 1, header.length);
    ws.getRow(r).height = 40;
    for (let c = 1; c <= header.length; c++) ws.getCell(r, c).alignment = { wrapText: true, vertical: 'top' };
    r++;
    for (const option of mc.options) {
      const change = option.incrementalNpv;
      const cells: [number | string | null, string][] = [
        [change ? change.probabilityNegative : 'current option', PERCENT_FORMAT],
        [change ? change.p10 : 'n/a', money],
        [change ? change.p50 : 'n/a', money],
        [change ? change.p90 : 'n/a', money],
        [change ? change.mean : 'n/a', money],
        [option.probabilityCoverageBelowThreshold ?? (option.coverageReason === 'no-debt-service' ? 'no debt service' : 'n/a'), PERCENT_FORMAT],
        [option.npv.p50, money],
      ];
      ws.getCell(r, 1).value = `${option.name}${option.current ? ' (current)' : ''}`;
      cells.forEach(([value, fmt], i) => {
        const cell = ws.getCell(r, i + 2);
        cell.value = value ?? 'n/a';
        cell.numFmt = fmt;
        cell.alignment = { horizontal: 'right' };
      });
      r++;
    }
  }

  ws.getColumn(1).width = 52;
  for (let c = 2; c <= 8; c++) ws.getColumn(c).width = 16;
  freeze(ws, 3);
  setupPrint(ws, { lastRow: r, lastColumn: 8 });
  ws.eachRow((row) => row.eachCell((cell) => (cell.font ??= BASE_FONT)));
  return ws;
}

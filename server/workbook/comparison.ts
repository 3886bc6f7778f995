/** The options side by side: capital and financing (engine values) and the key results as links to the live cells. */
import type ExcelJS from 'exceljs';
import { METRIC_ROW } from './cash-flows.js';
import { INPUT_NAMES as N, optionName, type OptionLayout, type WorkbookContext } from './context.js';
import {
  BASE_FONT,
  COUNT_FORMAT,
  freeze,
  PERCENT_FORMAT,
  quoteSheet,
  RATIO_FORMAT,
  setFormula,
  setupPrint,
  styleHeaderRow,
  styleNote,
  styleSection,
  styleTotal,
  writeTitle,
  YEARS_FORMAT,
  address,
} from './layout.js';

export const COMPARISON_SHEET = 'Comparison';

type Cached = number | string | null;

interface ComparisonRow {
  label: string;
  format: 'money' | 'moneyWhole' | 'percent' | 'ratio' | 'years' | 'count' | 'text';
  /** A formula for this option, or null to write `value` as a plain engine value. */
  formula?: (layout: OptionLayout) => string | null;
  value: (layout: OptionLayout) => Cached;
  emphasis?: boolean;
}

const metricRef = (layout: OptionLayout, key: keyof typeof METRIC_ROW) => `${quoteSheet(layout.cashFlowSheet)}!${address(METRIC_ROW[key], 2)}`;

/** Builds the comparison sheet (one column per option). */
export function addComparisonSheet(context: WorkbookContext): ExcelJS.Worksheet {
  const ws = context.workbook.addWorksheet(COMPARISON_SHEET);
  writeTitle(
    ws,
    'Comparison of the options',
    `${context.results.currency}. Results link to the live cells on each option's cash-flow and coverage sheets; capital and financing are Byrecast engine values.`,
  );
  const headerRow = 4;
  const { options } = context;
  ws.getCell(headerRow, 1).value = 'Measure';
  options.forEach((layout, i) => {
    ws.getCell(headerRow, i + 2).value = `${layout.result.name}${layout.result.current ? ' (current)' : ''}`;
  });
  styleHeaderRow(ws, headerRow, 1, options.length + 1);
  ws.getRow(headerRow).height = 28;

  const rows: (ComparisonRow | string)[] = [
    'Capital and financing',
    { label: 'Stalls', format: 'count', value: (o) => o.result.stalls },
    { label: 'Capital at year 0', format: 'moneyWhole', value: (o) => o.result.capitalTotal },
    { label: 'Capital per stall', format: 'moneyWhole', value: (o) => o.result.capitalPerStall ?? 'n/a' },
    { label: 'Grants', format: 'moneyWhole', value: (o) => o.result.financing.grants },
    { label: 'Equity', format: 'moneyWhole', value: (o) => o.result.financing.equity },
    { label: 'Loan', format: 'moneyWhole', value: (o) => o.result.financing.loanAmount },
    'Results (live)',
    { label: 'NPV at the discount rate', format: 'money', formula: (o) => metricRef(o, 'npv'), value: (o) => o.result.npv, emphasis: true },
    { label: 'Rank by NPV (1 = highest)', format: 'count', formula: () => 'RANK', value: () => null },
    { label: 'IRR', format: 'percent', formula: (o) => metricRef(o, 'irr'), value: (o) => o.result.irr ?? 'n/a' },
    { label: 'MIRR', format: 'percent', formula: (o) => metricRef(o, 'mirr'), value: (o) => o.result.mirr ?? 'n/a' },
    { label: 'Simple payback (years)', format: 'years', formula: (o) => metricRef(o, 'payback'), value: (o) => o.result.paybackYears ?? 'n/a' },
    { label: 'Discounted payback (years)', format: 'years', formula: (o) => metricRef(o, 'discountedPayback'), value: (o) => o.result.discountedPaybackYears ?? 'n/a' },
    { label: 'Profitability index', format: 'ratio', formula: (o) => metricRef(o, 'profitabilityIndex'), value: (o) => o.result.profitabilityIndex ?? 'n/a' },
    { label: 'Lowest whole-farm coverage', format: 'ratio', formula: (o) => optionName(o, 'LowestCoverage'), value: (o) => o.result.lowestCoverage?.value ?? '' },
    { label: 'Year of lowest coverage', format: 'count', formula: (o) => optionName(o, 'LowestCoverageYear'), value: (o) => o.result.lowestCoverage?.year ?? '' },
    { label: 'Years below the coverage threshold', format: 'count', formula: (o) => optionName(o, 'YearsBelowThreshold'), value: (o) => o.result.yearsBelowCoverageThreshold.length },
    'Against the current option',
    { label: 'Incremental NPV', format: 'money', formula: (o) => (o.result.current ? null : metricRef(o, 'incrementalNpv')), value: (o) => o.result.incremental?.npv ?? 'n/a', emphasis: true },
    { label: 'Incremental IRR', format: 'percent', formula: (o) => (o.result.current ? null : metricRef(o, 'incrementalIrr')), value: (o) => (o.result.current ? 'n/a' : (o.result.incremental?.irr ?? 'n/a')) },
    { label: 'Break-even milk price (per kg)', format: 'text', value: (o) => (o.result.current ? 'n/a' : (o.result.incremental?.breakEvenMilkPrice ?? 'none in range')) },
    { label: 'Break-even lying-time response (kg/cow/day per h)', format: 'text', value: (o) => (o.result.current ? 'n/a' : (o.result.incremental?.breakEvenLyingResponse ?? (o.result.incremental?.breakEvenLyingResponseReason === 'same-lying-time' ? 'same lying time' : 'none in range'))) },
    { label: 'Equivalent annual capital cost per stall', format: 'money', value: (o) => o.result.equivalentAnnualCostPerStall ?? 'n/a' },
  ];

  let r = headerRow + 1;
  let npvRow = 0;
  const sortedNpvs = options.map((o) => o.result.npv).sort((a, b) => b - a);
  for (const spec of rows) {
    if (typeof spec === 'string') {
      r++;
      ws.getCell(r, 1).value = spec;
      styleSection(ws.getCell(r, 1));
      r++;
      continue;
    }
    ws.getCell(r, 1).value = spec.label;
    if (spec.label.startsWith('NPV')) npvRow = r;
    options.forEach((layout, i) => {
      const cell = ws.getCell(r, i + 2);
      cell.numFmt = formatOf(spec.format, context);
      cell.alignment = { horizontal: 'right' };
      const formula = spec.formula?.(layout) ?? null;
      if (formula === 'RANK') {
        const npvRange = `${address(npvRow, 2, true)}:${address(npvRow, options.length + 1, true)}`;
        setFormula(cell, `RANK(${address(npvRow, i + 2)},${npvRange})`, sortedNpvs.indexOf(layout.result.npv) + 1);
      } else if (formula === null) {
        const value = spec.value(layout);
        cell.value = typeof value === 'number' && spec.format === 'text' ? Number(value.toFixed(4)) : (value ?? '');
      } else {
        setFormula(cell, formula, spec.value(layout));
      }
    });
    if (spec.emphasis) styleTotal(ws, r, 1, options.length + 1);
    r++;
  }
  r++;
  const note = ws.getCell(r, 1);
  note.value = `Discount rate, interest rate and coverage threshold are the named cells ${N.discountRate}, ${N.interestRate} and ${N.coverageThreshold} on Assumptions. Break-even figures are Byrecast engine values (a root search, not a formula). n/a = not defined or not within the horizon; see the option's sheet for the reason.`;
  styleNote(note);

  ws.getColumn(1).width = 44;
  for (let i = 0; i < options.length; i++) ws.getColumn(i + 2).width = 19;
  freeze(ws, headerRow, 1);
  setupPrint(ws, { lastRow: r, lastColumn: options.length + 1, titleRows: `${headerRow}:${headerRow}` });
  ws.eachRow((row) => row.eachCell((cell) => (cell.font ??= BASE_FONT)));
  return ws;
}

function formatOf(format: ComparisonRow['format'], context: WorkbookContext): string {
  switch (format) {
    case 'money':
      return context.formats.money;
    case 'moneyWhole':
      return context.formats.moneyWhole;
    case 'percent':
      return PERCENT_FORMAT;
    case 'ratio':
      return RATIO_FORMAT;
    case 'years':
      return YEARS_FORMAT;
    case 'count':
      return COUNT_FORMAT;
    default:
      return '#,##0.0000';
  }
}

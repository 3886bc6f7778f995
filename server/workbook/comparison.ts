/** The options side by side: capital and financing (engine values) and the key results as links to the live cells. */
import type ExcelJS from 'exceljs';
import { herdCostsEntered } from '../../shared/herd-costs.js';
import { METRIC_ROW } from './cash-flows.js';
import { INPUT_NAMES as N, optionName, type OptionLayout, type WorkbookContext } from './context.js';
import {
  BASE_FONT,
  COUNT_FORMAT,
  COVERAGE_FORMAT,
  freeze,
  PERCENT_FORMAT,
  quoteSheet,
  setFormula,
  setupPrint,
  shadeBelowThreshold,
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
  format: 'money' | 'moneyWhole' | 'percent' | 'coverage' | 'years' | 'count' | 'text';
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

  const na = (o: OptionLayout, value: number | null | undefined, fallback = 'n/a'): Cached => (o.result.current ? 'n/a' : (value ?? fallback));
  const rows: (ComparisonRow | string)[] = [
    'The change against the current option (what the decision turns on)',
    { label: 'NPV of the change', format: 'money', formula: (o) => (o.result.current ? null : metricRef(o, 'incrementalNpv')), value: (o) => na(o, o.result.incremental?.npv), emphasis: true },
    { label: 'Rank by NPV of the change (1 = best)', format: 'count', formula: () => 'RANK', value: () => null },
    { label: 'IRR of the change', format: 'percent', formula: (o) => (o.result.current ? null : metricRef(o, 'incrementalIrr')), value: (o) => na(o, o.result.incremental?.irr) },
    { label: 'MIRR of the change', format: 'percent', value: (o) => na(o, o.result.incremental?.mirr) },
    { label: 'Payback of the change (years, with the horizon values)', format: 'years', value: (o) => na(o, o.result.incremental?.paybackYears, 'not reached') },
    { label: 'Payback from operations (years, without salvage and herd value)', format: 'years', value: (o) => na(o, o.result.incremental?.paybackFromOperationsYears, 'not reached') },
    { label: 'Share of the outlay operations recover', format: 'percent', value: (o) => na(o, o.result.incremental?.operationsRecoveredShare) },
    { label: 'Break-even milk price (per kg)', format: 'text', value: (o) => (o.result.current ? 'n/a' : (o.result.incremental?.breakEvenMilkPrice ?? 'none in range')) },
    { label: 'Break-even lying-time response (kg/cow/day per h)', format: 'text', value: (o) => (o.result.current ? 'n/a' : (o.result.incremental?.breakEvenLyingResponse ?? (o.result.incremental?.breakEvenLyingResponseReason === 'same-lying-time' ? 'same lying time' : 'none in range'))) },
    ...splitRows(context),
    'Coverage',
    { label: 'Lowest whole-farm coverage', format: 'coverage', formula: (o) => optionName(o, 'LowestCoverage'), value: (o) => o.result.lowestCoverage?.value ?? '' },
    { label: 'Year of lowest coverage', format: 'count', formula: (o) => optionName(o, 'LowestCoverageYear'), value: (o) => o.result.lowestCoverage?.year ?? '' },
    { label: 'Lowest project coverage (the change)', format: 'coverage', value: (o) => o.result.lowestProjectCoverage?.value ?? 'n/a' },
    { label: 'Years below the coverage threshold', format: 'count', formula: (o) => optionName(o, 'YearsBelowThreshold'), value: (o) => o.result.yearsBelowCoverageThreshold.length },
    { label: 'Milk price for whole-farm coverage 1.00 (per kg)', format: 'text', value: (o) => o.result.breakEvenMilkPriceForCoverage.atOne ?? 'none in range' },
    { label: 'Milk price for whole-farm coverage at the threshold (per kg)', format: 'text', value: (o) => o.result.breakEvenMilkPriceForCoverage.atThreshold ?? 'none in range' },
    'Capital and financing',
    { label: 'Stalls', format: 'count', value: (o) => o.result.stalls },
    { label: 'Capital at year 0', format: 'moneyWhole', value: (o) => o.result.capitalTotal },
    { label: 'Capital per stall', format: 'moneyWhole', value: (o) => o.result.capitalPerStall ?? 'n/a' },
    { label: 'Grants', format: 'moneyWhole', value: (o) => o.result.financing.grants },
    { label: 'Equity', format: 'moneyWhole', value: (o) => o.result.financing.equity },
    { label: 'Loan', format: 'moneyWhole', value: (o) => o.result.financing.loanAmount },
    { label: 'Equivalent annual capital cost per stall', format: 'money', value: (o) => o.result.equivalentAnnualCostPerStall ?? 'n/a' },
    "The whole herd's margin under each option (not a return on the barn)",
    { label: "NPV of the whole herd's margin", format: 'money', formula: (o) => metricRef(o, 'npv'), value: (o) => o.result.npv },
    { label: "IRR of the whole herd's margin", format: 'percent', formula: (o) => metricRef(o, 'irr'), value: (o) => o.result.irr ?? 'n/a' },
  ];

  let r = headerRow + 1;
  let npvRow = 0;
  const candidates = options.filter((o) => !o.result.current);
  const sortedNpvs = candidates.map((o) => o.result.incremental?.npv ?? 0).sort((a, b) => b - a);
  for (const spec of rows) {
    if (typeof spec === 'string') {
      r++;
      ws.getCell(r, 1).value = spec;
      styleSection(ws.getCell(r, 1));
      r++;
      continue;
    }
    ws.getCell(r, 1).value = spec.label;
    if (spec.label === 'NPV of the change') npvRow = r;
    options.forEach((layout, i) => {
      const cell = ws.getCell(r, i + 2);
      cell.numFmt = formatOf(spec.format, context);
      cell.alignment = { horizontal: 'right' };
      const formula = spec.formula?.(layout) ?? null;
      if (formula === 'RANK' && layout.result.current) {
        cell.value = 'n/a';
      } else if (formula === 'RANK') {
        // RANK skips the current option's text cell: only the changes are ranked.
        const npvRange = `${address(npvRow, 2, true)}:${address(npvRow, options.length + 1, true)}`;
        setFormula(cell, `RANK(${address(npvRow, i + 2)},${npvRange})`, sortedNpvs.indexOf(layout.result.incremental?.npv ?? 0) + 1);
      } else if (formula === null) {
        const value = spec.value(layout);
        cell.value = typeof value === 'number' && spec.format === 'text' ? Number(value.toFixed(4)) : (value ?? '');
      } else {
        setFormula(cell, formula, spec.value(layout));
      }
    });
    if (spec.emphasis) styleTotal(ws, r, 1, options.length + 1);
    // A coverage below the farm's threshold is shaded, live: a new threshold on Assumptions moves it.
    if (spec.format === 'coverage') shadeBelowThreshold(ws, `${address(r, 2)}:${address(r, options.length + 1)}`, N.coverageThreshold);
    r++;
  }
  r++;
  const note = ws.getCell(r, 1);
  note.value = `Discount rate, interest rate and coverage threshold are the named cells ${N.discountRate}, ${N.interestRate} and ${N.coverageThreshold} on Assumptions; coverage below the threshold is shaded. Break-even figures, the paybacks of the change, the split into housing and expansion (the barn as planned in both parts, so stalls built for the added cows sit with the housing) and project coverage here are Byrecast engine values (root searches and the change's own series); the stress figures are on the Stress sheet. n/a = not defined or not within the horizon; see the option's sheet for the reason.`;
  styleNote(note);

  ws.getColumn(1).width = 44;
  for (let i = 0; i < options.length; i++) ws.getColumn(i + 2).width = 19;
  freeze(ws, headerRow, 1);
  setupPrint(ws, { lastRow: r, lastColumn: options.length + 1, titleRows: `${headerRow}:${headerRow}` });
  ws.eachRow((row) => row.eachCell((cell) => (cell.font ??= BASE_FONT)));
  return ws;
}

/**
 * The change in two parts when an option changes the herd: the housing with today's herd, and
 * the expansion (what the added cows bring and cost); engine values, the two NPVs add up to the change's.
 */
function splitRows(context: WorkbookContext): (ComparisonRow | string)[] {
  if (!context.options.some((o) => o.result.incremental?.split)) return [];
  const part = (o: OptionLayout, which: 'housingTodaysHerd' | 'expansion') => o.result.incremental?.split?.[which] ?? null;
  const shown = (o: OptionLayout, value: number | null | undefined, fallback: string): Cached => {
    if (o.result.current) return 'n/a';
    if (!o.result.incremental?.split) return 'no herd change';
    return value ?? fallback;
  };
  const costsEntered = herdCostsEntered(context.scenario.herd);
  const title = 'The change in two parts: the housing with today\'s herd, and the expansion (the added cows)';
  return [
    costsEntered ? title : `${title} — no cost per cow besides feed is entered, so the expansion part leaves out vet, breeding, milking labour and replacement`,
    { label: "NPV of the housing, today's herd", format: 'money', value: (o) => shown(o, part(o, 'housingTodaysHerd')?.npv, 'n/a') },
    { label: 'NPV of the expansion (the added cows)', format: 'money', value: (o) => shown(o, part(o, 'expansion')?.npv, 'n/a') },
    { label: "IRR of the housing, today's herd", format: 'percent', value: (o) => shown(o, part(o, 'housingTodaysHerd')?.irr, 'not defined') },
    { label: 'IRR of the expansion', format: 'percent', value: (o) => shown(o, part(o, 'expansion')?.irr, 'not defined') },
    { label: 'Payback of the expansion (years)', format: 'years', value: (o) => shown(o, part(o, 'expansion')?.paybackYears, 'not reached') },
  ];
}

function formatOf(format: ComparisonRow['format'], context: WorkbookContext): string {
  switch (format) {
    case 'money':
      return context.formats.money;
    case 'moneyWhole':
      return context.formats.moneyWhole;
    case 'percent':
      return PERCENT_FORMAT;
    case 'coverage':
      return COVERAGE_FORMAT;
    case 'years':
      return YEARS_FORMAT;
    case 'count':
      return COUNT_FORMAT;
    default:
      return '#,##0.0000';
  }
}

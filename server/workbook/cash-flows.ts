/**
 * One sheet per option: the yearly lines (engine values in cents), the totals, net cash flow,
 * discounting and the metrics as live formulas over them and over the named inputs.
 */
import type ExcelJS from 'exceljs';
import { resolvedGrowth, type YearLine } from '../../shared/engine/index.js';
import { hasYearlyPriceIndex } from './assumptions.js';
import { INPUT_NAMES as N, MILK_QUALITY_PRICE, defineName, optionName, type OptionLayout, type WorkbookContext } from './context.js';
import {
  address,
  BASE_FONT,
  columnLetter,
  COUNT_FORMAT,
  freeze,
  PERCENT_FORMAT,
  QUANTITY_FORMAT,
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
  YEARS_FORMAT,
} from './layout.js';

type MoneyKey = {
  [K in keyof YearLine]: YearLine[K] extends number ? K : never;
}[keyof YearLine];

type RowKind = 'section' | 'value' | 'formula';

interface RowSpec {
  key: string;
  label: string;
  kind: RowKind;
  /** Engine line written as a value in every year. */
  line?: MoneyKey;
  format?: 'money' | 'count' | 'quantity' | 'price' | 'ratio' | 'years';
  /** Sum across the years in the Total column. */
  total?: boolean;
  /** Bold with a rule above. */
  emphasis?: boolean;
  note?: boolean;
}

/** Rows of a cash-flow sheet, top to bottom; row numbers follow from the order. */
const ROWS: readonly RowSpec[] = [
  { key: 'herdSection', label: 'Herd and milk', kind: 'section' },
  { key: 'cows', label: 'Cows (head)', kind: 'value', line: 'cows', format: 'count' },
  { key: 'milkKg', label: 'Milk sold (kg)', kind: 'value', line: 'milkSoldKg', format: 'count', total: true },
  { key: 'milkPrice', label: 'Milk price (per kg)', kind: 'formula', format: 'price' },
  { key: 'incomeSection', label: 'Income', kind: 'section' },
  { key: 'milkIncome', label: 'Milk income', kind: 'formula', format: 'money', total: true },
  { key: 'manureValue', label: 'Manure fertiliser value', kind: 'value', line: 'manureValue', format: 'money', total: true },
  { key: 'income', label: 'Total income', kind: 'formula', format: 'money', total: true, emphasis: true },
  { key: 'costSection', label: 'Operating costs', kind: 'section' },
  { key: 'feed', label: 'Feed', kind: 'value', line: 'feed', format: 'money', total: true },
  { key: 'labourScraping', label: 'Labour: scraping', kind: 'value', line: 'labourScraping', format: 'money', total: true },
  { key: 'labourBedCare', label: 'Labour: bed care', kind: 'value', line: 'labourBedCare', format: 'money', total: true },
  { key: 'labourBeddingTopUp', label: 'Labour: bedding top-up', kind: 'value', line: 'labourBeddingTopUp', format: 'money', total: true },
  { key: 'labourTroughs', label: 'Labour: water troughs', kind: 'value', line: 'labourTroughs', format: 'money', total: true },
  { key: 'labourGrazing', label: 'Labour: grazing work', kind: 'value', line: 'labourGrazing', format: 'money', total: true },
  { key: 'labourMilking', label: 'Labour: milking and cows', kind: 'value', line: 'labourMilking', format: 'money', total: true },
  { key: 'bedding', label: 'Bedding material', kind: 'value', line: 'bedding', format: 'money', total: true },
  { key: 'health', label: 'Health', kind: 'value', line: 'health', format: 'money', total: true },
  { key: 'culling', label: 'Extra culling', kind: 'value', line: 'culling', format: 'money', total: true },
  { key: 'herdReplacement', label: 'Herd replacement', kind: 'value', line: 'herdReplacement', format: 'money', total: true },
  { key: 'otherCowCosts', label: 'Other cow costs', kind: 'value', line: 'otherCowCosts', format: 'money', total: true },
  { key: 'maintenance', label: 'Maintenance', kind: 'value', line: 'maintenance', format: 'money', total: true },
  { key: 'energy', label: 'Energy', kind: 'value', line: 'energy', format: 'money', total: true },
  { key: 'runningCosts', label: 'Other running costs', kind: 'value', line: 'runningCosts', format: 'money', total: true },
  { key: 'manureHandling', label: 'Manure handling', kind: 'value', line: 'manureHandling', format: 'money', total: true },
  { key: 'costs', label: 'Total operating costs', kind: 'formula', format: 'money', total: true, emphasis: true },
  { key: 'margin', label: 'Operating margin', kind: 'formula', format: 'money', total: true, emphasis: true },
  { key: 'capitalSection', label: 'Capital, herd and tax', kind: 'section' },
  { key: 'capital', label: 'Capital investment', kind: 'value', line: 'capital', format: 'money', total: true },
  { key: 'grants', label: 'Grants received', kind: 'value', line: 'grants', format: 'money', total: true },
  { key: 'replacements', label: 'Replacements', kind: 'value', line: 'replacements', format: 'money', total: true },
  { key: 'herdPurchases', label: 'Herd purchases (net)', kind: 'value', line: 'herdPurchases', format: 'money', total: true },
  { key: 'salvage', label: 'Salvage value (year H)', kind: 'value', line: 'salvage', format: 'money', total: true },
  { key: 'herdValue', label: 'Added herd value (year H)', kind: 'value', line: 'herdValueAtHorizon', format: 'money', total: true },
  { key: 'tax', label: 'Income tax', kind: 'value', line: 'tax', format: 'money', total: true },
  { key: 'net', label: 'Net cash flow', kind: 'formula', format: 'money', total: true, emphasis: true },
  { key: 'cumulative', label: 'Cumulative net cash flow', kind: 'formula', format: 'money' },
  { key: 'discountFactor', label: 'Discount factor 1/(1+r)^t', kind: 'formula', format: 'ratio' },
  { key: 'discounted', label: 'Discounted net cash flow', kind: 'formula', format: 'money', total: true },
  { key: 'cumulativeDiscounted', label: 'Cumulative discounted cash flow', kind: 'formula', format: 'money' },
  { key: 'cashForDebtService', label: 'Cash available for debt service', kind: 'formula', format: 'money', total: true, emphasis: true },
  { key: 'incremental', label: 'Incremental net cash flow vs current', kind: 'formula', format: 'money', total: true },
  { key: 'paybackHelper', label: 'Payback crossing (helper)', kind: 'formula', format: 'years', note: true },
  { key: 'discountedPaybackHelper', label: 'Discounted payback crossing (helper)', kind: 'formula', format: 'years', note: true },
];

const HEADER_ROW = 4;
const FIRST_YEAR_COLUMN = 2;

/** Row number of each key on every cash-flow sheet. */
export const CASH_FLOW_ROW: Readonly<Record<string, number>> = Object.fromEntries(
  ROWS.map((spec, index) => [spec.key, HEADER_ROW + 1 + index]),
);

function row(key: string): number {
  const r = CASH_FLOW_ROW[key];
  if (r === undefined) throw new Error(`unknown cash-flow row ${key}`);
  return r;
}

/** Column of year t (t = 0..H) on a cash-flow sheet. */
export function yearColumn(t: number): number {
  return FIRST_YEAR_COLUMN + t;
}

const METRIC_KEYS = ['npv', 'irr', 'mirr', 'payback', 'discountedPayback', 'profitabilityIndex', 'incrementalNpv', 'incrementalIrr'] as const;
type MetricKey = (typeof METRIC_KEYS)[number];
const METRICS_HEADER_ROW = HEADER_ROW + ROWS.length + 2;

/** Row of each metric on a cash-flow sheet (value in column B). */
export const METRIC_ROW: Readonly<Record<MetricKey, number>> = Object.fromEntries(
  METRIC_KEYS.map((key, index) => [key, METRICS_HEADER_ROW + 1 + index]),
) as Record<MetricKey, number>;

/** Defined-name suffix of each metric (Opt1_NPV …). */
export const METRIC_NAME: Readonly<Record<MetricKey, string>> = {
  npv: 'NPV',
  irr: 'IRR',
  mirr: 'MIRR',
  payback: 'Payback',
  discountedPayback: 'DiscountedPayback',
  profitabilityIndex: 'ProfitabilityIndex',
  incrementalNpv: 'IncrementalNPV',
  incrementalIrr: 'IncrementalIRR',
};

/**
 * Engine milk price per kg of an option in year t: today's price plus the option's quality
 * premium, grown year by year as the projection compounds it, times the year's price index.
 */
function grownMilkPrice(context: WorkbookContext, layout: OptionLayout, t: number): number {
  const { herd } = context.scenario;
  let grown = 1;
  const growth = resolvedGrowth(herd.growth).milkPrice;
  for (let y = 1; y <= t; y++) grown *= 1 + growth;
  return (herd.milkPricePerKg + qualityPremium(context, layout)) * grown * (herd.yearlyPriceIndex.milkPrice?.[t - 1] ?? 1);
}

function qualityPremium(context: WorkbookContext, layout: OptionLayout): number {
  return context.scenario.options.find((option) => option.id === layout.result.id)?.milkQualityPricePerKg ?? 0;
}

/** The milk price formula of year t: (MilkPrice + Opt_n_MilkQualityPrice) × growth, × INDEX(MilkPriceIndex, t) when an index is set. */
function milkPriceFormula(context: WorkbookContext, layout: OptionLayout, t: number): string {
  const index = hasYearlyPriceIndex(context.scenario) ? `*INDEX(${N.milkPriceIndex},${t})` : '';
  return `(${N.milkPrice}+${optionName(layout, MILK_QUALITY_PRICE)})*(1+${N.milkPriceGrowth})^${t}${index}`;
}

function sumColumns(r: number, from: number, to: number): string {
  return `SUM(${address(r, from)}:${address(r, to)})`;
}

/** The formula and its cached (engine) value for a formula row in year t. */
function formulaFor(key: string, t: number, line: YearLine, layout: OptionLayout, context: WorkbookContext): { formula: string; result: number | string } {
  const c = columnLetter(yearColumn(t));
  const prev = columnLetter(yearColumn(t - 1));
  const at = (k: string) => `${c}${row(k)}`;
  const current = context.current;
  switch (key) {
    case 'milkPrice':
      return { formula: milkPriceFormula(context, layout, t), result: grownMilkPrice(context, layout, t) };
    case 'milkIncome':
      return { formula: `ROUND(${at('milkKg')}*${at('milkPrice')},2)`, result: line.milkIncome };
    case 'income':
      return { formula: `${at('milkIncome')}+${at('manureValue')}`, result: line.milkIncome + line.manureValue };
    case 'costs':
      return { formula: `SUM(${at('feed')}:${at('manureHandling')})`, result: line.milkIncome + line.manureValue - line.operatingMargin };
    case 'margin':
      return { formula: `${at('income')}-${at('costs')}`, result: line.operatingMargin };
    case 'net':
      return {
        formula: `${at('margin')}-${at('capital')}+${at('grants')}-${at('replacements')}-${at('herdPurchases')}+${at('salvage')}+${at('herdValue')}-${at('tax')}`,
        result: line.netCashFlow,
      };
    case 'cumulative':
      return t === 0
        ? { formula: at('net'), result: line.netCashFlow }
        : { formula: `${prev}${row('cumulative')}+${at('net')}`, result: cumulativeOf(layout, t) };
    case 'discountFactor':
      return { formula: `1/(1+${N.discountRate})^${t}`, result: 1 / (1 + context.scenario.finance.discountRate) ** t };
    case 'discounted':
      return { formula: `${at('net')}*${at('discountFactor')}`, result: line.netCashFlow / (1 + context.scenario.finance.discountRate) ** t };
    case 'cumulativeDiscounted':
      return t === 0
        ? { formula: at('discounted'), result: line.netCashFlow }
        : { formula: `${prev}${row('cumulativeDiscounted')}+${at('discounted')}`, result: cumulativeDiscountedOf(layout, t, context) };
    case 'cashForDebtService':
      return { formula: `${at('margin')}-${at('tax')}`, result: line.cashAvailableForDebtService };
    case 'incremental': {
      const base = current.result.years[t]?.netCashFlow ?? 0;
      return { formula: `${at('net')}-${quoteSheet(current.cashFlowSheet)}!${at('net')}`, result: line.netCashFlow - base };
    }
    case 'paybackHelper':
      return crossingFormula(
        t,
        'cumulative',
        'net',
        layout.result.cashFlows.map((_, i) => cumulativeOf(layout, i)),
        layout.result.cashFlows,
      );
    case 'discountedPaybackHelper':
      return crossingFormula(
        t,
        'cumulativeDiscounted',
        'discounted',
        layout.result.cashFlows.map((_, i) => cumulativeDiscountedOf(layout, i, context)),
        layout.result.cashFlows.map((cf, i) => cf / (1 + context.scenario.finance.discountRate) ** i),
      );
    default:
      throw new Error(`no formula for cash-flow row ${key}`);
  }
}

function cumulativeOf(layout: OptionLayout, t: number): number {
  let sum = 0;
  for (let i = 0; i <= t; i++) sum += layout.result.cashFlows[i] ?? 0;
  return sum;
}

function cumulativeDiscountedOf(layout: OptionLayout, t: number, context: WorkbookContext): number {
  let sum = 0;
  for (let i = 0; i <= t; i++) sum += (layout.result.cashFlows[i] ?? 0) / (1 + context.scenario.finance.discountRate) ** i;
  return sum;
}

/**
 * The year a cumulative row first reaches zero, interpolated linearly inside the year
 * ((t − 1) + shortfall ÷ flow of year t), or "" in every other year; MIN over the row is the
 * payback, because each crossing lies inside its own year.
 */
function crossingFormula(
  t: number,
  cumulativeKey: string,
  flowKey: string,
  cumulativeValues: readonly number[],
  flowValues: readonly number[],
): { formula: string; result: number | string } {
  const c = columnLetter(yearColumn(t));
  const cum = `${c}${row(cumulativeKey)}`;
  const thisCum = cumulativeValues[t] ?? 0;
  if (t === 0) return { formula: `IF(${cum}>=0,0,"")`, result: thisCum >= 0 ? 0 : '' };
  const prevCum = `${columnLetter(yearColumn(t - 1))}${row(cumulativeKey)}`;
  const flow = `${c}${row(flowKey)}`;
  const before = cumulativeValues[t - 1] ?? 0;
  const flowValue = flowValues[t] ?? 0;
  const crosses = before < 0 && thisCum >= 0;
  return {
    formula: `IF(AND(${prevCum}<0,${cum}>=0),${t - 1}+(-${prevCum})/${flow},"")`,
    result: crosses ? t - 1 + -before / flowValue : '',
  };
}

/**
 * Starting guess for IRR(): the engine's root rounded to 0.1 %. Spreadsheets iterate from 10 %
 * by default and can fail to converge for rates far from it (LibreOffice gives #N/A on a −17 % flow).
 */
function irrGuess(rate: number): string {
  return (Math.round(rate * 1000) / 1000).toString();
}

function reasonText(reason: string | undefined): string {
  if (reason === 'no-sign-change') return 'the flows never change sign';
  if (reason === 'multiple-roots') return 'the flows change sign more than once and have several roots';
  return 'no root between −99 % and +1 000 %';
}

function numberFormat(spec: RowSpec, context: WorkbookContext): string {
  switch (spec.format) {
    case 'count':
      return COUNT_FORMAT;
    case 'quantity':
      return QUANTITY_FORMAT;
    case 'price':
      return '#,##0.0000';
    case 'ratio':
      return '0.0000';
    case 'years':
      return YEARS_FORMAT;
    default:
      return context.formats.moneyWhole;
  }
}

/** Builds the cash-flow sheet of one option and its defined names. */
export function addCashFlowSheet(context: WorkbookContext, layout: OptionLayout): ExcelJS.Worksheet {
  const { workbook, horizon } = context;
  const ws = workbook.addWorksheet(layout.cashFlowSheet, { properties: { defaultRowHeight: 13 } });
  const isCurrent = layout.result.current;
  const lastYearColumn = yearColumn(horizon);
  const totalColumn = lastYearColumn + 1;
  writeTitle(
    ws,
    `Yearly cash flow — ${layout.result.name}${isCurrent ? ' (current option)' : ''}`,
    `${context.results.currency}, nominal. Year 0 = investment at the end of construction; every flow falls at the end of its year. ` +
      'Lines are Byrecast engine values rounded to cents; totals, net cash flow and the metrics below are live formulas over them and the named inputs on Assumptions.',
  );

  ws.getCell(HEADER_ROW, 1).value = `Line (${context.results.currency})`;
  for (let t = 0; t <= horizon; t++) ws.getCell(HEADER_ROW, yearColumn(t)).value = `Year ${t}`;
  ws.getCell(HEADER_ROW, totalColumn).value = 'Total';
  styleHeaderRow(ws, HEADER_ROW, 1, totalColumn);

  for (const spec of ROWS) {
    const r = row(spec.key);
    const label = ws.getCell(r, 1);
    label.value = spec.label;
    if (spec.kind === 'section') {
      styleSection(label);
      continue;
    }
    if (spec.key === 'incremental' && isCurrent) {
      label.value = 'Incremental net cash flow vs current: not applicable (this is the current option)';
      styleNote(label);
      continue;
    }
    const fmt = numberFormat(spec, context);
    for (let t = 0; t <= horizon; t++) {
      const line = layout.result.years[t];
      if (!line) continue;
      const cell = ws.getCell(r, yearColumn(t));
      cell.numFmt = fmt;
      if (spec.kind === 'value' && spec.line) cell.value = line[spec.line];
      else if (spec.key === 'milkPrice' && t === 0) continue;
      else if (spec.key === 'milkIncome' && t === 0) cell.value = line.milkIncome;
      else {
        const { formula, result } = formulaFor(spec.key, t, line, layout, context);
        setFormula(cell, formula, result);
      }
    }
    if (spec.total) {
      const cell = ws.getCell(r, totalColumn);
      cell.numFmt = fmt;
      const values = layout.result.years.map((line, t) => {
        if (spec.line) return line[spec.line];
        const computed = formulaFor(spec.key, t, line, layout, context).result;
        return typeof computed === 'number' ? computed : 0;
      });
      setFormula(cell, sumColumns(r, yearColumn(0), lastYearColumn), values.reduce((a, b) => a + b, 0));
    }
    if (spec.emphasis) styleTotal(ws, r, 1, totalColumn);
    if (spec.note) {
      styleNote(label);
      for (let t = 0; t <= horizon; t++) styleNote(ws.getCell(r, yearColumn(t)));
    }
  }

  defineRowName(context, layout, 'NetCashFlow', row('net'));
  defineRowName(context, layout, 'OperatingMargin', row('margin'));
  defineRowName(context, layout, 'MilkIncome', row('milkIncome'));
  defineRowName(context, layout, 'CashForDebtService', row('cashForDebtService'));
  if (!isCurrent) defineRowName(context, layout, 'IncrementalNetCashFlow', row('incremental'));

  writeMetrics(ws, context, layout);

  for (let t = 0; t <= horizon + 1; t++) ws.getColumn(yearColumn(t)).width = 13;
  ws.getColumn(1).width = 36;
  ws.getColumn(3).width = 13;
  freeze(ws, HEADER_ROW, 1);
  setupPrint(ws, {
    lastRow: METRIC_ROW.incrementalIrr,
    lastColumn: totalColumn,
    titleRows: `${HEADER_ROW}:${HEADER_ROW}`,
    repeatFirstColumn: true,
    pagesWide: Math.max(1, Math.ceil((horizon + 2) / 11)),
  });
  ws.eachRow((r) => r.eachCell((cell) => (cell.font ??= BASE_FONT)));
  return ws;
}

function defineRowName(context: WorkbookContext, layout: OptionLayout, key: string, r: number): void {
  defineName(context.workbook, optionName(layout, key), sheetRef(layout.cashFlowSheet, r, yearColumn(0), r, yearColumn(context.horizon)));
}

function writeMetrics(ws: ExcelJS.Worksheet, context: WorkbookContext, layout: OptionLayout): void {
  const { result } = layout;
  const first = yearColumn(0);
  const last = yearColumn(context.horizon);
  const netRange = `${address(row('net'), first)}:${address(row('net'), last)}`;
  const incRange = `${address(row('incremental'), first)}:${address(row('incremental'), last)}`;
  const afterT0 = (r: number) => `${address(r, first + 1)}:${address(r, last)}`;

  ws.getCell(METRICS_HEADER_ROW, 1).value = 'Metric';
  ws.getCell(METRICS_HEADER_ROW, 2).value = 'Value';
  ws.getCell(METRICS_HEADER_ROW, 3).value = 'How it is computed';
  styleHeaderRow(ws, METRICS_HEADER_ROW, 1, 12);
  ws.getCell(METRICS_HEADER_ROW, 3).alignment = { horizontal: 'left' };

  const put = (key: MetricKey, label: string, fmt: string, formula: string | null, cached: number | string | null, note: string) => {
    const r = METRIC_ROW[key];
    ws.getCell(r, 1).value = label;
    const cell = ws.getCell(r, 2);
    cell.numFmt = fmt;
    if (formula === null) cell.value = cached ?? '';
    else setFormula(cell, formula, cached);
    cell.font = { ...BASE_FONT, bold: true };
    const noteCell = ws.getCell(r, 3);
    noteCell.value = note;
    styleNote(noteCell);
    defineName(context.workbook, optionName(layout, METRIC_NAME[key]), sheetRef(layout.cashFlowSheet, r, 2));
  };

  const npvFormula = (r: number) => `${address(r, first)}+NPV(${N.discountRate},${afterT0(r)})`;
  put('npv', `NPV at the discount rate (${context.results.currency})`, context.formats.money, npvFormula(row('net')), result.npv,
    'Year-0 flow added undiscounted; spreadsheet NPV() discounts its first value one period, so it gets years 1..H only.');
  put('irr', 'IRR', PERCENT_FORMAT, result.irr === null ? null : `IRR(${netRange},${irrGuess(result.irr)})`, result.irr ?? 'n/a',
    `${result.irr === null ? `Not defined: ${reasonText(result.irrReason)}. ` : ''}Rate at which the NPV of the net cash flow is zero.`);
  put('mirr', 'MIRR', PERCENT_FORMAT, result.mirr === null ? null : `MIRR(${netRange},${N.interestRate},${N.discountRate})`, result.mirr ?? 'n/a',
    'Finance rate = loan interest rate, reinvestment rate = discount rate.');
  const paybackFormula = (helperKey: string) => {
    const helper = `${address(row(helperKey), first)}:${address(row(helperKey), last)}`;
    return `IF(COUNT(${helper})=0,"n/a",MIN(${helper}))`;
  };
  put('payback', 'Simple payback (years)', YEARS_FORMAT, paybackFormula('paybackHelper'), result.paybackYears ?? 'n/a',
    'First year cumulative net cash flow reaches 0, interpolated inside the year; n/a = not within the horizon.');
  put('discountedPayback', 'Discounted payback (years)', YEARS_FORMAT, paybackFormula('discountedPaybackHelper'),
    result.discountedPaybackYears ?? 'n/a', 'The same on the discounted flows.');
  const npvCell = address(METRIC_ROW.npv, 2);
  const t0 = address(row('net'), first);
  put('profitabilityIndex', 'Profitability index', RATIO_FORMAT, `IF(${t0}<0,(${npvCell}-${t0})/-${t0},"n/a")`, result.profitabilityIndex ?? 'n/a',
    'Present value of years 1..H ÷ the year-0 outlay; above 1 means NPV > 0; n/a without a year-0 outlay.');

  const inc = result.incremental;
  if (result.current || !inc) {
    for (const key of ['incrementalNpv', 'incrementalIrr'] as const) {
      ws.getCell(METRIC_ROW[key], 1).value = key === 'incrementalNpv' ? 'Incremental NPV vs current' : 'Incremental IRR vs current';
      ws.getCell(METRIC_ROW[key], 2).value = 'n/a';
      ws.getCell(METRIC_ROW[key], 2).alignment = { horizontal: 'right' };
    }
    return;
  }
  put('incrementalNpv', `Incremental NPV vs current (${context.results.currency})`, context.formats.money, npvFormula(row('incremental')), inc.npv,
    "NPV of this option's net cash flow minus the current option's, year by year.");
  put('incrementalIrr', 'Incremental IRR vs current', PERCENT_FORMAT, inc.irr === null ? null : `IRR(${incRange},${irrGuess(inc.irr)})`, inc.irr ?? 'n/a',
    `${inc.irr === null ? `Not defined: ${reasonText(inc.irrReason)}. ` : ''}IRR of the incremental cash flow.`);
}

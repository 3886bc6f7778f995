/**
 * Every input of the scenario with its unit and source tag, read from the shared zod schema's
 * descriptions; the inputs the formulas use are named cells (workbook defined names).
 */
import type ExcelJS from 'exceljs';
import { scenarioSchema, type Option, type Source } from '../../shared/schema/index.js';
import { quoteSource } from '../../shared/source-edits.js';
import { INPUT_NAMES, MILK_QUALITY_PRICE, defineName, optionName, type WorkbookContext } from './context.js';
import { codeToWords, currencySymbol, isInternal, plainLabel, plainUnit, plainValue } from './plain-words.js';
import {
  BASE_FONT,
  COUNT_FORMAT,
  fitWrappedRow,
  freeze,
  PERCENT_FORMAT,
  setupPrint,
  sheetRef,
  styleHeaderRow,
  styleInput,
  styleSection,
  writeTitle,
} from './layout.js';

export const ASSUMPTIONS_SHEET = 'Assumptions';

/** Scenario paths of the inputs formulas refer to, and their defined names. */
const NAMED_PATHS: Readonly<Record<string, string>> = {
  'finance.discountRate': INPUT_NAMES.discountRate,
  'finance.interestRate': INPUT_NAMES.interestRate,
  'finance.paymentsPerYear': INPUT_NAMES.paymentsPerYear,
  'finance.termYears': INPUT_NAMES.termYears,
  'finance.coverageThreshold': INPUT_NAMES.coverageThreshold,
  'herd.milkPricePerKg': INPUT_NAMES.milkPrice,
  'herd.growth.milkPrice': INPUT_NAMES.milkPriceGrowth,
  'herd.existingCashForDebtServicePerYear': INPUT_NAMES.existingCash,
  'herd.existingDebtPaymentsPerYear': INPUT_NAMES.existingDebt,
  'herd.existingCashHerdMarginPerYear': INPUT_NAMES.herdMarginInExistingCash,
};

/** True when the scenario sets a yearly milk price or feed index: the Assumptions sheet then lists it year by year. */
export function hasYearlyPriceIndex(scenario: WorkbookContext['scenario']): boolean {
  const { milkPrice, feed } = scenario.herd.yearlyPriceIndex;
  return milkPrice !== null || feed !== null;
}

/** Inputs that only restructure the workbook (rows of the schedule): named but fixed by the export. */
const STRUCTURAL = new Set(['finance.paymentsPerYear', 'finance.termYears']);

/** One input as the sheet lists it. */
export interface InputRow {
  /** Dot path inside the scenario, with array items by id (options.sand.bedding.pricePerTonne). */
  path: string;
  /** Path inside the option, for the option's source tags (bedding.pricePerTonne). */
  optionPath?: string;
  label: string;
  /** The label without the item it belongs to ("Tax class" of "Building shell: Tax class"). */
  ownLabel?: string;
  /** The item it belongs to, e.g. "Building shell: ". */
  prefix?: string;
  unit: string;
  value: number | string | boolean | null;
}

// zod 4 keeps its structure on `def`; these are the few node kinds a scenario uses.
interface SchemaNode {
  def: { type: string; innerType?: SchemaNode; element?: SchemaNode; options?: SchemaNode[]; in?: SchemaNode };
  shape?: Record<string, SchemaNode>;
  description?: string;
}

const WRAPPERS = new Set(['default', 'prefault', 'nullable', 'optional', 'readonly', 'catch']);

function unwrap(schema: SchemaNode): { node: SchemaNode; description: string | undefined } {
  let node = schema;
  let description = node.description;
  while (WRAPPERS.has(node.def.type) && node.def.innerType) {
    node = node.def.innerType;
    description ??= node.description;
  }
  return { node, description };
}

/** "Feed cost per cow per day (currency per cow-day)" → label and unit. */
export function splitDescription(description: string | undefined, currency: string): { label: string; unit: string } {
  const text = (description ?? '').trim();
  // The unit is the last parenthesis, usually at the end: "… today (currency per kg)"; "… (fraction); full from year 2".
  const match = /^(.*)\(([^()]*)\)([^()]*)$/.exec(text);
  if (!match) return { label: text, unit: '' };
  const unit = (match[2] ?? '').replace(/currency/g, currency).trim();
  const label = `${(match[1] ?? '').trim()}${(match[3] ?? '').replace(/^;/, ',').trimEnd()}`;
  return { label: label.trim().replace(/[:;,]$/, ''), unit };
}

function isObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function itemKey(item: unknown, index: number): string {
  return isObject(item) && typeof item.id === 'string' ? item.id : String(index + 1);
}

function itemLabel(item: unknown): string {
  if (!isObject(item)) return '';
  const text = item.description ?? item.name ?? (typeof item.key === 'string' ? codeToWords(item.key) : undefined);
  if (typeof text !== 'string') return '';
  return `${text.charAt(0).toUpperCase()}${text.slice(1)}: `;
}

function unionMember(node: SchemaNode, value: unknown): SchemaNode | undefined {
  const members = node.def.options ?? [];
  if (!isObject(value)) return members[0];
  const discriminator = 'kind' in value ? 'kind' : 'distribution';
  return (
    members.find((member) => {
      const field = unwrap(member).node.shape?.[discriminator];
      return field !== undefined && (field.def as { values?: unknown[] }).values?.includes(value[discriminator]);
    }) ?? members[0]
  );
}

/**
 * Flattens a value against its schema into one row per scalar input; arrays of numbers become
 * one row, arrays of objects one group per item (by id), provenance records and document ids are left out.
 */
export function flattenInputs(schema: SchemaNode, value: unknown, path: string, currency: string, prefix = ''): InputRow[] {
  const { node, description } = unwrap(schema);
  const type = node.def.type;
  if (type === 'object' && node.shape && isObject(value)) {
    return Object.entries(node.shape).flatMap(([key, child]) =>
      key === 'sources' || key === 'documentIds' ? [] : flattenInputs(child, value[key], path ? `${path}.${key}` : key, currency, prefix),
    );
  }
  if (type === 'union') {
    const member = unionMember(node, value);
    return member ? flattenInputs(member, value, path, currency, prefix) : [];
  }
  if (type === 'array' && Array.isArray(value)) {
    const element = node.def.element;
    if (element && ['object', 'union'].includes(unwrap(element).node.def.type)) {
      return value.flatMap((item, index) => flattenInputs(element, item, `${path}.${itemKey(item, index)}`, currency, `${prefix}${itemLabel(item)}`));
    }
    const { label, unit } = splitDescription(description, currency);
    return [{ path, label: prefix + label, ownLabel: label, prefix, unit, value: value.length === 0 ? '(none)' : value.join(', ') }];
  }
  if (type === 'record') return [];
  const { label, unit } = splitDescription(description, currency);
  const scalar = value === undefined ? null : (value as InputRow['value']);
  return [{ path, label: prefix + label, ownLabel: label, prefix, unit, value: scalar }];
}

const SOURCE_WORDS: Record<Source['kind'], string> = { reference: 'Reference', 'common-practice': 'Common practice', assumption: 'Assumption', user: 'Farm figure', quote: 'Quote' };

function sourceText(source: Source | undefined, fallback: string): string {
  if (!source) return fallback;
  const kind = SOURCE_WORDS[source.kind];
  return source.note ? `${kind}: ${source.note}` : kind;
}

function formatFor(row: InputRow, context: WorkbookContext, symbol: string): string | undefined {
  if (typeof row.value !== 'number') return undefined;
  const unit = row.unit.toLowerCase();
  if (unit.includes('fraction')) return PERCENT_FORMAT;
  if (unit.startsWith(symbol.toLowerCase())) return Number.isInteger(row.value) && Math.abs(row.value) >= 100 ? context.formats.moneyWhole : '#,##0.00##';
  return Number.isInteger(row.value) ? COUNT_FORMAT : '#,##0.0###';
}

function displayUnit(unit: string): string {
  return unit.replace(/^fraction( per year)?.*$/i, (_m, perYear: string | undefined) => (perYear ? '% per year' : '%'));
}

const COLUMNS = ['Input', 'Value', 'Unit', 'Source'] as const;

/** Builds the Assumptions sheet: farm and herd, finance, risk settings, then each option. */
export function addAssumptionsSheet(context: WorkbookContext): ExcelJS.Worksheet {
  const { scenario, workbook } = context;
  const ws = workbook.addWorksheet(ASSUMPTIONS_SHEET);
  writeTitle(
    ws,
    'Assumptions',
    'Every input of the scenario as saved in Byrecast. Shaded blue-on-straw cells are named inputs the formulas use: change one and the workbook recalculates. ' +
      'Other rows document what the engine used for the yearly lines (change them in Byrecast and export again).',
  );
  const headerRow = 4;
  [56, 22, 22, 64].forEach((width, i) => (ws.getColumn(i + 1).width = width));
  COLUMNS.forEach((h, i) => (ws.getCell(headerRow, i + 1).value = h));
  styleHeaderRow(ws, headerRow, 1, COLUMNS.length);
  for (let c = 2; c <= COLUMNS.length; c++) ws.getCell(headerRow, c).alignment = { horizontal: c === 2 ? 'right' : 'left' };

  const shape = (scenarioSchema as unknown as SchemaNode).shape ?? {};
  // Units name the currency by its symbol (€ per kg), not its ISO code.
  const currency = currencySymbol(context.results.currency, scenario.locale);
  let r = headerRow + 1;
  const section = (title: string) => {
    r++;
    ws.getCell(r, 1).value = title;
    styleSection(ws.getCell(r, 1));
    r++;
  };
  // Each option's milk quality premium is a named input too: its milk price row adds it.
  const named: Record<string, string> = { ...NAMED_PATHS };
  for (const layout of context.options) named[`options.${layout.result.id}.milkQualityPricePerKg`] = optionName(layout, MILK_QUALITY_PRICE);
  const write = (rows: InputRow[], sourceOf: (row: InputRow) => string) => {
    for (const input of rows) {
      if (isInternal(input.path)) continue;
      const own = input.ownLabel ?? input.label;
      ws.getCell(r, 1).value = `${input.prefix ?? ''}${plainLabel(input.path, own || codeToWords(input.path.split('.').at(-1) ?? ''))}`;
      const cell = ws.getCell(r, 2);
      const value = plainValue(input.path, input.value, scenario.locale);
      cell.value = typeof value === 'boolean' ? (value ? 'yes' : 'no') : (value ?? '(not set)');
      const fmt = formatFor(input, context, currency);
      if (fmt) cell.numFmt = fmt;
      ws.getCell(r, 3).value = plainUnit(input.path, displayUnit(input.unit));
      ws.getCell(r, 4).value = sourceOf(input);
      const name = named[input.path];
      if (name) {
        defineName(workbook, name, sheetRef(ASSUMPTIONS_SHEET, r, 2));
        styleInput(cell);
        ws.getCell(r, 4).value = `${sourceOf(input)} — named cell ${name}${STRUCTURAL.has(input.path) ? ' (fixed by the export: the schedule rows follow it)' : ''}`;
      }
      for (const c of [1, 4]) ws.getCell(r, c).alignment = { wrapText: true, vertical: 'top' };
      ws.getCell(r, 3).alignment = { vertical: 'top', indent: 1 };
      cell.alignment = { horizontal: 'right', vertical: 'top' };
      fitWrappedRow(ws, r, [1, 4]);
      r++;
    }
  };

  const farmFigure = () => 'Farm figure';
  section('Scenario');
  write(
    (['horizonYears', 'currency', 'locale', 'units'] as const).flatMap((key) => flattenInputs(shape[key] as SchemaNode, scenario[key], key, currency)),
    () => 'Scenario setting',
  );
  section('Farm, herd and markets');
  // A herd margin not entered is the current option's year-1 cash for debt service: the cell holds what the engine used.
  const herdMarginEntered = scenario.herd.existingCashHerdMarginPerYear !== null;
  const herdRows = flattenInputs(shape.herd as SchemaNode, scenario.herd, 'herd', currency).map((row) =>
    row.path === 'herd.existingCashHerdMarginPerYear' && !herdMarginEntered ? { ...row, value: context.results.existingFarm.herdMarginInExistingCash } : row,
  );
  write(herdRows, (row) => {
    if (row.path.startsWith('herd.manureExcretion')) return 'Reference: ASABE D384.2 Table 1 (from memory) unless the farm changed it';
    if (row.path === 'herd.existingCashHerdMarginPerYear' && !herdMarginEntered) return "Not entered: the current option's year-1 cash for debt service as projected";
    return farmFigure();
  });
  if (hasYearlyPriceIndex(scenario)) {
    // One row per operating year, so INDEX(MilkPriceIndex, t) is year t's multiplier; years past the list are 1.
    const { milkPrice, feed } = scenario.herd.yearlyPriceIndex;
    const yearRows = (label: string, list: readonly number[] | null, path: string): InputRow[] =>
      Array.from({ length: context.horizon }, (_, i) => ({ path: `${path}[${i}]`, label: `${label}, year ${i + 1}`, unit: 'multiplier', value: list?.[i] ?? 1 }));
    section('Yearly price index (multipliers on the grown price, 1 = as grown)');
    const firstMilkRow = r;
    write(yearRows('Milk price index', milkPrice, 'herd.yearlyPriceIndex.milkPrice'), () => 'Farm figure (1 past the list entered)');
    defineName(workbook, INPUT_NAMES.milkPriceIndex, sheetRef(ASSUMPTIONS_SHEET, firstMilkRow, 2, r - 1, 2));
    for (let row = firstMilkRow; row < r; row++) {
      styleInput(ws.getCell(row, 2));
      ws.getCell(row, 4).value = `Farm figure (1 past the list entered) — named range ${INPUT_NAMES.milkPriceIndex}`;
    }
    write(yearRows('Feed cost index', feed, 'herd.yearlyPriceIndex.feed'), () => 'Farm figure (1 past the list entered); the feed lines are engine values that already carry it');
  }
  section('Finance, discounting and tax');
  write(flattenInputs(shape.finance as SchemaNode, scenario.finance, 'finance', currency), farmFigure);
  section('Risk settings');
  write(flattenInputs(shape.risk as SchemaNode, scenario.risk, 'risk', currency), () => 'Scenario setting');

  const optionSchema = ((shape.options as SchemaNode).def.element ?? (shape.options as SchemaNode)) as SchemaNode;
  for (const option of scenario.options) {
    section(`Option: ${option.name}${option.current ? ' (current option)' : ''}`);
    const rows = flattenInputs(optionSchema, option, `options.${option.id}`, currency).map((row) => ({
      ...row,
      optionPath: row.path.slice(`options.${option.id}.`.length),
    }));
    write(rows, (row) => sourceText(quotedSource(context, option, row.optionPath ?? '') ?? optionSource(option, row.optionPath ?? ''), farmFigure()));
  }

  // Column widths are set before the rows so fitWrappedRow can measure them.
  freeze(ws, headerRow);
  setupPrint(ws, { lastRow: r - 1, lastColumn: COLUMNS.length, titleRows: `${headerRow}:${headerRow}` });
  ws.eachRow((row) => row.eachCell((cell) => (cell.font ??= BASE_FONT)));
  return ws;
}

/**
 * How many of the options' inputs carry an 'assumption' source tag (an invented planning figure
 * the farm should replace), of all option inputs, for the cover.
 */
export function assumptionShare(scenario: WorkbookContext['scenario']): { assumed: number; total: number } {
  const shape = (scenarioSchema as unknown as SchemaNode).shape ?? {};
  const optionSchema = ((shape.options as SchemaNode).def.element ?? (shape.options as SchemaNode)) as SchemaNode;
  let assumed = 0;
  let total = 0;
  for (const option of scenario.options) {
    for (const row of flattenInputs(optionSchema, option, '', scenario.currency)) {
      total++;
      if (optionSource(option, row.path)?.kind === 'assumption') assumed++;
    }
  }
  return { assumed, total };
}

/** A capital line's unit cost backed by a quote with an amount: the quote, whatever the stored tag says. */
function quotedSource(context: WorkbookContext, option: Option, optionPath: string): Source | undefined {
  const match = /^capitalLines\.(.+)\.unitCost$/.exec(optionPath);
  const quote = match ? context.quotes?.get(match[1] ?? '') : undefined;
  if (!quote) return undefined;
  const total = new Intl.NumberFormat(context.scenario.locale, { style: 'currency', currency: context.results.currency, maximumFractionDigits: 0 }).format(quote.total);
  return quoteSource(quote.files, total);
}

/** Source tag of an option field: exact path, else the nearest parent path that has one. */
function optionSource(option: Option, path: string): Source | undefined {
  let key = path;
  while (key) {
    const found = option.sources[key];
    if (found) return found;
    const dot = key.lastIndexOf('.');
    key = dot < 0 ? '' : key.slice(0, dot);
  }
  return undefined;
}

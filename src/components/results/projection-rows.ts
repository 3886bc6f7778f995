/**
 * The rows of the yearly projection table: each docs/model.md line by name, grouped, with
 * subtotals summed in whole cents (so a subtotal equals the sum of the cents shown above it),
 * and the table as CSV. Pure.
 */
import type { YearLine } from '@shared/engine';

type MoneyKey = {
  [K in keyof YearLine]: YearLine[K] extends number ? K : never;
}[keyof YearLine];

export type RowKind = 'line' | 'subtotal' | 'total' | 'heading';

export interface ProjectionRow {
  id: string;
  label: string;
  kind: RowKind;
  /** 'money' rows are currency; 'quantity' rows carry their unit in the label. */
  unit: 'money' | 'quantity';
  /** Value per year, index = year (0..H); null for heading rows. */
  values: (number | null)[];
  /** Digits shown for quantity rows. */
  digits?: number;
}

interface LineSpec {
  key: MoneyKey;
  label: string;
}

const INCOME: LineSpec[] = [
  { key: 'milkIncome', label: 'Milk income' },
  { key: 'manureValue', label: 'Manure fertiliser value' },
];

const LABOUR: LineSpec[] = [
  { key: 'labourScraping', label: 'Labour: scraping' },
  { key: 'labourBedCare', label: 'Labour: bed care' },
  { key: 'labourBeddingTopUp', label: 'Labour: bedding top-up' },
  { key: 'labourTroughs', label: 'Labour: water troughs' },
  { key: 'labourGrazing', label: 'Labour: grazing work' },
  { key: 'labourMilking', label: 'Labour: milking and cows' },
];

const OTHER_COSTS: LineSpec[] = [
  { key: 'feed', label: 'Feed' },
  { key: 'bedding', label: 'Bedding material' },
  { key: 'health', label: 'Health' },
  { key: 'culling', label: 'Culling' },
  { key: 'herdReplacement', label: 'Herd replacement' },
  { key: 'otherCowCosts', label: 'Other cow costs' },
  { key: 'maintenance', label: 'Maintenance' },
  { key: 'energy', label: 'Energy' },
  { key: 'runningCosts', label: 'Other running costs' },
  { key: 'manureHandling', label: 'Manure handling' },
];

const CAPITAL: LineSpec[] = [
  { key: 'capital', label: 'Capital (paid out)' },
  { key: 'grants', label: 'Grants (received)' },
  { key: 'replacements', label: 'Replacements (paid out)' },
  { key: 'herdPurchases', label: 'Herd purchases, net (paid out)' },
  { key: 'salvage', label: 'Salvage value (received)' },
  { key: 'herdValueAtHorizon', label: 'Herd value at horizon (received)' },
  { key: 'tax', label: 'Tax (paid; negative = saved)' },
];

const FINANCE: LineSpec[] = [
  { key: 'loanInterest', label: 'Loan interest' },
  { key: 'loanPrincipal', label: 'Loan principal' },
];

const cents = (value: number): number => Math.round(value * 100);

/** Sum of money amounts in whole cents, back to currency: exact for amounts already in cents. */
export function sumCents(values: readonly number[]): number {
  let total = 0;
  for (const v of values) total += cents(v);
  return total / 100;
}

function line(years: readonly YearLine[], spec: LineSpec): ProjectionRow {
  return { id: spec.key, label: spec.label, kind: 'line', unit: 'money', values: years.map((y) => y[spec.key]) };
}

function subtotal(years: readonly YearLine[], id: string, label: string, specs: readonly LineSpec[]): ProjectionRow {
  return { id, label, kind: 'subtotal', unit: 'money', values: years.map((y) => sumCents(specs.map((s) => y[s.key]))) };
}

function heading(id: string, label: string, width: number): ProjectionRow {
  return { id, label, kind: 'heading', unit: 'money', values: new Array<null>(width).fill(null) };
}

/**
 * The projection table's rows, years 0..H: income, labour and other operating costs with
 * subtotals, the engine's operating margin, capital, tax and the net cash flow, the loan, the
 * cash available for debt service, then the physical quantities (cows, milk, hours, bedding).
 */
export function projectionRows(years: readonly YearLine[]): ProjectionRow[] {
  const width = years.length;
  return [
    heading('h-income', 'Income', width),
    ...INCOME.map((s) => line(years, s)),
    subtotal(years, 'income', 'Income total', INCOME),
    heading('h-costs', 'Operating costs', width),
    ...LABOUR.map((s) => line(years, s)),
    subtotal(years, 'labour', 'Labour total', LABOUR),
    ...OTHER_COSTS.map((s) => line(years, s)),
    subtotal(years, 'operating-costs', 'Operating costs total', [...LABOUR, ...OTHER_COSTS]),
    { id: 'operatingMargin', label: 'Operating margin', kind: 'total', unit: 'money', values: years.map((y) => y.operatingMargin) },
    heading('h-capital', 'Capital, tax and salvage', width),
    ...CAPITAL.map((s) => line(years, s)),
    { id: 'netCashFlow', label: 'Net cash flow', kind: 'total', unit: 'money', values: years.map((y) => y.netCashFlow) },
    heading('h-finance', 'Loan', width),
    ...FINANCE.map((s) => line(years, s)),
    { id: 'financedCashFlow', label: 'Cash flow after the loan', kind: 'total', unit: 'money', values: years.map((y) => y.financedCashFlow) },
    { id: 'cashAvailableForDebtService', label: 'Cash available for debt service', kind: 'subtotal', unit: 'money', values: years.map((y) => y.cashAvailableForDebtService) },
    heading('h-quantities', 'Herd, milk and work', width),
    { id: 'cows', label: 'Cows (head)', kind: 'line', unit: 'quantity', digits: 0, values: years.map((y) => y.cows) },
    { id: 'yield', label: 'Yield (kg/cow/day)', kind: 'line', unit: 'quantity', digits: 2, values: years.map((y) => (y.year === 0 ? null : y.yieldKgPerCowDay)) },
    { id: 'milkSoldKg', label: 'Milk sold (kg)', kind: 'line', unit: 'quantity', digits: 0, values: years.map((y) => y.milkSoldKg) },
    { id: 'labourHours', label: 'Labour (h/yr)', kind: 'line', unit: 'quantity', digits: 0, values: years.map((y) => y.labourHours.total) },
    { id: 'beddingTonnes', label: 'Bedding bought (t/yr)', kind: 'line', unit: 'quantity', digits: 1, values: years.map((y) => y.beddingTonnes) },
    { id: 'manureStoredM3', label: 'Manure stored (m³/yr)', kind: 'line', unit: 'quantity', digits: 0, values: years.map((y) => y.manure.storedM3) },
  ];
}

function csvCell(text: string): string {
  return /[",\n;]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/**
 * The rows as RFC 4180 CSV (comma-separated, CRLF line ends, quotes doubled): a header of
 * years, then one line per row; numbers in plain machine form (money to the cent, a dot for
 * decimals, no grouping) so a spreadsheet in any locale reads them as numbers.
 */
export function rowsToCsv(rows: readonly ProjectionRow[], yearCount: number): string {
  const header = ['Line', ...Array.from({ length: yearCount }, (_, t) => `Year ${t}`)];
  const body = rows.map((row) => [
    row.label,
    ...row.values.map((v) => (v === null ? '' : row.unit === 'money' ? v.toFixed(2) : String(Number(v.toFixed(row.digits ?? 2))))),
  ]);
  return [header, ...body].map((cells) => cells.map(csvCell).join(',')).join('\r\n') + '\r\n';
}

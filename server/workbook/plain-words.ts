/**
 * The Assumptions sheet in plain words for the family and the bank: the schema's descriptions
 * are written for developers ("null = general inflation", "[0] = year 1", "ISO 4217 …",
 * "'closed' = …"), so their code-like clauses are dropped, a few labels are put in words, and
 * code values (locales, currencies, starting points, hyphenated choices) become names.
 */
import { currencyName, numberStyleName } from '../../shared/display-names.js';
import { STARTING_POINT_NAMES } from '../../shared/starting-points.js';
import type { StartingPoint } from '../../shared/schema/index.js';

/** Labels the descriptions cannot give in plain words, by the path's last segments. */
const LABELS: Readonly<Record<string, string>> = {
  currency: 'Currency of every money figure',
  locale: 'Number style',
  units: 'Units shown on screen (stored figures are metric)',
  name: 'Name',
  startingPoint: 'Starting point it was built from',
  current: 'Current option: the one the others are measured against',
  kind: 'Housing',
  bed: 'Stall bed',
  'stallDimensions.front': 'Stall front: against a wall (closed) or head-to-head (open)',
  'finance.paymentsPerYear': 'Loan payments per year',
  'finance.taxRate': 'Income tax rate (0 = figures before tax)',
  'finance.loanAmount': 'Loan principal (when not entered: capital less equity and grants)',
  'finance.interestDuringConstruction': 'Interest during construction: added to the loan, or paid from farm cash',
  'finance.grantsReduceDepreciableBase': 'Grants reduce the tax depreciation of the capital',
  'finance.lossesOffsetOtherIncome': 'A taxable loss saves tax that year against other farm income (otherwise carried forward)',
  'finance.constructionMonths': 'Months from the first loan draw to the end of construction',
  'herd.breedSize': 'Body size class for stall guidance (small 590–680 kg, large 680–770 kg)',
  'herd.existingCashHerdMarginPerYear': "The herd's cash for debt service inside the existing farm cash (when not entered: the current option's year-1 figure as projected)",
  taxClass: 'Tax depreciation: over its useful life by the scenario method, straight line over a tax life, or a US MACRS table',
  taxLifeYears: 'Tax life for straight-line tax depreciation (when not entered: the useful life)',
  quantity: 'Quantity (when not entered: sized by Byrecast — stalls, storage volume or troughs; 1 for a lump sum)',
  'herdChange.addedCows': 'Cows added from year 1',
  'herdChange.cowsByYear': 'Cows in each year (when not entered: today’s herd plus the added cows)',
  'herdChange.addedCowCost': 'Cost of each added cow (when not entered: the replacement heifer cost)',
  'risk.monteCarlo.pricesPerYear': 'Draw the milk price and feed cost afresh each year (otherwise one draw for all years)',
};

/** Clauses that explain a stored code rather than the figure. */
const CODE_CLAUSE = /\bnull\b|\[\d+\]\s*=|'[^']+'\s*=|\bISO \d+|\bBCP \d+|^\s*(true|false)\b/i;

/** "Capital line unit cost" style label from the schema description, without its code clauses. */
export function plainLabel(path: string, label: string): string {
  const key = Object.keys(LABELS).find((suffix) => path === suffix || path.endsWith(`.${suffix}`));
  if (key) return LABELS[key] ?? label;
  const withoutLead = label.replace(/^True(:\s*|\s+to\s+|\s+when\s+|\s+if\s+)/i, '').replace(/\bISO \d+ |\bBCP \d+ /g, '');
  const kept = withoutLead
    .split(/;\s*|,\s*(?=null\b|\[\d|'|false\b|true\b)/i)
    .filter((clause) => clause.trim() && !CODE_CLAUSE.test(clause));
  const text = (kept.join('; ') || withoutLead).trim();
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/** "automatic-scraper" → "automatic scraper"; "milkPrice" → "milk price". */
export function codeToWords(code: string): string {
  return code
    .replace(/([a-z])([A-Z])/g, '$1 $2')
    .replace(/[-_]/g, ' ')
    .toLowerCase();
}

/** A value as the sheet shows it: names for codes, the figure itself otherwise. */
export function plainValue(path: string, value: number | string | boolean | null, locale: string): number | string | boolean | null {
  if (typeof value !== 'string') return value;
  if (path === 'locale') return numberStyleName(value);
  if (path === 'currency') return currencyName(value, locale);
  if (path.endsWith('.startingPoint')) return STARTING_POINT_NAMES[value as StartingPoint] ?? codeToWords(value);
  if (path.endsWith('.name') || path.endsWith('.description')) return value;
  return /^[a-z0-9]+([-_][a-z0-9]+)+$|^[a-z]+[A-Z]\w*$/.test(value) ? codeToWords(value) : value;
}

/** Rows that only hold an internal id or a line's kind: left out of the sheet. */
export function isInternal(path: string): boolean {
  return /(^|\.)(id|key)$/.test(path) || path === 'schemaVersion' || (path.includes('.capitalLines.') && path.endsWith('.kind'));
}

/** The unit column: a capital line's quantity is in its own unit (the next row), not the schema's rule. */
export function plainUnit(path: string, unit: string): string {
  return path.includes('.capitalLines.') && path.endsWith('.quantity') ? '' : unit;
}

/** "€" for EUR in the farm's locale; the code only where the locale has no symbol for it. */
export function currencySymbol(currency: string, locale: string): string {
  try {
    return new Intl.NumberFormat(locale, { style: 'currency', currency }).formatToParts(0).find((part) => part.type === 'currency')?.value ?? currency;
  } catch {
    return currency;
  }
}

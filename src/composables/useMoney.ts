/**
 * Money and number formatting in the farm's locale and currency (Intl.NumberFormat), with a true
 * minus sign (U+2212) for negatives as docs/design.md asks. Formatters are cached: tables format
 * thousands of cells.
 */
import { computed, toValue, type MaybeRefOrGetter } from 'vue';

export interface MoneyFormat {
  /** ISO 4217 code, e.g. EUR. */
  currency: string;
  /** BCP 47 tag, e.g. en-IE. */
  locale: string;
}

const MINUS = '\u2212';
const cache = new Map<string, Intl.NumberFormat>();

function formatter(locale: string, options: Intl.NumberFormatOptions): Intl.NumberFormat {
  const key = `${locale}|${JSON.stringify(options)}`;
  let found = cache.get(key);
  if (!found) {
    found = new Intl.NumberFormat(locale, options);
    cache.set(key, found);
  }
  return found;
}

/** Replaces the hyphen-minus Intl puts before negatives with a true minus sign. */
function withMinus(text: string): string {
  return text.replace(/-/g, MINUS);
}

/** Money in the farm's currency, `digits` decimals (2 = to the cent); −0 shows as 0. */
export function formatMoney(value: number, format: MoneyFormat, digits = 2): string {
  const f = formatter(format.locale, { style: 'currency', currency: format.currency, minimumFractionDigits: digits, maximumFractionDigits: digits });
  return withMinus(f.format(value === 0 ? 0 : value));
}

/** Money in short form for chart axes (e.g. €1.2M). */
export function formatMoneyCompact(value: number, format: MoneyFormat): string {
  const f = formatter(format.locale, { style: 'currency', currency: format.currency, notation: 'compact', maximumFractionDigits: 1 });
  return withMinus(f.format(value === 0 ? 0 : value));
}

/** A plain number in the locale, with `digits` decimals at most (and at least when `fixed`). */
export function formatNumber(value: number, locale: string, digits = 0, fixed = false): string {
  const f = formatter(locale, { maximumFractionDigits: digits, minimumFractionDigits: fixed ? digits : 0 });
  return withMinus(f.format(value === 0 ? 0 : value));
}

/** A fraction as a percentage (0.082 → "8.2 %" in en-IE style), `digits` decimals. */
export function formatPercent(fraction: number, locale: string, digits = 1): string {
  const f = formatter(locale, { style: 'percent', minimumFractionDigits: digits, maximumFractionDigits: digits });
  return withMinus(f.format(fraction === 0 ? 0 : fraction));
}

/** Reads a formatted money or number back (minus sign, grouping, currency symbol) for tests and CSV; null if no digits. */
export function parseFormatted(text: string, locale: string): number | null {
  const parts = formatter(locale, { minimumFractionDigits: 1 }).formatToParts(-1234.5);
  const group = parts.find((p) => p.type === 'group')?.value ?? ',';
  const decimal = parts.find((p) => p.type === 'decimal')?.value ?? '.';
  const cleaned = text
    .replace(/[\u2212-]/g, '-')
    .split(group)
    .join('')
    .replace(decimal, '.')
    .replace(/[^0-9.-]/g, '');
  if (!/\d/.test(cleaned)) return null;
  const value = Number(cleaned);
  return Number.isFinite(value) ? value : null;
}

/** Formatters bound to the farm's currency and locale. */
export function useMoney(format: MaybeRefOrGetter<MoneyFormat>) {
  const current = computed(() => toValue(format));
  return {
    format: current,
    money: (value: number, digits = 2) => formatMoney(value, current.value, digits),
    moneyCompact: (value: number) => formatMoneyCompact(value, current.value),
    number: (value: number, digits = 0, fixed = false) => formatNumber(value, current.value.locale, digits, fixed),
    percent: (fraction: number, digits = 1) => formatPercent(fraction, current.value.locale, digits),
  };
}

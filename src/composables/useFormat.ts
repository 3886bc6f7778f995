/**
 * The one home of how figures read on screen, in the farm's locale and currency: the display
 * settings a farm provides (units, locale, currency), money, numbers, percentages and dates
 * (Intl, with a true minus sign U+2212 as docs/design.md asks), and reading typed numbers back.
 * Formatters are cached: tables format thousands of cells.
 */
import { computed, inject, provide, toValue, type ComputedRef, type InjectionKey, type MaybeRefOrGetter } from 'vue';
import { currencyName, numberStyleName } from '@shared/display-names';
import type { UnitSystem } from '@shared/units';

/** How a farm shows figures: unit system for quantities, locale and currency for numbers and money. */
export interface DisplaySettings {
  units: UnitSystem;
  locale: string;
  currency: string;
}

const KEY: InjectionKey<ComputedRef<DisplaySettings>> = Symbol('display');
const FALLBACK: DisplaySettings = { units: 'metric', locale: 'en-IE', currency: 'EUR' };

/** Gives every input and figure below this component the farm's (or scenario's) display settings. */
export function provideDisplay(settings: () => DisplaySettings): ComputedRef<DisplaySettings> {
  const value = computed(settings);
  provide(KEY, value);
  return value;
}

/** The display settings provided above, or metric/en-IE/EUR outside any farm. */
export function useDisplay(): ComputedRef<DisplaySettings> {
  return inject(KEY, computed(() => FALLBACK));
}

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

/** Placeholder for a figure that cannot be computed; the reason goes beside it. */
export const NO_VALUE = '—';

/** True for a number that can be shown. */
export function isShowable(value: number | null | undefined): value is number {
  return typeof value === 'number' && Number.isFinite(value);
}

/** The farm's money and number formats from the provided display settings, '—' for what cannot be shown. */
export function useFigures() {
  const display = useDisplay();
  const format = computed(() => ({ locale: display.value.locale, currency: display.value.currency }));
  const symbol = computed(() => {
    const parts = new Intl.NumberFormat(format.value.locale, { style: 'currency', currency: format.value.currency }).formatToParts(0);
    return parts.find((part) => part.type === 'currency')?.value ?? format.value.currency;
  });
  return {
    display,
    symbol,
    /** Money, whole units unless `digits` says otherwise. */
    money: (value: number | null | undefined, digits = 0) => (isShowable(value) ? formatMoney(value, format.value, digits) : NO_VALUE),
    /** A number with exactly `digits` decimals. */
    number: (value: number | null | undefined, digits = 0) => (isShowable(value) ? formatNumber(value, format.value.locale, digits, true) : NO_VALUE),
    /** A fraction as percent. */
    percent: (value: number | null | undefined, digits = 1) => (isShowable(value) ? formatPercent(value, format.value.locale, digits) : NO_VALUE),
  };
}

/**
 * Reads a number as a person types it in `locale`: the locale's decimal mark, group separators
 * and spaces ignored, a leading minus (or the Unicode minus). Null when it is not a number.
 */
export function parseLocaleNumber(text: string, locale: string): number | null {
  const parts = new Intl.NumberFormat(locale).formatToParts(12345.6);
  const group = parts.find((part) => part.type === 'group')?.value ?? ',';
  const decimal = parts.find((part) => part.type === 'decimal')?.value ?? '.';
  let cleaned = text.replace(/[\s\u00a0\u202f]/g, '').replace(/\u2212/g, '-');
  // A lone point typed in a comma-decimal locale is still meant as a decimal mark.
  // "1.234" (a thousands group, as the input shows it) stays 1234.
  const lonePoint = group === '.' && !cleaned.includes(decimal) && cleaned.split('.').length === 2 && !/^-?[1-9]\d{0,2}\.\d{3}$/.test(cleaned);
  if (!lonePoint) cleaned = cleaned.split(group).join('').replace(decimal, '.');
  if (!/^-?(\d+\.?\d*|\.\d+)(e-?\d+)?$/i.test(cleaned)) return null;
  const value = Number(cleaned);
  return Number.isFinite(value) ? value : null;
}

const dateCache = new Map<string, Intl.DateTimeFormat>();

function dateFormatter(locale: string, options: Intl.DateTimeFormatOptions): Intl.DateTimeFormat {
  const key = `${locale}|${JSON.stringify(options)}`;
  let found = dateCache.get(key);
  if (!found) {
    found = new Intl.DateTimeFormat(locale, options);
    dateCache.set(key, found);
  }
  return found;
}

/** The one date style: day, short month, year ("2 Dec 2026" in en-IE, "02.12.2026" style where the locale writes it so). */
const DATE: Intl.DateTimeFormatOptions = { day: 'numeric', month: 'short', year: 'numeric' };
const TIME: Intl.DateTimeFormatOptions = { hour: '2-digit', minute: '2-digit' };

/** A calendar date (YYYY-MM-DD, e.g. a share's expiry) or an ISO instant, as a date in the locale; '—' when unreadable. */
export function formatDate(value: string | Date, locale: string): string {
  const calendar = typeof value === 'string' && /^\d{4}-\d{2}-\d{2}$/.test(value);
  const date = value instanceof Date ? value : new Date(calendar ? `${value}T00:00:00Z` : value);
  if (Number.isNaN(date.getTime())) return NO_VALUE;
  return dateFormatter(locale, calendar ? { ...DATE, timeZone: 'UTC' } : DATE).format(date);
}

/** An ISO instant (a save, a note, an upload) as the date above with the time of day. */
export function formatDateTime(value: string | Date, locale: string): string {
  const date = value instanceof Date ? value : new Date(value);
  if (Number.isNaN(date.getTime())) return NO_VALUE;
  return dateFormatter(locale, { ...DATE, ...TIME }).format(date);
}

/**
 * A number as an input shows it while not being edited: the locale's group separators, at most
 * `digits` decimals ("1,234.5"); parseLocaleNumber reads it back.
 */
export function formatInputNumber(value: number, locale: string, digits: number): string {
  return formatter(locale, { maximumFractionDigits: digits, useGrouping: true }).format(value === 0 ? 0 : value).replace(/[\u2212]/g, '-');
}

/** Number styles to choose from by name with a sample: "Ireland — 1,234.5", "Germany — 1.234,5". */
export function numberStyleChoices(locales: readonly string[]): { value: string; label: string }[] {
  return locales.map((locale) => ({ value: locale, label: numberStyleName(locale) }));
}

/** Currencies to choose from by name with their symbol: "Euro (€)". */
export function currencyChoices(currencies: readonly string[], locale: string): { value: string; label: string }[] {
  return currencies.map((currency) => ({ value: currency, label: currencyName(currency, locale) }));
}

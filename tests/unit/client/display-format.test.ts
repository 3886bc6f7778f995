/**
 * One set of date, number and percent formatters in the farm's locale (src/composables/useFormat.ts):
 * one date style on every screen, grouped numbers in inputs that read back to the same value,
 * and number styles chosen by country, not by locale code. docs/design.md "Numbers".
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { currencyChoices, formatDate, formatDateTime, formatInputNumber, numberStyleChoices, parseLocaleNumber } from '@/composables/useFormat';

describe('dates', () => {
  it('writes a calendar date and an instant in the same day-month-year style', () => {
    // CLDR medium-ish pattern "d MMM y" for en-IE and "d. MMM y" for de-DE through Intl (from memory).
    expect(formatDate('2026-12-02', 'en-IE')).toBe('2 Dec 2026');
    expect(formatDateTime('2026-12-02T10:05:00Z', 'en-IE')).toMatch(/^2 Dec 2026(,| at)? \d{2}:\d{2}$/);
    expect(formatDate('2026-12-02', 'de-DE')).toBe('2. Dez. 2026');
  });

  it('a calendar date does not move a day in a timezone west of UTC', () => {
    // A YYYY-MM-DD expiry is a date, not an instant: read at UTC midnight and shown in UTC.
    expect(formatDate('2027-01-01', 'en-US')).toBe('Jan 1, 2027');
  });

  it('shows a dash for a date it cannot read', () => {
    expect(formatDate('not a date', 'en-IE')).toBe('—');
  });

  it('is the only place that formats a date', () => {
    const list = (dir: string): string[] =>
      readdirSync(dir).flatMap((name) => {
        const path = join(dir, name);
        return statSync(path).isDirectory() ? list(path) : /\.(vue|ts)$/.test(name) ? [path] : [];
      });
    const offenders = list('src').filter((path) => !path.endsWith('useFormat.ts') && /toLocale(Date|Time)?String|DateTimeFormat/.test(readFileSync(path, 'utf8')));
    expect(offenders).toEqual([]);
  });
});

describe('numbers in inputs', () => {
  it('groups thousands as the locale writes them and reads them back unchanged', () => {
    // CLDR grouping (from memory): en-IE "," and ".", de-DE "." and ",".
    expect(formatInputNumber(1234567.5, 'en-IE', 2)).toBe('1,234,567.5');
    expect(formatInputNumber(1234.5, 'de-DE', 1)).toBe('1.234,5');
    for (const [value, locale] of [[1234567.5, 'en-IE'], [1234.5, 'de-DE'], [1234, 'de-DE'], [-2500, 'en-US']] as const) {
      expect(parseLocaleNumber(formatInputNumber(value, locale, 2), locale)).toBe(value);
    }
  });

  it('still reads a lone point typed in a comma-decimal locale as a decimal mark', () => {
    expect(parseLocaleNumber('12.5', 'de-DE')).toBe(12.5);
    expect(parseLocaleNumber('0.125', 'de-DE')).toBe(0.125);
  });
});

describe('choices by name', () => {
  it('names number styles by country with a sample', () => {
    const labels = numberStyleChoices(['en-IE', 'de-DE']).map((choice) => choice.label);
    expect(labels).toEqual(['Ireland — 1,234.5', 'Germany — 1.234,5']);
  });

  it('names currencies with their symbol', () => {
    // ISO 4217 names through Intl.DisplayNames (CLDR, from memory).
    expect(currencyChoices(['EUR', 'GBP'], 'en-IE').map((choice) => choice.label)).toEqual(['Euro (€)', 'British Pound (£)']);
  });
});

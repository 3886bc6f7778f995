/**
 * The milk-record CSV reader (shared/milk-records/parse.ts). Expected values are computed in
 * the test from the generated records (tests/helpers/milk-csv.ts), not taken from the reader;
 * behaviour comes from docs/product.md (Documents and milk records) unless a check names another source.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { MilkRecordFileError, parseDay, parseMilkRecordCsv } from '../../shared/milk-records/parse';
import { expectedSummary, generateMilkCsv, isoDay } from '../helpers/milk-csv';

// 1 lb = 0.45359237 kg exactly (NIST Handbook 44, Appendix C; docs/references.md, memory of a definition).
const KG_PER_LB = 0.45359237;

/** The field a MilkRecordFileError names, or 'no error'. */
function fileErrorField(text: string): string {
  try {
    parseMilkRecordCsv(text);
    return 'no error';
  } catch (e) {
    return e instanceof MilkRecordFileError ? e.field : 'other error';
  }
}

describe('milk-record CSV reader', () => {
  it('reads a comma file in kg: every row accepted, herd size and yield of the last 30 days', () => {
    const { text, records } = generateMilkCsv({ cows: 40, days: 75, intervalDays: 7 });
    const summary = parseMilkRecordCsv(text);
    const expected = expectedSummary(records, 1);
    expect(summary.delimiter).toBe(',');
    expect(summary.unit).toBe('kg');
    expect(summary.rowsRead).toBe(records.length);
    expect(summary.rowsAccepted).toBe(records.length);
    expect(summary.rowsRefused).toBe(0);
    expect(summary.cowsInFile).toBe(40);
    expect(summary.herdSize).toBe(expected.herdSize);
    expect(summary.averageYieldKgPerCowDay).toBeCloseTo(expected.averageKg, 2);
    expect(summary.firstDate).toBe('2026-03-01');
    expect(summary.lastDate).toBe(isoDay('2026-03-01', expected.lastDay));
    expect(summary.period).toEqual({ from: isoDay('2026-03-01', expected.lastDay - 29), to: summary.lastDate, days: 30 });
  });

  it('reads a semicolon file in lb with a BOM and decimal commas, converting with 0.45359237 kg/lb', () => {
    const { text, records } = generateMilkCsv({ cows: 25, days: 40, delimiter: ';', unit: 'lb', bom: true, fatProtein: true });
    expect(text.charCodeAt(0)).toBe(0xfeff);
    const summary = parseMilkRecordCsv(text, { keepRows: true });
    const expected = expectedSummary(records, KG_PER_LB);
    expect(summary.delimiter).toBe(';');
    expect(summary.unit).toBe('lb');
    expect(summary.rowsAccepted).toBe(records.length);
    expect(summary.herdSize).toBe(expected.herdSize);
    expect(summary.averageYieldKgPerCowDay).toBeCloseTo(expected.averageKg, 2);
    const first = records[0];
    expect(summary.rows?.[0]?.milkKg).toBeCloseTo((first?.milk ?? 0) * KG_PER_LB, 9);
    expect(summary.rows?.[0]?.fatPct).toBe(3.6);
  });

  it('counts only cows with a record in the last 30 days for herd size', () => {
    const lines = ['cow,date,milk kg'];
    for (let d = 0; d < 60; d += 1) for (let c = 1; c <= 10; c += 1) lines.push(`A${c},${isoDay('2026-01-01', d)},30`);
    // Five cows sold after the first 20 days: in the file, not in the herd.
    for (let d = 0; d < 20; d += 1) for (let c = 1; c <= 5; c += 1) lines.push(`SOLD${c},${isoDay('2026-01-01', d)},20`);
    const summary = parseMilkRecordCsv(lines.join('\n'));
    expect(summary.cowsInFile).toBe(15);
    expect(summary.herdSize).toBe(10);
    expect(summary.averageYieldKgPerCowDay).toBe(30);
  });

  it('refuses bad dates, negative milk, unknown units, duplicates and missing cow ids, naming the line', () => {
    const text = [
      'Cow,Date,Milk,Unit',
      'B1,2026-05-01,30.5,kg', // 2 ok
      'B2,2026-02-30,28,kg', // 3 no 30 February
      'B3,2026-05-01,-4,kg', // 4 negative
      'B4,2026-05-01,61,gal', // 5 unknown unit
      'B1,2026-05-01,30.5,kg', // 6 duplicate of line 2
      ',2026-05-01,25,kg', // 7 no cow
      'B5,01.05.2026,66,lb', // 8 ok, dotted date, lb
      'B6,2026-05-01,lots,kg', // 9 not a number
      '',
    ].join('\n');
    const summary = parseMilkRecordCsv(text);
    expect(summary.rowsRead).toBe(8);
    expect(summary.rowsAccepted).toBe(2);
    expect(summary.refused.map((r) => [r.line, r.reason])).toEqual([
      [3, 'bad_date'],
      [4, 'negative_milk'],
      [5, 'unknown_unit'],
      [6, 'duplicate_row'],
      [7, 'missing_cow'],
      [9, 'bad_milk'],
    ]);
    expect(summary.refused[3]?.detail).toMatch(/line 2/);
    expect(summary.refusedByReason).toEqual({ bad_date: 1, negative_milk: 1, unknown_unit: 1, duplicate_row: 1, missing_cow: 1, bad_milk: 1 });
    expect(summary.unit).toBe('per row');
    expect(summary.averageYieldKgPerCowDay).toBeCloseTo((30.5 + 66 * KG_PER_LB) / 2, 2);
  });

  it('refuses a file whose header has no milk unit or no cow column, naming the field', () => {
    expect(() => parseMilkRecordCsv('cow,date,milk\nA,2026-01-01,3\n')).toThrow(MilkRecordFileError);
    expect(fileErrorField('animal;day;milk\n')).toBe('milk');
    expect(fileErrorField('date,milk kg\n2026-01-01,3\n')).toBe('cowId');
    expect(fileErrorField('cow,milk kg\nA,3\n')).toBe('date');
    expect(() => parseMilkRecordCsv('')).toThrow(/empty/);
  });

  it('reads only real calendar dates', () => {
    // 2028 is a leap year, 2026 is not (Gregorian calendar rule).
    expect(parseDay('2028-02-29')).not.toBeNull();
    expect(parseDay('2026-02-29')).toBeNull();
    expect(parseDay('29.02.2028')).toBe(parseDay('2028-02-29'));
    expect(parseDay('2026-13-01')).toBeNull();
    expect(parseDay('05/01/2026')).toBeNull();
  });

  it('accounts for every row: accepted + refused = read, herd size never above the cows in the file', () => {
    const row = fc.record({
      cow: fc.constantFrom('K1', 'K2', 'K3', '', 'K4'),
      day: fc.integer({ min: 0, max: 90 }),
      milk: fc.oneof(fc.double({ min: -5, max: 60, noNaN: true }).map((v) => v.toFixed(1)), fc.constant('x')),
      unit: fc.constantFrom('kg', 'lb', 'l'),
    });
    fc.assert(
      fc.property(fc.array(row, { maxLength: 60 }), (rows) => {
        const text = ['cow,date,milk,unit', ...rows.map((r) => `${r.cow},${isoDay('2026-01-01', r.day)},${r.milk},${r.unit}`)].join('\n');
        const s = parseMilkRecordCsv(text);
        expect(s.rowsAccepted + s.rowsRefused).toBe(s.rowsRead);
        expect(s.rowsRead).toBe(rows.length);
        expect(s.herdSize).toBeLessThanOrEqual(s.cowsInFile);
      }),
    );
  });
});

import { describe, expect, it } from 'vitest';
import { rowsToCsv, sumCents, type ProjectionRow } from '../../../src/components/results/projection-rows';
import { formatMoney, parseFormatted } from '@/composables/useFormat';
import { canonicalJson, sha256Hex } from '../../../server/services/risk-inputs-hash';

describe('money in the farm locale', () => {
  it('formats euros the Irish way and the German way', () => {
    // CLDR currency patterns through Intl (from memory): en-IE "€1,234.56", de-DE "1.234,56 €" (with a no-break space).
    expect(formatMoney(1234.56, { currency: 'EUR', locale: 'en-IE' })).toBe('€1,234.56');
    expect(formatMoney(1234.56, { currency: 'EUR', locale: 'de-DE' })).toBe('1.234,56\u00a0€');
  });

  it('writes negatives with a true minus sign', () => {
    // docs/design.md "Numbers": negatives with a minus sign (U+2212 MINUS SIGN, Unicode).
    expect(formatMoney(-5, { currency: 'USD', locale: 'en-US' })).toBe('\u2212$5.00');
  });

  it('reads a formatted amount back to the same cents', () => {
    // Round trip through the CLDR separators of each locale (from memory: de-DE groups with ".", decimals with ",").
    expect(parseFormatted('\u22121.234.567,89\u00a0€', 'de-DE')).toBe(-1234567.89);
    expect(parseFormatted('€12,345.06', 'en-IE')).toBe(12345.06);
    expect(parseFormatted('—', 'en-IE')).toBeNull();
  });
});

describe('projection subtotals and CSV', () => {
  it('sums amounts in whole cents so 0.1 + 0.2 shows as 0.30', () => {
    // IEEE 754 doubles: 0.1 + 0.2 = 0.30000000000000004 (from memory); ledger money is whole cents (docs/model.md).
    expect(sumCents([0.1, 0.2])).toBe(0.3);
  });

  it('writes RFC 4180 CSV: quoted fields with doubled quotes, CRLF line ends', () => {
    // RFC 4180 §2: fields with commas or quotes are enclosed in quotes, a quote is escaped by another; lines end in CRLF.
    const rows: ProjectionRow[] = [{ id: 'x', label: 'Feed, "housed"', kind: 'line', unit: 'money', values: [0, 1234.5] }];
    expect(rowsToCsv(rows, 2)).toBe('Line,Year 0,Year 1\r\n"Feed, ""housed""",0.00,1234.50\r\n');
  });
});

describe('the risk inputs hash', () => {
  it('is SHA-256 as FIPS 180 defines it', () => {
    // FIPS 180-2 Appendix B.1 example: SHA-256("abc") (from memory).
    expect(sha256Hex('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
  });

  it('does not depend on the order of object keys, but does on array order', () => {
    // Canonical JSON sorts members (as RFC 8785 JCS does; from memory); arrays are ordered data.
    expect(canonicalJson({ b: 1, a: { d: [2, 1], c: null } })).toBe('{"a":{"c":null,"d":[2,1]},"b":1}');
    expect(canonicalJson({ a: 1, b: 2 })).toBe(canonicalJson({ b: 2, a: 1 }));
    expect(canonicalJson([1, 2])).not.toBe(canonicalJson([2, 1]));
  });
});

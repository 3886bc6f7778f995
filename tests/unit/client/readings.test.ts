import { describe, expect, it } from 'vitest';
import {
  breakEvenLyingResponseReading,
  countSignChanges,
  coverageReading,
  irrReading,
  irrUndefinedReading,
  paybackReading,
  paybackYear,
  profitabilityIndexReading,
  type ReadingFormat,
} from '../../../src/components/results/readings';
import { formatMoney, formatNumber, formatPercent } from '@/composables/useFormat';

const en: ReadingFormat = {
  money: (v) => formatMoney(v, { currency: 'EUR', locale: 'en-IE' }),
  percent: (v) => formatPercent(v, 'en-IE'),
  number: (v, d = 0) => formatNumber(v, 'en-IE', d, d > 0),
};

describe('payback readings', () => {
  it('reads a payback of 6.3 years as year 7 of a 20-year horizon', () => {
    // Wording from docs/product.md (Results, comparison and risk) ("pays back in year 7 of 20"); flows at year ends per docs/model.md conventions.
    expect(paybackReading(6.3, 20)).toBe('pays back in year 7 of 20');
  });

  it('puts a payback of exactly 7 years in year 7, not year 8', () => {
    // docs/model.md: cash flows fall at the end of each year, so cumulative CF ≥ 0 at t = 7 is reached in year 7.
    expect(paybackYear(7)).toBe(7);
    expect(paybackYear(7.0000001)).toBe(8);
  });

  it('says when the option never pays back within the horizon', () => {
    // docs/model.md: payback is null, "not within horizon", when cumulative CF never reaches 0.
    expect(paybackReading(null, 20, true)).toBe('does not pay back on discounted cash flows within the 20-year horizon');
  });

  it('says there is nothing to pay back when the change saves money at year 0', () => {
    // shared/engine/README.md: an incremental series with flows[0] ≥ 0 has payback null, reason no-net-investment.
    expect(paybackReading(null, 20, false, 'no-net-investment')).toBe('nothing to pay back: the change saves money at year 0');
  });
});

describe('IRR readings', () => {
  it('counts sign changes as Descartes does, skipping zeros', () => {
    // Descartes' rule of signs counts changes between non-zero coefficients (from memory).
    expect(countSignChanges([-100, 0, 50, -20, 0, 80])).toBe(3);
    expect(countSignChanges([10, 20])).toBe(0);
  });

  it('says why an IRR is not defined when the flows change sign three times', () => {
    // Wording from docs/product.md (Results, comparison and risk): "IRR not defined: cash flows change sign three times".
    expect(irrUndefinedReading('multiple-roots', [-100, 230, -132, 5])).toContain('IRR not defined: cash flows change sign three times');
  });

  it('says the flows never change sign when there is nothing to earn a rate on', () => {
    // docs/model.md: no sign change → IRR null with reason no-sign-change.
    expect(irrUndefinedReading('no-sign-change', [0, 10, 10])).toMatch(/never change sign/);
  });

  it('compares a defined IRR with the discount rate in the farm locale', () => {
    // en-IE percent format from CLDR via Intl (from memory): "8.2%".
    expect(irrReading(0.082, undefined, [-100, 60, 60], 0.06, en)).toBe('earns 8.2% a year, above the 6.0% discount rate');
  });

  it('reads the IRR of flows that start with a saving as a borrowing rate', () => {
    // shared/engine/results.ts irrKind 'borrowing': saving first and paying later, the IRR is a rate paid.
    expect(irrReading(0.6194, undefined, [75_000, -50_000, -52_000], 0.06, en)).toBe(
      'a borrowing rate of 61.9% a year: the change saves money first and pays it back later, so lower is better',
    );
  });
});

describe('coverage and other readings', () => {
  it('reads the lowest coverage against the lender threshold as the issue words it', () => {
    // Wording from docs/product.md (Results, comparison and risk): "coverage lowest in year 2 at 1.08 — below the lender's 1.25".
    expect(coverageReading({ year: 2, value: 1.08 }, 1.25, en)).toBe("coverage lowest in year 2 at 1.08 — below the lender's 1.25");
  });

  it('treats coverage exactly at the threshold as meeting it', () => {
    // A lender's minimum DSCR of 1.25 is met at 1.25 (common practice, no source).
    expect(coverageReading({ year: 5, value: 1.25 }, 1.25, en)).toContain('at or above');
  });

  it('explains an undefined profitability index and break-even response', () => {
    // docs/model.md: a metric that cannot be computed is null with a reason.
    expect(profitabilityIndexReading(null, en)).toMatch(/^not defined: /);
    expect(breakEvenLyingResponseReading(null, 'same-lying-time', 1, 'Grazing as today', en)).toMatch(/same lying time as Grazing as today/);
  });
});

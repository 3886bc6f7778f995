import { describe, expect, it } from 'vitest';
import type { OptionResult } from '../../../shared/engine/results';
import { candidatesByChange } from '../../../shared/candidates';
import { missingText } from '../../../src/components/compare/measure-format';
import { MEASURES, measureByKey, rankOptions } from '../../../src/components/compare/ranking';

/** Only the fields the measures read; the rest of OptionResult does not matter to ranking. */
function option(id: string, fields: Partial<OptionResult>): OptionResult {
  return { id, name: id, current: false, npv: 0, irr: null, paybackYears: null, lowestCoverage: null, labourHoursPerYear: [], ...fields } as OptionResult;
}

describe('ranking options by a measure', () => {
  it('puts the highest NPV first', () => {
    // A larger NPV is the better investment (docs/model.md Results; common practice, no source).
    const ranked = rankOptions([option('a', { npv: 10 }), option('b', { npv: 30 }), option('c', { npv: -5 })], measureByKey('npv'));
    expect(ranked.map((r) => r.option.id)).toEqual(['b', 'a', 'c']);
    expect(ranked.map((r) => r.rank)).toEqual([1, 2, 3]);
  });

  it('puts the shortest payback first and options that never pay back last, unranked', () => {
    // A shorter payback is preferred; "not within horizon" cannot be ranked (common practice, no source).
    const change = (paybackYears: number | null) => ({ incremental: { paybackYears, cashFlows: [-1, 1] } }) as Partial<OptionResult>;
    const ranked = rankOptions([option('never', change(null)), option('slow', change(9)), option('fast', change(4.5))], measureByKey('paybackYears'));
    expect(ranked.map((r) => r.option.id)).toEqual(['fast', 'slow', 'never']);
    expect(ranked[2]?.rank).toBeNull();
  });

  it('takes rates of return and payback on the change against the current option, never the whole-herd flows', () => {
    // docs/model.md: the decision figures are the incremental ones; the current option is the yardstick.
    const current = option('today', { current: true, irr: 0.5, paybackYears: 1 });
    const barn = option('barn', { irr: 0.6, paybackYears: 1.2, incremental: { irr: 0.04, irrKind: 'investment', paybackYears: 14, cashFlows: [-100, 10] } as OptionResult['incremental'] });
    expect(measureByKey('irr').value(barn)).toBe(0.04);
    expect(measureByKey('paybackYears').value(barn)).toBe(14);
    expect(measureByKey('irr').value(current)).toBeNull();
    // The reference has no change of its own: no "NPV of the change 0.00" in its column.
    expect(measureByKey('incrementalNpv').value(current)).toBeNull();
    expect(missingText(measureByKey('incrementalNpv'), current, 20).reason).toMatch(/measured against/);
    const saving = option('cheaper', { incremental: { irr: 0.6, irrKind: 'borrowing', cashFlows: [50, -10] } as OptionResult['incremental'] });
    expect(measureByKey('irr').value(saving)).toBeNull();
  });

  it('gives equal values the same rank and skips the next (1-2-2-4)', () => {
    // Standard competition ranking ("1224"), from memory.
    const ranked = rankOptions([option('a', { npv: 5 }), option('b', { npv: 3 }), option('c', { npv: 3 }), option('d', { npv: 1 })], measureByKey('npv'));
    expect(ranked.map((r) => r.rank)).toEqual([1, 2, 2, 4]);
  });

  it('ranks lowest coverage highest-first, reading the engine value', () => {
    // A higher debt-service coverage ratio is safer for the lender (common practice, no source).
    const ranked = rankOptions(
      [option('a', { lowestCoverage: { year: 2, value: 1.1 } }), option('b', { lowestCoverage: { year: 1, value: 1.6 } })],
      measureByKey('lowestCoverage'),
    );
    expect(ranked.map((r) => r.option.id)).toEqual(['b', 'a']);
  });

  it('falls back to the NPV of the change for an unknown measure key, and lists the change first', () => {
    // The decision is made on the change against the current option (shared/engine/README.md, Project view).
    expect(measureByKey('nonsense').key).toBe('incrementalNpv');
    expect(MEASURES[0]?.key).toBe('incrementalNpv');
    expect(MEASURES.find((m) => m.key === 'npv')?.label).toMatch(/whole herd's margin/);
  });

  it('ranks by payback from operations and by stressed coverage as the engine reports them', () => {
    // A shorter payback and a higher coverage are better (common practice, no source).
    const barn = (id: string, payback: number | null, stressed: number) =>
      option(id, {
        incremental: { paybackFromOperationsYears: payback, cashFlows: [-100, 10] } as unknown as OptionResult['incremental'],
        stress: [{ id: 'milk-10-rate+2', label: '', lowestCoverage: stressed, lowestProjectCoverage: null, npvAgainstCurrent: 0, yearsBelowThreshold: 0 }],
      });
    const options = [barn('a', null, 1.4), barn('b', 12, 0.9), barn('c', 8, 1.1)];
    expect(rankOptions(options, measureByKey('paybackFromOperationsYears')).map((r) => r.option.id)).toEqual(['c', 'b', 'a']);
    expect(rankOptions(options, measureByKey('stressedCoverage')).map((r) => r.option.id)).toEqual(['a', 'c', 'b']);
  });

  it('keeps the current option first as the reference, unranked, even where its own figure is the best', () => {
    // The current option is the yardstick, not a candidate (docs/product.md glossary, docs/model.md).
    const change = (npv: number) => ({ incremental: { npv, cashFlows: [-1, 1] } }) as Partial<OptionResult>;
    const options = [option('barn', { npv: 40, ...change(-3) }), option('today', { current: true, npv: 90, incremental: null }), option('robot', { npv: 20, ...change(5) })];
    const byOwnNpv = rankOptions(options, measureByKey('npv'));
    expect(byOwnNpv.map((r) => [r.option.id, r.rank])).toEqual([['today', null], ['barn', 1], ['robot', 2]]);
    const byChange = rankOptions(options, measureByKey('incrementalNpv'));
    expect(byChange.map((r) => [r.option.id, r.rank])).toEqual([['today', null], ['robot', 1], ['barn', 2]]);
    // The same rule names the best candidate on the farm page: the least bad change when none pays.
    expect(candidatesByChange(options).map((o) => o.id)).toEqual(['robot', 'barn']);
    expect(candidatesByChange([options[0]!, options[1]!])[0]?.id).toBe('barn');
  });
});

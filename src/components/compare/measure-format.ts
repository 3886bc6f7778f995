/** How each comparison measure is written in a table cell, and why a missing value is missing. Pure. */
import type { OptionSummary } from '@shared/engine';
import { formatMoney, formatNumber, formatPercent, type MoneyFormat } from '@/composables/useFormat';
import { irrUndefinedReading } from '@/components/results/readings';
import type { Measure } from './ranking';

/** The measure's value as shown (money to the cent); null values are written by {@link missingText}. */
export function measureText(measure: Measure, value: number, format: MoneyFormat): string {
  switch (measure.kind) {
    case 'money':
      return formatMoney(value, format);
    case 'percent':
      return formatPercent(value, format.locale);
    case 'years':
      return `${formatNumber(value, format.locale, 1, true)} yr`;
    case 'ratio':
      return formatNumber(value, format.locale, 2, true);
    case 'hours':
      return `${formatNumber(value, format.locale, 0)} h`;
    case 'tonnes':
      return `${formatNumber(value, format.locale, 1, true)} t`;
  }
}

/** Short text and the full reason for a measure an option lacks. */
export function missingText(measure: Measure, option: OptionSummary, horizon: number): { short: string; reason: string } {
  const change = option.incremental;
  // Returns on the extra outlay, which a change without one does not have.
  const onTheOutlay = ['irr', 'mirr', 'paybackYears', 'paybackFromOperationsYears', 'discountedPaybackYears', 'profitabilityIndex', 'lowestProjectCoverage'].includes(measure.key);
  if (option.current && (onTheOutlay || measure.key === 'incrementalNpv')) {
    return { short: '—', reason: 'the current option is what the others are measured against' };
  }
  if (onTheOutlay && change && change.cashFlows[0] !== undefined && change.cashFlows[0] >= 0) {
    return { short: 'no extra outlay', reason: 'this option needs no more capital than the current one, so there is no investment to earn a return on; read its NPV against the current option' };
  }
  switch (measure.key) {
    case 'irr':
      return { short: 'not defined', reason: irrUndefinedReading(change?.irrReason, change?.cashFlows ?? []) };
    case 'mirr':
      return { short: 'not defined', reason: 'MIRR needs at least one negative and one positive cash flow' };
    case 'paybackFromOperationsYears':
      return { short: `not in ${horizon} yr`, reason: `the extra cash from running it does not pay back the outlay within the ${horizon}-year horizon, before salvage and herd value` };
    case 'paybackYears':
    case 'discountedPaybackYears':
      return { short: `not in ${horizon} yr`, reason: `does not pay back within the ${horizon}-year horizon` };
    case 'profitabilityIndex':
      return { short: 'not defined', reason: 'no money is out at year 0 to divide by' };
    case 'capitalPerStall':
    case 'equivalentAnnualCostPerStall':
      return { short: 'no stalls', reason: 'this option has no stalls' };
    case 'lowestProjectCoverage':
      return { short: 'no extra loan', reason: 'this option borrows no more than the current one' };
    case 'lowestCoverage':
    case 'stressedCoverage':
      return { short: 'no debt', reason: 'no debt service falls due in any year' };
    case 'incrementalNpv':
      return { short: 'not defined', reason: 'no current option to compare with' };
    default:
      return { short: '—', reason: 'not computed for this option' };
  }
}

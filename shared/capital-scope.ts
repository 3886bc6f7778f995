import type { Option } from './schema';

/** A part of a housed option's investment that is often forgotten in a first budget. */
export interface ScopeItem {
  key: 'feed-barrier' | 'feeding-equipment' | 'feed-storage' | 'special-needs-pens' | 'milking-capacity' | 'services' | 'sand-handling';
  label: string;
  /** Words in a capital line's description (or its category) that show the item is budgeted. */
  pattern: RegExp;
}

const SCOPE: readonly ScopeItem[] = [
  { key: 'feed-barrier', label: 'Feed barrier and feed lane', pattern: /feed (barrier|fence|rail|lane)|headlock|head lock/i },
  { key: 'feeding-equipment', label: 'Feeding equipment (mixer wagon, feeder)', pattern: /mixer|feed wagon|feeder|feeding equipment|feed pusher/i },
  { key: 'feed-storage', label: 'Feed storage for year-round housing', pattern: /silage|silo|clamp|bunker|feed stor/i },
  { key: 'special-needs-pens', label: 'Calving and special-needs pens', pattern: /calving|special.needs|sick pen|maternity|hospital pen/i },
  { key: 'milking-capacity', label: 'Milking capacity for the larger herd', pattern: /parlou?r|milking|robot/i },
  { key: 'services', label: 'Services: power, water supply, drainage', pattern: /services|electric|power supply|water supply|drainage|plumbing/i },
  { key: 'sand-handling', label: 'Sand separation or a sand settling lane', pattern: /sand (lane|separat|settl|trap|recover)/i },
];

/**
 * The common parts of a housed option's capital that none of its lines names (by description),
 * for the scope checklist on the capital table: sand handling only for deep sand, milking
 * capacity only when the option adds cows. Grazing options and the current option get none.
 */
export function missingScope(option: Option): ScopeItem[] {
  if (option.current || option.kind !== 'freestall') return [];
  const addsCows = option.herdChange.addedCows > 0 || option.herdChange.cowsByYear !== null;
  return SCOPE.filter((item) => {
    if (item.key === 'sand-handling' && option.bed !== 'deep-sand') return false;
    if (item.key === 'milking-capacity' && !addsCows) return false;
    return !option.capitalLines.some((line) => item.pattern.test(line.description));
  });
}

/**
 * What an option card says about risk, from the scenario's kept Monte Carlo run (never run
 * again for the card): the chance the change loses money against the current option, or why
 * there is no such figure.
 */
import type { MonteCarloResult } from '@shared/engine/risk/monte-carlo';

export type CardRisk =
  | { state: 'kept'; chance: number | null; draws: number }
  /** A run was kept but the inputs have changed since (or there are unsaved edits). */
  | { state: 'stale' }
  | { state: 'not-run' };

/** The card's risk line for each option id; `fresh` = the run matches the saved inputs and nothing is unsaved. */
export function cardRiskByOption(kept: MonteCarloResult | null, fresh: boolean): (optionId: string) => CardRisk {
  if (!kept) return () => ({ state: 'not-run' });
  if (!fresh) return () => ({ state: 'stale' });
  const byId = new Map(kept.options.map((o) => [o.optionId, o]));
  return (optionId) => {
    const option = byId.get(optionId);
    // An option the run did not hold cannot be fresh; say so rather than show nothing.
    return option ? { state: 'kept', chance: option.incrementalNpv?.probabilityNegative ?? null, draws: kept.drawsDone } : { state: 'stale' };
  };
}

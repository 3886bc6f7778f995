/**
 * What an option card says about risk, from the scenario's kept Monte Carlo run (never run
 * again for the card): the chance the change loses money against the current option, or why
 * there is no such figure.
 */
import type { MonteCarloResult } from '@shared/engine';

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

/** The risk line in words: the chance as a percentage (with what it counts), or why there is none. */
export function cardRiskWords(risk: CardRisk, percent: (share: number | null) => string): { value: string; title: string; negative: boolean } {
  if (risk.state === 'kept') {
    return {
      value: percent(risk.chance),
      negative: (risk.chance ?? 0) >= 0.5,
      title: `Share of the ${risk.draws} Monte Carlo draws of the kept risk run in which the NPV against the current option is below 0`,
    };
  }
  if (risk.state === 'stale') return { value: 'risk run out of date', negative: false, title: 'The inputs changed since the kept risk run: run it again on the Risk tab' };
  return { value: 'risk not run yet', negative: false, title: 'Run the Monte Carlo on the Risk tab to see it' };
}

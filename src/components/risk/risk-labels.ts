/** Plain names of the risk inputs (from the shared schema) and a first set of uncertain inputs. */
import type { MonteCarloInput } from '@shared/schema';

export { RISK_INPUT_LABELS } from '@shared/schema';

/**
 * A starting set of uncertain inputs for a first run, offered when a scenario has none: an
 * assumption for the user to edit (about −15/+10 % on milk price, −5/+25 % on capital, a
 * quarter either way on the lying-time response; common practice, no source).
 */
export const TYPICAL_MONTE_CARLO_INPUTS: readonly MonteCarloInput[] = [
  { key: 'milkPrice', distribution: 'triangular', min: 0.85, mode: 1, max: 1.1 },
  { key: 'capitalCost', distribution: 'triangular', min: 0.95, mode: 1, max: 1.25 },
  { key: 'yieldResponse', distribution: 'normal', mean: 1, sd: 0.25, min: 0 },
];

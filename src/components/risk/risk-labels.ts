/** Plain names of the risk inputs, for charts, tables and pickers. */
import type { MonteCarloInput, RiskInputKey } from '@shared/schema';

export const RISK_INPUT_LABELS: Record<RiskInputKey, string> = {
  milkPrice: 'Milk price',
  yieldResponse: 'Milk response to lying time',
  capitalCost: 'Capital cost',
  interestRate: 'Interest rate',
  wage: 'Wage',
  beddingPrice: 'Bedding price',
  fertiliserPrice: 'Fertiliser prices',
  herdSize: 'Herd size',
  housedFeedCost: 'Housed feed cost per cow-day',
  grazingFeedCost: 'Grazing feed cost per cow-day',
  marginalFeedCost: 'Feed cost per extra kg of milk',
  systemYieldAdjustment: 'System yield adjustment',
  milkFeedGrowthGap: 'Milk growth against feed',
  lyingHours: 'Lying-time gain',
  healthCostPerCase: 'Health cost per case',
  slurryHandlingCost: 'Manure handling cost',
};

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

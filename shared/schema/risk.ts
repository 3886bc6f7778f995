import { z } from 'zod';
import { flag, quantity } from './fields';
import { riskInputKeys, type RiskInputKey } from './risk-keys';

export { riskInputKeys, type RiskInputKey };

/** Plain names of the risk inputs, for charts, tables, pickers and the workbook. */
export const RISK_INPUT_LABELS: Readonly<Record<RiskInputKey, string>> = {
  milkPrice: 'Milk price',
  yieldResponse: 'Milk response to lying time',
  capitalCost: 'Capital cost',
  interestRate: 'Interest rate',
  wage: 'Wage',
  beddingPrice: 'Bedding price',
  fertiliserPrice: 'Fertiliser prices',
  herdSize: 'Herd size',
  housedFeedCost: 'Feed cost, housed day',
  grazingFeedCost: 'Feed cost, grazing day',
  marginalFeedCost: 'Feed per extra kg of milk',
  systemYield: 'System yield adjustment',
  healthCostPerCase: 'Health cost per case',
  manureHandlingCost: 'Slurry handling cost',
  milkFeedGrowthGap: 'Milk growth against feed',
  lyingHours: 'Lying-time gain',
};

const riskKey = z
  .enum(riskInputKeys, { error: `Risk input must be one of: ${riskInputKeys.join(', ')}` })
  .describe('Which key input the distribution multiplies');

const rangeSchema = (label: string) =>
  z
    .object({
      low: quantity(`${label} low`, '', -1, 0, `${label}: low value as a change from the base (fraction, −0.2 = 20 % lower)`).default(-0.2),
      high: quantity(`${label} high`, '', 0, 5, `${label}: high value as a change from the base (fraction, 0.2 = 20 % higher)`).default(0.2),
    })
    .describe(`${label} sensitivity range`);

const sensitivitySchema = z
  .object({
    milkPrice: rangeSchema('Milk price').prefault({}),
    yieldResponse: rangeSchema('Lying-time milk response').prefault({}),
    capitalCost: rangeSchema('Capital cost').prefault({}),
    interestRate: rangeSchema('Interest rate').prefault({}),
    wage: rangeSchema('Wage').prefault({}),
    beddingPrice: rangeSchema('Bedding price').prefault({}),
    fertiliserPrice: rangeSchema('Fertiliser price').prefault({}),
    herdSize: rangeSchema('Herd size').prefault({}),
    housedFeedCost: rangeSchema('Housed feed cost').prefault({}),
    grazingFeedCost: rangeSchema('Grazing feed cost').prefault({}),
    marginalFeedCost: rangeSchema('Marginal feed cost').prefault({}),
    systemYield: rangeSchema('System yield adjustment').prefault({}),
    healthCostPerCase: rangeSchema('Health cost per case').prefault({}),
    manureHandlingCost: rangeSchema('Manure handling cost').prefault({}),
    milkFeedGrowthGap: rangeSchema('Milk growth against feed (0.2 = 1 point a year faster)').prefault({}),
    // Kept so stored scenarios still read; see the description for why neither run reads it.
    lyingHours: rangeSchema('Lying-time gain over the current option')
      .describe(
        'Lying-time gain over the current option: not used by the one-at-a-time sensitivity, which shows the lying-time milk once as the milk response to lying time (shared/schema/risk-keys.ts); the Monte Carlo draws the gain from its own distribution (risk.monteCarlo.inputs). Kept so stored scenarios still read.',
      )
      .prefault({}),
  } satisfies Record<RiskInputKey, unknown>)
  .describe('Low/high change per key input (fractions of the base value)');

const multiplier = (label: string, description: string) => quantity(label, '', 0, 10, description);

const triangularSchema = z
  .object({
    key: riskKey,
    distribution: z.literal('triangular').describe('Triangular distribution (min, mode, max)'),
    min: multiplier('Triangular minimum', 'Lowest multiplier on the base value (1 = as entered)'),
    mode: multiplier('Triangular mode', 'Most likely multiplier on the base value'),
    max: multiplier('Triangular maximum', 'Highest multiplier on the base value'),
  })
  .refine((d) => d.min <= d.mode && d.mode <= d.max, {
    message: 'Triangular distribution needs minimum ≤ mode ≤ maximum',
    path: ['mode'],
  });

const normalSchema = z
  .object({
    key: riskKey,
    distribution: z.literal('normal').describe('Normal distribution (mean, sd), optionally truncated'),
    mean: multiplier('Normal mean', 'Mean multiplier on the base value (1 = as entered)'),
    sd: quantity('Normal standard deviation', '', 0, 5, 'Standard deviation of the multiplier'),
    min: multiplier('Normal truncation minimum', 'Lowest multiplier kept (truncation)').optional(),
    max: multiplier('Normal truncation maximum', 'Highest multiplier kept (truncation)').optional(),
  })
  .refine((d) => d.min === undefined || d.max === undefined || d.min < d.max, {
    message: 'Normal distribution truncation needs minimum < maximum',
    path: ['max'],
  });

export const monteCarloInputSchema = z
  .discriminatedUnion('distribution', [triangularSchema, normalSchema], {
    error: "Distribution must be 'triangular' or 'normal'",
  })
  .describe('An uncertain input as a multiplier on its base value');
export type MonteCarloInput = z.infer<typeof monteCarloInputSchema>;

export const riskSchema = z
  .object({
    sensitivity: sensitivitySchema.prefault({}),
    monteCarlo: z
      .object({
        draws: quantity('Monte Carlo draws', 'draws', 100, 100000, 'Number of draws', { int: true }).default(5000),
        seed: quantity('Monte Carlo seed', '', 0, 2147483647, 'Seed of the generator (same seed → same numbers)', { int: true }).default(1),
        inputs: z.array(monteCarloInputSchema).max(20, 'Monte Carlo inputs: at most 20').default([]).describe('Uncertain inputs and their distributions'),
        // Keep the default equal to DEFAULT_MILK_FEED_CORRELATION in shared/engine/risk/monte-carlo.ts.
        milkFeedCorrelation: quantity('Milk and feed correlation', '', -0.99, 0.99, 'Correlation of the milk price draw with the feed cost draws (Gaussian copula, −0.99 to 0.99)').default(0.5),
        pricesPerYear: flag('Prices drawn per year', 'True to draw the milk price and feed cost multipliers afresh each year (a trough can last a year or two), false for one multiplier over all years').default(false),
      })
      .prefault({})
      .describe('Monte Carlo settings'),
  })
  .describe('Sensitivity and Monte Carlo settings');

export type RiskSettings = z.infer<typeof riskSchema>;

// No zod here: the engine reads the keys without pulling the schemas into the Monte Carlo worker.

/** The inputs a sensitivity range or a Monte Carlo distribution can move. */
export const riskInputKeys = [
  'milkPrice',
  'yieldResponse',
  'capitalCost',
  'interestRate',
  'wage',
  'beddingPrice',
  'fertiliserPrice',
  'herdSize',
  'housedFeedCost',
  'grazingFeedCost',
  'marginalFeedCost',
  'systemYield',
  'healthCostPerCase',
  'manureHandlingCost',
  'milkFeedGrowthGap',
  'lyingHours',
] as const;
export type RiskInputKey = (typeof riskInputKeys)[number];

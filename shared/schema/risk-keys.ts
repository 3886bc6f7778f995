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

/**
 * The inputs the one-at-a-time sensitivity moves: every risk input but the lying-time gain. The
 * milk extra lying time brings is the response × the hours gained, so moving either one alone
 * moves the NPV by the same amount (below the lying-time cap); the sensitivity shows that one
 * driver once, as the response, which scales the whole lying-time milk even where the cap binds.
 * Monte Carlo draws both, since two uncertain factors of one product widen its spread.
 */
export const sensitivityInputKeys = riskInputKeys.filter((key) => key !== 'lyingHours');

export interface HealthRates {
  lamenessCasesPer100Cows: number;
  lamenessCostPerCase: number;
  mastitisCasesPer100Cows: number;
  mastitisCostPerCase: number;
  injuriesPer100Cows: number;
  injuryCostPerCase: number;
}

/** Cost of one condition in today's money (currency/yr): cases per 100 cows × N/100 × cost per case. */
export function conditionCostPerYear(casesPer100Cows: number, cows: number, costPerCase: number): number {
  return ((casesPer100Cows * cows) / 100) * costPerCase;
}

/** Health cost in today's money (currency/yr): lameness + clinical mastitis + injuries. */
export function healthCostPerYear(cows: number, rates: HealthRates): number {
  return (
    conditionCostPerYear(rates.lamenessCasesPer100Cows, cows, rates.lamenessCostPerCase) +
    conditionCostPerYear(rates.mastitisCasesPer100Cows, cows, rates.mastitisCostPerCase) +
    conditionCostPerYear(rates.injuriesPer100Cows, cows, rates.injuryCostPerCase)
  );
}

/** Extra culling cost in today's money (currency/yr): extra culls per 100 cows × N/100 × (replacement cost − cull value). */
export function cullingCostPerYear(extraCullsPer100Cows: number, cows: number, replacementCost: number, cullValue: number): number {
  return ((extraCullsPer100Cows * cows) / 100) * (replacementCost - cullValue);
}

/**
 * Culls per 100 cows per year the housing causes (cows): the extra culls entered plus the culls
 * that follow lameness, lameness incidence (cases per 100 cows per year) × culls per case.
 */
export function extraCullsPer100Cows(health: { extraCullsPer100Cows: number; lamenessCasesPer100Cows: number; lamenessCullsPerCase: number }): number {
  return health.extraCullsPer100Cows + health.lamenessCasesPer100Cows * health.lamenessCullsPerCase;
}

import { scenarioSchema, type Herd, type Scenario, type ScenarioInput } from '../../../shared/schema';
import { createOption } from '../../../shared/starting-points';

/** An invented 150-cow herd for the risk tests (no real farm). */
const HERD = {
  cows: 150,
  breedSize: 'large',
  yieldKgPerCowDay: 27,
  milkPricePerKg: 0.44,
  feedCostPerCowDay: { housed: 5.4, grazing: 2.8 },
  marginalFeedCostPerKgMilk: 0.17,
  wagePerHour: 17,
  fertiliserPrices: { nitrogenPerKg: 1.2, phosphatePerKg: 0.95, potashPerKg: 0.65 },
  replacementHeiferCost: 2100,
  cullCowValue: 850,
  existingCashForDebtServicePerYear: 110000,
  existingDebtPaymentsPerYear: 35000,
} as const satisfies ScenarioInput['herd'];

/** Input form of a five-option scenario: grazing (current) and the four freestall starting points. */
export function riskScenarioInput(horizonYears = 20): ScenarioInput {
  const herd: Herd = scenarioSchema.shape.herd.parse(HERD);
  return {
    schemaVersion: 1,
    name: 'Risk test barn study',
    horizonYears,
    currency: 'EUR',
    locale: 'en-IE',
    herd: HERD,
    options: [
      createOption('grazing', herd, { id: 'now', name: 'As now', current: true }),
      createOption('steel-freestall', herd, { id: 'steel' }),
      createOption('flexible-freestall', herd, { id: 'flex' }),
      createOption('mattress-freestall', herd, { id: 'mattress' }),
      createOption('sand-freestall', herd, { id: 'sand' }),
    ],
    finance: { equity: 120000, interestRate: 0.055, termYears: 15, discountRate: 0.06 },
    risk: {
      monteCarlo: {
        draws: 400,
        seed: 20240611,
        inputs: [
          { key: 'milkPrice', distribution: 'triangular', min: 0.8, mode: 1, max: 1.15 },
          { key: 'capitalCost', distribution: 'normal', mean: 1.05, sd: 0.1, min: 0.8, max: 1.4 },
          { key: 'yieldResponse', distribution: 'triangular', min: 0.3, mode: 1, max: 1.6 },
        ],
      },
    },
  };
}

/** The five-option scenario, parsed (defaults filled). */
export function riskScenario(horizonYears = 20): Scenario {
  return scenarioSchema.parse(riskScenarioInput(horizonYears));
}

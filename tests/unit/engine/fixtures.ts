import { scenarioSchema, type Herd, type Scenario, type ScenarioInput } from '../../../shared/schema';
import { createOption } from '../../../shared/starting-points';

/** An invented 120-cow herd (no real farm). */
export const HERD_INPUT = {
  cows: 120,
  breedSize: 'large',
  yieldKgPerCowDay: 28,
  milkPricePerKg: 0.42,
  feedCostPerCowDay: { housed: 5.2, grazing: 2.6 },
  marginalFeedCostPerKgMilk: 0.18,
  wagePerHour: 16,
  fertiliserPrices: { nitrogenPerKg: 1.1, phosphatePerKg: 0.9, potashPerKg: 0.6 },
  replacementHeiferCost: 2000,
  cullCowValue: 800,
  existingCashForDebtServicePerYear: 90000,
  existingDebtPaymentsPerYear: 30000,
} as const satisfies ScenarioInput['herd'];

/** An invented 150-cow herd for the risk tests (no real farm), apart from HERD_INPUT so each suite keeps its own numbers. */
const RISK_HERD_INPUT = {
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

/** The herd after parsing (defaults filled). */
export function parsedHerd(): Herd {
  return scenarioSchema.shape.herd.parse(HERD_INPUT);
}

/** Grazing (current, "As now") and the four freestall starting points, sized for `herd`. */
function fiveOptions(herd: Herd): ScenarioInput['options'] {
  return [
    createOption('grazing', herd, { id: 'now', name: 'As now', current: true }),
    createOption('steel-freestall', herd, { id: 'steel' }),
    createOption('flexible-freestall', herd, { id: 'flex' }),
    createOption('mattress-freestall', herd, { id: 'mattress' }),
    createOption('sand-freestall', herd, { id: 'sand' }),
  ];
}

/** A five-option demo scenario: grazing (current) and the four freestall starting points. */
export function demoScenarioInput(): ScenarioInput {
  return {
    schemaVersion: 1,
    name: 'Demo barn study',
    currency: 'EUR',
    locale: 'en-IE',
    herd: HERD_INPUT,
    options: fiveOptions(parsedHerd()),
    finance: { equity: 100000, interestRate: 0.055, termYears: 15, discountRate: 0.06, taxRate: 0.2 },
  };
}

/** The demo scenario, parsed. */
export function demoScenario(): Scenario {
  return scenarioSchema.parse(demoScenarioInput());
}

/** Input form of the risk tests' five-option scenario, with a seeded 400-draw Monte Carlo over three inputs. */
export function riskScenarioInput(horizonYears = 20): ScenarioInput {
  return {
    schemaVersion: 1,
    name: 'Risk test barn study',
    horizonYears,
    currency: 'EUR',
    locale: 'en-IE',
    herd: RISK_HERD_INPUT,
    options: fiveOptions(scenarioSchema.shape.herd.parse(RISK_HERD_INPUT)),
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

/** The risk tests' scenario, parsed (defaults filled). */
export function riskScenario(horizonYears = 20): Scenario {
  return scenarioSchema.parse(riskScenarioInput(horizonYears));
}

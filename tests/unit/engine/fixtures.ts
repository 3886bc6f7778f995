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

/** The herd after parsing (defaults filled). */
export function parsedHerd(): Herd {
  return scenarioSchema.shape.herd.parse(HERD_INPUT);
}

/** A five-option demo scenario: grazing (current) and the four freestall starting points. */
export function demoScenarioInput(): ScenarioInput {
  const herd = parsedHerd();
  return {
    schemaVersion: 1,
    name: 'Demo barn study',
    currency: 'EUR',
    locale: 'en-IE',
    herd: HERD_INPUT,
    options: [
      createOption('grazing', herd, { id: 'now', name: 'As now', current: true }),
      createOption('steel-freestall', herd, { id: 'steel' }),
      createOption('flexible-freestall', herd, { id: 'flex' }),
      createOption('mattress-freestall', herd, { id: 'mattress' }),
      createOption('sand-freestall', herd, { id: 'sand' }),
    ],
    finance: { equity: 100000, interestRate: 0.055, termYears: 15, discountRate: 0.06, taxRate: 0.2 },
  };
}

/** The demo scenario, parsed. */
export function demoScenario(): Scenario {
  return scenarioSchema.parse(demoScenarioInput());
}

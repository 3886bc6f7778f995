import fc from 'fast-check';
import { scenarioSchema, startingPoints, type Scenario, type ScenarioInput } from '../../../shared/schema';
import { createOption } from '../../../shared/starting-points';

const rate = (max: number) => fc.double({ min: 0, max, noNaN: true });
const growth = fc.double({ min: -0.2, max: 0.3, noNaN: true });

const herdArbitrary = fc.record({
  cows: fc.integer({ min: 1, max: 3000 }),
  breedSize: fc.constantFrom('small' as const, 'large' as const),
  yieldKgPerCowDay: fc.double({ min: 0, max: 60, noNaN: true }),
  milkPricePerKg: fc.double({ min: 0, max: 2, noNaN: true }),
  growth: fc.record({ milkPrice: growth, feed: growth, wages: growth, bedding: growth, fertiliser: growth, general: growth }),
  feedCostPerCowDay: fc.record({ housed: fc.double({ min: 0, max: 15, noNaN: true }), grazing: fc.double({ min: 0, max: 10, noNaN: true }) }),
  marginalFeedCostPerKgMilk: fc.double({ min: 0, max: 1, noNaN: true }),
  wagePerHour: fc.double({ min: 0, max: 60, noNaN: true }),
  fertiliserPrices: fc.record({ nitrogenPerKg: rate(5), phosphatePerKg: rate(5), potashPerKg: rate(5) }),
  lyingResponseKgPerHour: rate(5),
  lyingResponseYear1Fraction: rate(1),
  replacementHeiferCost: fc.double({ min: 0, max: 5000, noNaN: true }),
  cullCowValue: fc.double({ min: 0, max: 3000, noNaN: true }),
  existingCashForDebtServicePerYear: fc.double({ min: -1e5, max: 1e6, noNaN: true }),
  existingDebtPaymentsPerYear: fc.double({ min: 0, max: 5e5, noNaN: true }),
});

const financeArbitrary = fc.record({
  equity: fc.double({ min: 0, max: 1e6, noNaN: true }),
  grants: fc.double({ min: 0, max: 2e5, noNaN: true }),
  loanAmount: fc.option(fc.double({ min: 0, max: 2e6, noNaN: true }), { nil: null }),
  interestRate: rate(0.3),
  termYears: fc.integer({ min: 1, max: 40 }),
  paymentsPerYear: fc.constantFrom(1 as const, 2 as const, 4 as const, 12 as const),
  interestOnlyMonths: fc.integer({ min: 0, max: 24 }),
  discountRate: rate(0.3),
  taxRate: rate(0.6),
  depreciation: fc.constantFrom('straight-line' as const, 'declining-balance' as const),
  decliningBalanceFactor: fc.double({ min: 1, max: 3, noNaN: true }),
  lossesOffsetOtherIncome: fc.boolean(),
});

const optionTweaks = fc.record({
  startingPoint: fc.constantFrom(...startingPoints),
  lyingHoursPerDay: fc.double({ min: 0, max: 24, noNaN: true }),
  housedDaysPerYear: fc.integer({ min: 0, max: 366 }),
  systemYieldAdjustment: fc.double({ min: -30, max: 30, noNaN: true }),
  stockingRate: fc.double({ min: 0.5, max: 2, noNaN: true }),
  addedCows: fc.integer({ min: -50, max: 200 }),
  costScale: fc.double({ min: 0, max: 3, noNaN: true }),
});

/** A valid scenario input built from random herd, finance and option figures (may still fail cross-field checks). */
export const scenarioInputArbitrary: fc.Arbitrary<ScenarioInput> = fc
  .record({
    horizonYears: fc.integer({ min: 1, max: 40 }),
    herd: herdArbitrary,
    finance: financeArbitrary,
    options: fc.array(optionTweaks, { minLength: 1, maxLength: 4 }),
  })
  .map(({ horizonYears, herd, finance, options }) => {
    const parsedHerd = scenarioSchema.shape.herd.parse(herd);
    return {
      schemaVersion: 1 as const,
      name: 'Generated',
      horizonYears,
      currency: 'EUR',
      locale: 'en-IE',
      herd,
      finance,
      options: options.map((tweak, index) => {
        const option = createOption(tweak.startingPoint, parsedHerd, { id: `o${index}`, current: index === 0 });
        return {
          ...option,
          lyingHoursPerDay: tweak.lyingHoursPerDay,
          housedDaysPerYear: tweak.housedDaysPerYear,
          systemYieldAdjustment: tweak.systemYieldAdjustment,
          stockingRate: tweak.stockingRate,
          herdChange: { cowsByYear: null, addedCows: Math.max(-herd.cows, tweak.addedCows), addedCowCost: null },
          capitalLines: option.capitalLines.map((line) => (line.kind === 'item' ? { ...line, unitCost: line.unitCost * tweak.costScale } : line)),
        };
      }),
    };
  });

/** Parses a generated input; null when a cross-field rule refuses it. */
export function parseGenerated(input: ScenarioInput): Scenario | null {
  const result = scenarioSchema.safeParse(input);
  return result.success ? result.data : null;
}

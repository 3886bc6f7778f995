import { z } from 'zod';
import { choice, money, quantity, rate, text } from './fields';

const growthRate = (label: string) => rate(label, -0.2, 0.3, `${label}: nominal growth per year (fraction, 0.02 = 2 %/yr)`);

/**
 * Yearly growth of one price group; null (the default) = it follows general inflation, so no
 * group drifts from another unless the farm enters its own rate.
 */
const groupGrowth = (label: string) =>
  growthRate(label)
    .nullable()
    .default(null)
    .describe(`${label}: nominal growth per year (fraction, 0.02 = 2 %/yr); null = general inflation`);

/** Multiplier per operating year ([0] = year 1) on a price group after its growth; years past the list stay at 1. */
const yearIndex = (label: string) =>
  z
    .array(quantity(`${label} index`, '', 0, 10, `${label} multiplier in one operating year (1 = as grown)`))
    .max(100, `${label} index: at most 100 years`)
    .nullable()
    .default(null)
    .describe(`${label} multiplier per operating year, [0] = year 1 (1 = as grown); null = 1 every year`);

export const growthRatesSchema = z
  .object({
    milkPrice: groupGrowth('Milk price growth'),
    feed: groupGrowth('Feed cost growth'),
    wages: groupGrowth('Wage growth'),
    bedding: groupGrowth('Bedding price growth'),
    fertiliser: groupGrowth('Fertiliser price growth'),
    general: growthRate('General inflation').default(0.02),
  })
  .describe('Nominal yearly growth of each price group (fractions per year); a group left empty follows general inflation');

/** The price groups a running-cost line can follow. */
export const growthKeys = ['milkPrice', 'feed', 'wages', 'bedding', 'fertiliser', 'general', 'none'] as const;
export type GrowthKey = (typeof growthKeys)[number];

export const manureExcretionSchema = z
  .object({
    massKgPerCowDay: quantity('Manure excreted', 'kg/cow/day', 0, 200, 'Manure as excreted (kg per cow per day)').default(68),
    nitrogenKgPerCowDay: quantity('Nitrogen excreted', 'kg/cow/day', 0, 2, 'Nitrogen (N) excreted (kg per cow per day)').default(0.45),
    phosphorusKgPerCowDay: quantity('Phosphorus excreted', 'kg/cow/day', 0, 1, 'Phosphorus as element P excreted (kg per cow per day)').default(0.078),
    potassiumKgPerCowDay: quantity('Potassium excreted', 'kg/cow/day', 0, 1, 'Potassium as element K excreted (kg per cow per day)').default(0.1),
  })
  .describe('Excretion per lactating cow per day (ASABE D384.2 Table 1, from memory)');

export const nutrientAvailabilitySchema = z
  .object({
    nitrogen: rate('Nitrogen availability', 0, 1, 'Share of collected N available to the crop in the year applied (fraction)').default(0.35),
    phosphate: rate('Phosphate availability', 0, 1, 'Share of collected P2O5 valued as fertiliser (fraction)').default(1),
    potash: rate('Potash availability', 0, 1, 'Share of collected K2O valued as fertiliser (fraction)').default(1),
  })
  .describe('Share of each collected nutrient that replaces bought fertiliser (fractions)');

const optionalPerHa = (label: string, what: string) =>
  quantity(label, 'kg/ha/yr', 0, 2000, `${what} (kg per hectare per year)`).nullable().default(null).describe(`${what} (kg per hectare per year); null = not entered`);

export const landSchema = z
  .object({
    hectares: quantity('Land for manure', 'ha', 0, 1e6, 'Hectares the manure is spread on (ha)').nullable().default(null).describe('Hectares the manure is spread on; null = not entered (no cap, no check)'),
    phosphateNeedKgPerHa: optionalPerHa('Phosphate need', 'Crop need for P2O5: manure P2O5 beyond need × hectares saves no fertiliser'),
    potashNeedKgPerHa: optionalPerHa('Potash need', 'Crop need for K2O: manure K2O beyond need × hectares saves no fertiliser'),
    organicNitrogenLimitKgPerHa: optionalPerHa('Organic nitrogen limit', "The farm's own limit on livestock manure N per hectare, e.g. under local nutrient rules"),
  })
  .describe('Land the manure goes on: optional caps on the fertiliser credit and a check on organic N per hectare');
export const existingLoanSchema = z
  .object({
    description: text('Existing loan description', 'What the loan financed or who lent it'),
    paymentPerYear: money('Existing loan payment', 'Principal and interest paid on the loan per year (currency per year)'),
    lastYear: quantity('Existing loan last year', 'years', 1, 40, 'Last operating year with a payment (year 1 = the first year after construction)', { int: true }),
  }, { error: 'Existing loan must be an object with its fields' })
  .describe('An existing loan whose payments end in its last year');
export type ExistingLoan = z.infer<typeof existingLoanSchema>;

export const herdSchema = z
  .object({
    cows: quantity('Herd size', 'cows', 1, 20000, 'Lactating-cow equivalents in the herd today, dry cows included (head)', { int: true }),
    breedSize: choice('Breed size class', ['small', 'large'], "Body size class for stall guidance: 'small' 590-680 kg, 'large' 680-770 kg"),
    yieldKgPerCowDay: quantity('Milk yield', 'kg/cow/day', 0, 80, 'Baseline milk yield averaged over the year, dry periods included (kg per cow per day)'),
    milkPricePerKg: money('Milk price', 'Milk price today (currency per kg)', 0, 100000),
    growth: growthRatesSchema.prefault({}),
    feedCostPerCowDay: z
      .object(
        {
        housed: money('Housed feed cost', 'Feed cost per cow per housed day today (currency per cow-day)', 0, 100000),
        grazing: money('Grazing feed cost', 'Feed cost per cow per grazing day today (currency per cow-day)', 0, 100000),
      }, { error: 'Herd feed cost per cow-day must be an object with its fields' })
      .describe('Baseline feed cost per cow-day; new options copy it'),
    marginalFeedCostPerKgMilk: money('Marginal feed cost', 'Extra feed cost per extra kg of milk today (currency per kg milk)', 0, 100000),
    wagePerHour: money('Wage', 'Labour cost per hour today (currency per hour)', 0, 100000),
    fertiliserPrices: z
      .object({
        nitrogenPerKg: money('Nitrogen price', 'Fertiliser N price today (currency per kg N)', 0, 100000),
        phosphatePerKg: money('Phosphate price', 'Fertiliser P2O5 price today (currency per kg P2O5)', 0, 100000),
        potashPerKg: money('Potash price', 'Fertiliser K2O price today (currency per kg K2O)', 0, 100000),
      }, { error: 'Fertiliser prices must be an object with its fields' })
      .describe('Bought fertiliser prices per kg of nutrient'),
    lyingResponseKgPerHour: quantity('Lying-time milk response', 'kg/cow/day per hour', 0, 5, 'Extra milk per extra hour of lying (kg per cow per day per h); default 1.0, common practice').default(1),
    lyingResponseYear1Fraction: rate('Year-1 ramp fraction', 0, 1, 'Share of the lying-time response reached in year 1 (fraction); full from year 2').default(0.5),
    dryDaysPerCowYear: quantity('Dry days', 'days/cow/yr', 0, 200, 'Days per cow-year a cow is dry; the lying-time response applies to lactating days only (days)').default(60),
    lyingResponseCapHours: quantity('Lying-time cap', 'h/day', 8, 24, 'Lying time beyond which more lying brings no more milk (hours per day)').default(14),
    lyingLossPer10PctOverstocking: quantity(
      'Lying lost to overstocking',
      'h/day per 10 %',
      0,
      5,
      'Lying time lost for each 10 % of cows above one per stall (hours per cow per day)',
    ).default(0.3),
    yearlyPriceIndex: z
      .object({
        milkPrice: yearIndex('Milk price'),
        feed: yearIndex('Feed cost'),
      })
      .prefault({})
      .describe('Multipliers on the grown milk price and feed costs per operating year, e.g. a two-year trough; empty = 1 every year'),
    otherVariableCostPerCowYear: money(
      'Other cow costs',
      'Other costs that come with every cow: vet, breeding, parlour supplies, milk recording, levies (currency per cow per year)',
      0,
      1e6,
    ).default(0),
    milkingHoursPerCowYear: quantity('Milking labour', 'h/cow/yr', 0, 200, 'Milking and cow handling labour (hours per cow per year); 0 = not counted').default(0),
    replacementRate: rate('Replacement rate', 0, 0.6, 'Share of the cows replaced each year at the heifer cost less the cull value (fraction per year); 0 = not counted').default(0),
    firstLactationYieldFactor: rate(
      'First-lactation yield',
      0.4,
      1,
      "Milk of an added cow in the year she joins as a share of the herd's yield (fraction); 1 = as the herd",
    ).default(1),
    replacementHeiferCost: money('Replacement heifer cost', 'Cost of a replacement heifer or bought cow today (currency per head)', 0, 1e6),
    cullCowValue: money('Cull cow value', 'Sale value of a cull cow today (currency per head)', 0, 1e6),
    existingCashForDebtServicePerYear: money('Existing farm cash for debt service', 'Cash the farm has for debt service today, before the new loan (currency per year)', -1e10, 1e10).default(0),
    existingDebtPaymentsPerYear: money('Existing debt payments', 'Principal and interest on existing term debt that runs through the horizon (currency per year)').default(0),
    existingCashHerdMarginPerYear: money(
      'Herd margin in existing cash',
      "The current option's cash for debt service that the existing farm cash figure includes (currency per year)",
      -1e10,
      1e10,
    )
      .nullable()
      .default(null)
      .describe(
        "The herd's cash for debt service under the current option inside the existing farm cash figure, at the prices it was measured (currency per year); null = the current option's year-1 figure as projected. The existing farm's cash in year t = existing cash − this + the current option's cash for debt service in year t, so it moves with milk, feed, wages and inputs",
      ),
    existingLoans: z
      .array(existingLoanSchema, { error: 'Existing loans must be a list of loans' })
      .max(30, 'Existing loans: at most 30')
      .default([])
      .describe('Existing loans that end within the horizon, on top of the existing debt payments'),
    manureExcretion: manureExcretionSchema.prefault({}),
    nutrientAvailability: nutrientAvailabilitySchema.prefault({}),
    land: landSchema.prefault({}),
    manureDensityKgPerM3: quantity('Manure density', 'kg/m3', 500, 2000, 'Density of liquid dairy manure (kg per m3); about 1000, from memory').default(1000),
  }, { error: 'Herd and markets must be an object with its fields' })
  .describe('Farm and herd baseline and markets');

export type Herd = z.infer<typeof herdSchema>;
export type GrowthRates = z.infer<typeof growthRatesSchema>;
export type Land = z.infer<typeof landSchema>;

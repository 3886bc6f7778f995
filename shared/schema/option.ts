import { z } from 'zod';
import { choice, flag, money, quantity, rate, text } from './fields';
import { growthKeys } from './herd';

export const startingPoints = [
  'grazing',
  'steel-freestall',
  'flexible-freestall',
  'mattress-freestall',
  'sand-freestall',
] as const;
export type StartingPoint = (typeof startingPoints)[number];

export const capitalCategories = [
  'building-shell',
  'stall-dividers',
  'beds',
  'alley-floor',
  'manure-removal',
  'manure-storage',
  'water',
  'ventilation-lighting',
  'site-works',
  'fees',
  'equipment',
  'other',
] as const;

/** Tax depreciation classes of a capital item, apart from its economic (useful) life. */
export const taxClasses = ['economic-life', 'straight-line', 'macrs-10-200db', 'macrs-10-150db', 'macrs-20-150db'] as const;
export type TaxClass = (typeof taxClasses)[number];

export const capitalUnits = ['per-stall', 'per-m2', 'per-m3', 'per-item', 'lump-sum'] as const;

/** Longest id of a capital, energy or running-cost line (characters; the documents table stores capital line ids). */
export const LINE_ID_MAX_LENGTH = 60;

export const sourceSchema = z
  .object({
    kind: choice('Source kind', ['reference', 'common-practice', 'assumption', 'user', 'quote'], "Where a figure comes from: 'user' = typed in by the farm, 'quote' = a supplier's quote on the line"),
    note: z.string({ error: 'Source note must be text' }).max(500, 'Source note must be at most 500 characters').describe('Which reference, or why the value was chosen'),
  })
  .describe('Provenance of one figure');
export type Source = z.infer<typeof sourceSchema>;

/** Field path (dot notation inside the option or herd, e.g. "lyingHoursPerDay") → provenance. */
export const sourcesSchema = z
  .record(z.string(), sourceSchema)
  .default({})
  .describe('Provenance per field path, e.g. { "health.lamenessCasesPer100Cows": { kind, note } }');

const capitalItemSchema = z
  .object({
    kind: z.literal('item').describe('An ordinary capital line: quantity × unit cost'),
    id: text('Capital line id', 'Stable id of the line, unique in the scenario (e.g. "sand-freestall.shell")', LINE_ID_MAX_LENGTH),
    description: text('Capital line description', 'What is bought'),
    category: choice('Capital line category', capitalCategories, 'Kind of investment'),
    quantity: quantity('Capital line quantity', '', 0, 1e7, 'How many units')
      .nullable()
      .default(null)
      .describe('How many units (per the unit); null = sized automatically (per-stall: stalls; per-m3 manure storage: sized volume; per-item water: troughs; lump-sum: 1)'),
    unit: choice('Capital line unit', capitalUnits, 'What the unit cost is per'),
    unitCost: money('Capital line unit cost', 'Cost per unit today (currency per unit)', 0, 1e9),
    lifeYears: quantity('Capital line life', 'years', 1, 60, 'Useful life (years)', { int: true }),
    replaceAtEndOfLife: flag('Replace at end of life', 'Bought again at grown cost when its life ends inside the horizon').default(true),
    taxClass: choice('Tax class', taxClasses, "How the line is depreciated for tax: 'economic-life' = the scenario's method over its useful life; 'straight-line' = straight line over its tax life; 'macrs-…' = the US MACRS GDS tables with the half-year convention").default('economic-life'),
    taxLifeYears: quantity('Tax life', 'years', 1, 60, 'Years of straight-line tax depreciation (years)', { int: true })
      .nullable()
      .default(null)
      .describe("Years of straight-line tax depreciation for the 'straight-line' tax class; null = the useful life (years)"),
    documentIds: z.array(z.string()).default([]).describe('Ids of attached quotes or documents'),
  })
  .describe('A capital line');

const contingencyLineSchema = z
  .object({
    kind: z.literal('contingency').describe('A contingency allowance: a share of the other lines'),
    id: text('Contingency line id', 'Stable id of the line, unique in the scenario (e.g. "sand-freestall.contingency")', LINE_ID_MAX_LENGTH),
    description: text('Contingency line description', 'Label of the allowance').default('Contingency'),
    rate: rate('Contingency rate', 0, 0.5, 'Share of the sum of the other lines at year 0 (fraction, 0.1 = 10 %)'),
    lifeYears: quantity('Contingency life', 'years', 1, 60, 'Years over which the allowance is depreciated and valued at salvage (years)', { int: true }).default(25),
  })
  .describe('A contingency allowance on the other capital lines');

export const capitalLineSchema = z
  .discriminatedUnion('kind', [capitalItemSchema, contingencyLineSchema], {
    error: "Capital line kind must be 'item' or 'contingency'",
  })
  .describe('A capital line: an item or a contingency allowance');
export type CapitalLine = z.infer<typeof capitalLineSchema>;
export type CapitalItem = z.infer<typeof capitalItemSchema>;
export type ContingencyLine = z.infer<typeof contingencyLineSchema>;

export const runningCostLineSchema = z
  .object({
    id: text('Running cost id', 'Stable id of the line within its option, by default under the option id', LINE_ID_MAX_LENGTH),
    description: text('Running cost description', 'What the cost is for'),
    amountPerYear: money('Running cost amount', 'Cost per year today; negative = a saving (currency per year)', -1e9, 1e9),
    growth: choice('Running cost growth', growthKeys, 'Which price group the line grows with').default('general'),
  })
  .describe('A yearly running cost not covered by the named lines');
export type RunningCostLine = z.infer<typeof runningCostLineSchema>;

export const energyLineSchema = z
  .object({
    id: text('Energy line id', 'Stable id of the line within its option, by default under the option id', LINE_ID_MAX_LENGTH),
    description: text('Energy line description', 'What uses the energy (scraper, fans, pumps, lights)'),
    kwhPerYear: quantity('Energy use', 'kWh/yr', 0, 1e8, 'Electricity used (kWh per year)'),
    pricePerKwh: money('Electricity price', 'Price today (currency per kWh)', 0, 1000),
  })
  .describe('A named energy line; grows with general inflation');
export type EnergyLine = z.infer<typeof energyLineSchema>;

export const stallDimensionsSchema = z
  .object({
    front: choice('Stall front', ['closed', 'open'], "'closed' = against a wall; 'open' = head-to-head or open lunge").default('closed'),
    widthM: quantity('Stall width', 'm', 0.5, 2, 'Stall width, centre to centre of dividers (m)').optional(),
    lengthM: quantity('Stall length', 'm', 1, 4, 'Stall length from curb to front (m)').optional(),
    neckRailHeightM: quantity('Neck rail height', 'm', 0.5, 2, 'Neck rail height above the bed (m)').optional(),
    neckRailFromCurbM: quantity('Neck rail distance', 'm', 0.5, 3, 'Neck rail distance from the rear curb (m)').optional(),
    brisketLocatorFromCurbM: quantity('Brisket locator distance', 'm', 0.5, 3, 'Brisket locator distance from the rear curb (m)').optional(),
    brisketLocatorHeightM: quantity('Brisket locator height', 'm', 0, 0.5, 'Brisket locator height above the bed (m)').optional(),
  })
  .describe('Stall dimensions in metres, checked against guidance for the breed size');
export type StallDimensions = z.infer<typeof stallDimensionsSchema>;

const per100 = (label: string, what: string) =>
  quantity(label, 'per 100 cows per year', 0, 500, `${what} (cases per 100 cows per year)`);
const perCase = (label: string, what: string) =>
  money(label, `${what} today (currency per case)`, 0, 1e6);

export const healthSchema = z
  .object({
    lamenessCasesPer100Cows: per100('Lameness cases', 'New lameness cases, yearly incidence (not prevalence)'),
    lamenessCostPerCase: perCase('Lameness cost', 'Cost of a lameness case'),
    mastitisCasesPer100Cows: per100('Clinical mastitis cases', 'Clinical mastitis cases'),
    mastitisCostPerCase: perCase('Mastitis cost', 'Cost of a clinical mastitis case'),
    injuriesPer100Cows: per100('Injuries', 'Hock, knee and other housing injuries'),
    injuryCostPerCase: perCase('Injury cost', 'Cost of an injury'),
    extraCullsPer100Cows: quantity('Extra culls', 'per 100 cows per year', 0, 100, 'Culls caused by the housing beyond the herd norm (cows per 100 cows per year)'),
    lamenessCullsPerCase: quantity('Culls per lameness case', 'culls per case', 0, 1, 'Extra culls caused by each lameness case (cows per case)').default(0),
  }, { error: 'Health must be an object with its fields' })
  .describe('Health rates and costs per case; grow with general inflation');

export const herdChangeSchema = z
  .object({
    cowsByYear: z
      .array(quantity('Cows in year', 'cows', 0, 20000, 'Cows in operating year t (head)'))
      .max(40, 'Cows by year must list at most 40 years')
      .nullable()
      .default(null)
      .describe('Herd size per operating year, [0] = year 1; the last value carries on; null = baseline + added cows'),
    addedCows: quantity('Added cows', 'cows', -20000, 20000, 'Cows added from year 1 when cowsByYear is null (head; negative = fewer)', { int: true }).default(0),
    addedCowCost: money('Added cow cost', 'Purchase or rearing cost of each added cow today (currency per head)', 0, 1e6)
      .nullable()
      .default(null)
      .describe('Purchase or rearing cost of each added cow today; null = the herd replacement heifer cost (currency per head)'),
  })
  .describe('How the option changes the herd size');

export const labourSchema = z
  .object({
    scrapingPassesPerDay: quantity('Scraping passes', 'passes/day', 0, 48, 'Manual alley scraping passes per housed day'),
    minutesPerScrapingPass: quantity('Minutes per scraping pass', 'min', 0, 600, 'Labour per scraping pass (minutes)'),
    bedCleaningsPerDay: quantity('Bed cleanings', 'cleanings/day', 0, 12, 'Stall bed cleanings per housed day'),
    secondsPerStallCleaning: quantity('Seconds per stall', 's', 0, 600, 'Labour to clean one stall once (seconds)'),
    beddingTonnesPerHour: quantity('Bedding handled per hour', 't/h', 0.01, 100, 'Bedding tonnes spread per labour hour (t/h)'),
    troughCleaningsPerDay: quantity('Trough cleanings', 'cleanings/day', 0, 12, 'Water trough cleanings per housed day'),
    minutesPerTroughCleaning: quantity('Minutes per trough', 'min', 0, 120, 'Labour to clean one trough once (minutes)'),
    grazingHoursPerGrazingDay: quantity('Grazing work', 'h/day', 0, 48, 'Fetching cows, fencing, moving water per grazing day (hours)'),
  }, { error: 'Labour must be an object with its fields' })
  .describe('Labour drivers');

export const waterSchema = z
  .object({
    troughs: quantity('Water troughs', 'troughs', 0, 1000, 'Water troughs in the housing (count)', { int: true }),
    troughPerimeterM: quantity('Trough perimeter', 'm', 0, 100, 'Drinking perimeter available per trough (m)'),
    fillRateLitresPerMinute: quantity('Trough fill rate', 'L/min', 0, 2000, 'Refill flow per trough (litres per minute)'),
  }, { error: 'Water must be an object with its fields' })
  .describe('Water troughs (count, perimeter, fill rate)');

export const beddingSchema = z
  .object({
    material: choice('Bedding material', ['sand', 'sawdust', 'straw', 'other', 'none'], 'What is used to bed the stalls'),
    kgPerStallDay: quantity('Bedding use', 'kg/stall/day', 0, 100, 'Bedding used per stall per housed day (kg)'),
    pricePerTonne: money('Bedding price', 'Bedding price today (currency per tonne)', 0, 1e6),
    bulkDensityTonnesPerM3: quantity('Bedding bulk density', 't/m3', 0.05, 3, 'Bulk density of the bedding as it reaches the manure store (t per m3)'),
    shareToManureStorage: rate('Bedding to storage', 0, 1, 'Share of used bedding that ends up in the manure storage (fraction)'),
  }, { error: 'Bedding must be an object with its fields' })
  .describe('Bedding material');

export const manureSchema = z
  .object({
    collectionEfficiency: rate('Manure collection efficiency', 0, 1, 'Share of manure excreted on housed days that is collected (fraction)'),
    handlingCostPerM3: money('Manure handling cost', 'Agitation, hauling and spreading today (currency per m3)', 0, 10000),
    sandExtraHandlingCostPerM3: money('Sand extra handling cost', 'Extra cost for sand-laden manure or sand separation today (currency per m3)', 0, 10000),
    storageDays: quantity('Storage period', 'days', 0, 730, 'Days of manure the storage must hold (days)', { int: true }),
    washWaterM3PerCowDay: quantity('Parlour wash water', 'm3/cow/day', 0, 1, 'Parlour and yard wash water to storage (m3 per cow per day)'),
    washWaterDiverted: flag('Wash water diverted', 'True when the parlour wash water goes elsewhere (e.g. a separate low-rate system), not to the manure store').default(false),
    storageNitrogenLoss: rate('Nitrogen lost in storage', 0, 1, 'Share of the collected nitrogen lost from the store before spreading (fraction)').default(0),
    pastureDungCredit: rate('Pasture dung credit', 0, 1, 'Share of the nutrients dropped on pasture on grazing days valued as fertiliser saved (fraction); 0 = not valued').default(0),
    openStorageAreaM2: quantity('Open storage area', 'm2', 0, 1e6, 'Surface area of the storage open to rain (m2)'),
    netRainMPerYear: quantity('Net rain', 'm/yr', 0, 10, 'Rain minus evaporation on the open storage (m per year)'),
    freeboardM: quantity('Freeboard', 'm', 0, 3, 'Freeboard depth kept empty over the open storage area (m)'),
  }, { error: 'Manure must be an object with its fields' })
  .describe('Manure collection, handling and storage');

export const optionSchema = z
  .object({
    id: text('Option id', 'Stable id of the option within its scenario', 60),
    name: text('Option name', 'Name shown to users', 120),
    startingPoint: choice('Starting point', startingPoints, 'The preset the option started from'),
    current: flag('Current option', 'True for the baseline the other options are measured against'),
    kind: choice('Housing kind', ['grazing', 'freestall'], 'Grazing with seasonal housing, or a year-round freestall'),
    divider: choice('Stall divider', ['steel', 'flexible', 'none'], 'Stall divider type'),
    bed: choice('Stall bed', ['mattress', 'mattress-topdressed', 'deep-sand', 'none'], "Bed surface; 'none' = no stalls"),
    manureRemoval: choice('Manure removal', ['tractor-scraper', 'automatic-scraper', 'flush', 'none'], 'Alley manure removal method'),
    housedDaysPerYear: quantity('Housed days', 'days/yr', 0, 366, 'Days per year the cows are housed (days)', { int: true }),
    lyingHoursPerDay: quantity('Lying time', 'h/day', 0, 24, 'Expected lying time (hours per cow per day)'),
    systemYieldAdjustment: quantity('System yield adjustment', 'kg/cow/day', -30, 30, 'Yield change beyond the lying-time effect (kg per cow per day)'),
    stockingRate: quantity('Stocking rate', 'cows per stall', 0.5, 2, 'Cows per stall (1 = one stall per cow)'),
    stallDimensions: stallDimensionsSchema.optional(),
    milkQualityPricePerKg: money(
      'Milk quality premium or penalty',
      "Change in the milk price that this option's bulk-tank somatic cell count earns, + premium, − penalty; grows with the milk price (currency per kg)",
      -100,
      100,
    ).default(0),
    feedCostPerCowDay: z
      .object({
        housed: money('Housed feed cost', 'Feed cost per cow per housed day today (currency per cow-day)', 0, 100000),
        grazing: money('Grazing feed cost', 'Feed cost per cow per grazing day today (currency per cow-day)', 0, 100000),
      }, { error: 'Option feed cost per cow-day must be an object with its fields' })
      .describe('Feed cost per cow-day, housed and grazing'),
    health: healthSchema,
    herdChange: herdChangeSchema.prefault({}),
    labour: labourSchema,
    water: waterSchema,
    bedding: beddingSchema,
    maintenanceRate: rate('Maintenance rate', 0, 0.2, 'Maintenance per year as a share of capital (fraction of capital per year)'),
    insuranceRate: rate('Insurance rate', 0, 0.05, 'Building and equipment insurance per year as a share of capital and existing housing (fraction per year)').default(0),
    existingHousingValue: money('Existing housing value', "Replacement value today of housing the option keeps using, e.g. the current option's old cubicle house: it carries the maintenance and insurance rates (currency)", 0, 1e9).default(0),
    energyLines: z.array(energyLineSchema).max(50, 'Energy lines: at most 50').default([]).describe('Named electricity uses (kWh per year × price)'),
    manure: manureSchema,
    capitalLines: z.array(capitalLineSchema).max(100, 'Capital lines: at most 100').default([]).describe('Capital lines bought at year 0 (currency, today\'s money)'),
    runningCosts: z.array(runningCostLineSchema).max(100, 'Running costs: at most 100').default([]).describe('Other yearly running costs (currency per year)'),
    sources: sourcesSchema,
  }, { error: 'Option must be an object with its fields' })
  .superRefine((option, ctx) => {
    const ids = new Set<string>();
    option.capitalLines.forEach((line, index) => {
      if (ids.has(line.id)) {
        ctx.addIssue({ code: 'custom', path: ['capitalLines', index, 'id'], message: `Capital line id "${line.id}" is used twice in option "${option.name}"` });
      }
      ids.add(line.id);
      if (line.kind === 'item' && line.quantity === null && !autoQuantityAllowed(line.unit, line.category)) {
        ctx.addIssue({
          code: 'custom',
          path: ['capitalLines', index, 'quantity'],
          message: `Capital line "${line.description}" needs a quantity: only per-stall, lump-sum, per-m3 manure-storage and per-item water lines are sized automatically`,
        });
      }
    });
  })
  .describe('One candidate housing system');

/** Which capital lines may leave quantity null for the sizing helpers to fill. */
export function autoQuantityAllowed(unit: CapitalItem['unit'], category: CapitalItem['category']): boolean {
  return (
    unit === 'per-stall' ||
    unit === 'lump-sum' ||
    (unit === 'per-m3' && category === 'manure-storage') ||
    (unit === 'per-item' && category === 'water')
  );
}

export type Option = z.infer<typeof optionSchema>;

/**
 * The labels the forms give each field, by its path in the scenario or baseline document, so a
 * message from the server ("scenario.herd.cows: …") names the field as the screen does
 * ("Cows in the herd: …"). `tests/unit/client/messages.test.ts` keeps them in step with the forms.
 */
import type { Scenario } from '@shared/schema';

/** Herd fields (HerdForm.vue), inside `herd.` of a scenario and of the baseline. */
export const HERD_LABELS: Readonly<Record<string, string>> = {
  cows: 'Cows',
  breedSize: 'Breed size class',
  yieldKgPerCowDay: 'Milk yield',
  replacementHeiferCost: 'Replacement heifer',
  cullCowValue: 'Cull cow value',
  milkPricePerKg: 'Milk price',
  'feedCostPerCowDay.housed': 'Feed, housed day',
  'feedCostPerCowDay.grazing': 'Feed, grazing day',
  marginalFeedCostPerKgMilk: 'Feed per extra milk',
  wagePerHour: 'Wage',
  otherVariableCostPerCowYear: 'Other cow costs',
  milkingHoursPerCowYear: 'Milking labour',
  replacementRate: 'Cows replaced each year',
  firstLactationYieldFactor: 'Milk of an added cow, first year',
  'fertiliserPrices.nitrogenPerKg': 'Nitrogen (N)',
  'fertiliserPrices.phosphatePerKg': 'Phosphate (P₂O₅)',
  'fertiliserPrices.potashPerKg': 'Potash (K₂O)',
  'growth.general': 'General inflation',
  // The growth section labels these by price group under a "Growth" heading.
  'growth.milkPrice': 'Milk price growth',
  'growth.feed': 'Feed growth',
  'growth.wages': 'Wages growth',
  'growth.bedding': 'Bedding growth',
  'growth.fertiliser': 'Fertiliser growth',
  existingCashForDebtServicePerYear: 'Cash for debt service',
  existingDebtPaymentsPerYear: 'Existing debt payments',
  // On the finance form, beside the debt-service figures.
  existingCashHerdMarginPerYear: 'Herd margin inside the existing cash',
  lyingResponseKgPerHour: 'Milk per extra hour lying',
  lyingResponseYear1Fraction: 'Reached in year 1',
  dryDaysPerCowYear: 'Dry days per cow',
  lyingResponseCapHours: 'Lying time that still pays',
  lyingLossPer10PctOverstocking: 'Lying lost per 10 % overstocking',
  'manureExcretion.massKgPerCowDay': 'Manure',
  'manureExcretion.nitrogenKgPerCowDay': 'Nitrogen',
  'manureExcretion.phosphorusKgPerCowDay': 'Phosphorus',
  'manureExcretion.potassiumKgPerCowDay': 'Potassium',
  manureDensityKgPerM3: 'Manure density',
  'land.hectares': 'Hectares',
  'land.phosphateNeedKgPerHa': 'Crop need, P₂O₅',
  'land.potashNeedKgPerHa': 'Crop need, K₂O',
  'land.organicNitrogenLimitKgPerHa': 'Organic N limit',
  'nutrientAvailability.nitrogen': 'Nitrogen',
  'nutrientAvailability.phosphate': 'Phosphate',
  'nutrientAvailability.potash': 'Potash',
};

/** Scenario-wide fields (FinanceForm.vue). */
export const SCENARIO_LABELS: Readonly<Record<string, string>> = {
  name: 'Scenario name',
  horizonYears: 'Horizon',
  'finance.equity': 'Equity',
  'finance.grants': 'Grants',
  'finance.loanAmount': 'Loan amount',
  'finance.interestRate': 'Interest rate',
  'finance.termYears': 'Term',
  'finance.paymentsPerYear': 'Payments per year',
  'finance.interestOnlyMonths': 'Interest-only period',
  'finance.discountRate': 'Discount rate',
  'finance.coverageThreshold': "Lender's coverage threshold",
  'finance.taxRate': 'Income tax rate',
  'finance.depreciation': 'Depreciation',
  'finance.decliningBalanceFactor': 'Declining-balance factor',
};

/** Option fields (OptionDetailsForm.vue, SizingHelpers.vue, RunningCostsForm.vue), inside `options.N.`. */
export const OPTION_LABELS: Readonly<Record<string, string>> = {
  name: 'Option name',
  kind: 'Housing',
  divider: 'Stall divider',
  bed: 'Stall bed',
  manureRemoval: 'Manure removal',
  housedDaysPerYear: 'Housed days',
  lyingHoursPerDay: 'Lying time',
  systemYieldAdjustment: 'Other yield change',
  milkQualityPricePerKg: 'Milk quality premium',
  'feedCostPerCowDay.housed': 'Feed, housed day',
  'feedCostPerCowDay.grazing': 'Feed, grazing day',
  'herdChange.addedCows': 'Added cows from year 1',
  'herdChange.addedCowCost': 'Cost per added cow',
  stockingRate: 'Stocking rate',
  'stallDimensions.front': 'Stall front',
  'stallDimensions.widthM': 'Stall width',
  'stallDimensions.lengthM': 'Stall length',
  'stallDimensions.neckRailHeightM': 'Neck rail height',
  'stallDimensions.neckRailFromCurbM': 'Neck rail distance',
  'water.troughs': 'Troughs',
  'water.troughPerimeterM': 'Drinking edge per trough',
  'water.fillRateLitresPerMinute': 'Fill rate per trough',
  'manure.storageDays': 'Storage period',
  'manure.washWaterM3PerCowDay': 'Parlour wash water',
  'manure.openStorageAreaM2': 'Open storage area',
  'manure.netRainMPerYear': 'Net rain per year',
  'manure.freeboardM': 'Freeboard',
  'labour.scrapingPassesPerDay': 'Passes per day',
  'labour.minutesPerScrapingPass': 'Minutes per pass',
  'labour.bedCleaningsPerDay': 'Cleanings per day',
  'labour.secondsPerStallCleaning': 'Seconds per stall',
  'labour.beddingTonnesPerHour': 'Bedding spread per hour',
  'labour.troughCleaningsPerDay': 'Trough cleanings per day',
  'labour.minutesPerTroughCleaning': 'Minutes per trough',
  'labour.grazingHoursPerGrazingDay': 'Grazing work per day',
  'bedding.material': 'Material',
  'bedding.kgPerStallDay': 'Use per stall',
  'bedding.pricePerTonne': 'Price',
  'bedding.bulkDensityTonnesPerM3': 'Bulk density',
  'bedding.shareToManureStorage': 'Ends up in storage',
  'health.lamenessCasesPer100Cows': 'New lameness cases per 100 cows',
  'health.lamenessCostPerCase': 'Cost per lameness case',
  'health.mastitisCasesPer100Cows': 'Clinical mastitis per 100 cows',
  'health.mastitisCostPerCase': 'Cost per mastitis case',
  'health.injuriesPer100Cows': 'Injuries per 100 cows',
  'health.injuryCostPerCase': 'Cost per injury',
  'health.lamenessCullsPerCase': 'Culls per lameness case',
  'health.extraCullsPer100Cows': 'Extra culls per 100 cows',
  maintenanceRate: 'Maintenance',
  insuranceRate: 'Insurance',
  existingHousingValue: 'Existing housing kept',
  'manure.collectionEfficiency': 'Manure collected',
  'manure.handlingCostPerM3': 'Handling cost',
  'manure.sandExtraHandlingCostPerM3': 'Extra for sand-laden manure',
  'manure.storageNitrogenLoss': 'Nitrogen lost in storage',
  'manure.pastureDungCredit': 'Pasture dung valued',
};

/** Fields of one line of an option's lists (CapitalLinesTable.vue, RunningCostsForm.vue). */
export const LINE_LABELS: Readonly<Record<string, Readonly<Record<string, string>>>> = {
  capitalLines: { description: 'Description', quantity: 'Quantity', unitCost: 'Unit cost', rate: 'Contingency rate', lifeYears: 'Life', taxLifeYears: 'Tax life' },
  energyLines: { description: 'Description', kwhPerYear: 'Electricity', pricePerKwh: 'Price' },
  runningCosts: { description: 'Description', amountPerYear: 'Amount' },
};

const LIST_NAMES: Readonly<Record<string, string>> = { capitalLines: 'capital line', energyLines: 'energy line', runningCosts: 'running cost' };

/** "unitCost" → "unit cost": the last resort for a field no form labels. */
function words(segment: string): string {
  const spaced = segment.replace(/([a-z])([A-Z0-9])/g, '$1 $2').toLowerCase();
  return spaced.charAt(0).toUpperCase() + spaced.slice(1);
}

/**
 * The screen's name for a field path of the scenario or baseline document, with the option and
 * line it sits on: "herd.cows" → "Cows in the herd"; "options.1.capitalLines.0.unitCost" →
 * "Unit cost of “Shell” in “Sand freestall”". Request-body prefixes ("scenario.") are dropped.
 */
export function fieldLabel(path: string, scenario?: Pick<Scenario, 'options'> | null): string {
  const clean = path.replace(/^(scenario|baseline)\./, '');
  const [head, ...rest] = clean.split('.');
  if (head === 'herd') return `${HERD_LABELS[rest.join('.')] ?? words(rest.at(-1) ?? 'herd')} in the herd`;
  if (head === 'options' && rest.length > 0) {
    const index = Number(rest[0]);
    const option = Number.isInteger(index) ? scenario?.options[index] : scenario?.options.find((o) => o.id === rest[0]);
    const optionName = option ? `“${option.name}”` : Number.isInteger(index) ? `option ${index + 1}` : 'an option';
    const inner = rest.slice(1);
    const list = inner[0] ?? '';
    if (LINE_LABELS[list] && inner.length >= 3) {
      const lineIndex = Number(inner[1]);
      const lines = (option as Record<string, unknown> | undefined)?.[list] as { id?: string; description?: string }[] | undefined;
      const line = Number.isInteger(lineIndex) ? lines?.[lineIndex] : lines?.find((l) => l.id === inner[1]);
      const lineName = line?.description ? `“${line.description}”` : `${LIST_NAMES[list]} ${Number.isInteger(lineIndex) ? lineIndex + 1 : ''}`.trim();
      const field = inner.slice(2).join('.');
      return `${LINE_LABELS[list]?.[field] ?? words(inner.at(-1) ?? '')} of ${lineName} in ${optionName}`;
    }
    const key = inner.join('.');
    return `${OPTION_LABELS[key] ?? words(inner.at(-1) ?? 'option')} in ${optionName}`;
  }
  return SCENARIO_LABELS[clean] ?? HERD_LABELS[clean] ?? words(clean.split('.').at(-1) ?? clean);
}

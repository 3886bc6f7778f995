import { LINE_ID_MAX_LENGTH, type CapitalLine, type Herd, type Option, type RunningCostLine, type Source, type StartingPoint } from './schema';
import { beddingTonnesPerYear, beddingToStorageM3PerYear, manureStorageVolumeM3, MIN_TROUGH_PERIMETER_PER_COW_M, type Range, STALL_GUIDANCE, stallsFor } from './engine';

// Sources of the defaults. 'reference' names a docs/references.md source, 'common-practice' a trade
// rule of thumb, 'assumption' an invented planning figure the user should replace.
const ref = (note: string): Source => ({ kind: 'reference', note });
const practice = (note: string): Source => ({ kind: 'common-practice', note });
const assumed = (note: string): Source => ({ kind: 'assumption', note });
const fromHerd = (note: string): Source => ({ kind: 'user', note });

const TUCKER_WEARY = 'Tucker & Weary, J. Dairy Sci. 87:2889 (2004)';
const COOK = 'Cook et al., J. Dairy Sci. 87:2912 (2004)';
const SAND_GUIDANCE = 'university guidance quoted in the dairy press: at least 50 lb (23 kg) sand per stall per day';
/** New lameness cases per 100 cows a year on mattresses, and on sand at Cook's sand-to-mattress ratio (11.1 ÷ 24.0). */
const MATTRESS_LAMENESS_INCIDENCE = 35;
const SAND_LAMENESS_INCIDENCE = Math.round(((MATTRESS_LAMENESS_INCIDENCE * 11.1) / 24) * 10) / 10;
const LAMENESS_CULLS_PER_CASE = 0.05;
const LAMENESS_MATTRESS_SOURCE = assumed(`new cases a year (incidence); ${COOK} measured 24.0 % of cows lame in mattress herds on the day (prevalence, read), and a year sees more cases than are lame on one day`);
/** Building and equipment insurance as a share of capital per year. */
const INSURANCE_RATE = 0.003;
/** Share of the collected N lost from a slurry store before spreading. */
const STORAGE_N_LOSS = 0.25;
const PENN_STATE_WATER = 'Penn State Extension, watering system design: ≥ 3 in (7.6 cm) per cow, ≥ 10 US gal/min';

interface Defaults {
  kind: Option['kind'];
  divider: Option['divider'];
  bed: Option['bed'];
  manureRemoval: Option['manureRemoval'];
  housedDaysPerYear: number;
  lyingHoursPerDay: number;
  health: Option['health'];
  labour: Option['labour'];
  bedding: Option['bedding'];
  manure: Omit<Option['manure'], 'openStorageAreaM2'>;
  maintenanceRate: number;
  sources: Record<string, Source>;
}

/** Who-knows-what figures shared by every starting point. */
const COMMON_SOURCES: Record<string, Source> = {
  systemYieldAdjustment: assumed('0: the baseline yield already reflects the current system; enter any feeding effect here'),
  stockingRate: practice('one cow per stall is the welfare target; above about 1.2 lying time falls'),
  'feedCostPerCowDay.housed': fromHerd('copied from the herd baseline'),
  'feedCostPerCowDay.grazing': fromHerd('copied from the herd baseline'),
  'health.mastitisCostPerCase': assumed('planning figure per clinical case'),
  'health.lamenessCostPerCase': assumed('planning figure per case (treatment, milk loss)'),
  'health.injuryCostPerCase': assumed('planning figure per hock, knee or other injury'),
  'health.extraCullsPer100Cows': assumed('no culls beyond the herd norm'),
  'health.lamenessCullsPerCase': assumed('one lameness case in twenty ends in an extra cull'),
  'labour.minutesPerScrapingPass': assumed('planning figure for one tractor pass of the alleys'),
  'labour.bedCleaningsPerDay': practice('beds cleaned and levelled once or twice a day'),
  'labour.secondsPerStallCleaning': assumed('planning figure per stall'),
  'labour.beddingTonnesPerHour': assumed('planning figure with a loader or bedding spreader'),
  'labour.troughCleaningsPerDay': practice('troughs are emptied and cleaned daily or more often'),
  'labour.minutesPerTroughCleaning': assumed('planning figure per trough'),
  'water.troughs': ref(`${PENN_STATE_WATER}; at least 2 waterers per group`),
  'water.troughPerimeterM': assumed('3 m of drinking edge per trough'),
  'water.fillRateLitresPerMinute': ref(PENN_STATE_WATER),
  'manure.collectionEfficiency': assumed('share of housed-day manure reaching the store'),
  'manure.handlingCostPerM3': assumed('agitation, hauling and spreading by contractor'),
  'manure.storageDays': assumed('storage period; follow local rules'),
  'manure.washWaterM3PerCowDay': practice('parlour wash water usually joins the storage on every milking day, grazing or housed; 50 L per cow per day is a planning figure'),
  'manure.washWaterDiverted': practice('parlour wash water usually joins the storage'),
  'manure.storageNitrogenLoss': assumed('a quarter of the N lost from a slurry store before spreading; stored liquid manure commonly loses 20–40 % (from memory); replace with the local figure'),
  'manure.pastureDungCredit': assumed('dung dropped on pasture is not valued'),
  'manure.openStorageAreaM2': assumed('open store 3 m deep, sized from the storage volume'),
  'manure.netRainMPerYear': assumed('rain minus evaporation; replace with the local figure'),
  'manure.freeboardM': assumed('freeboard kept empty'),
  maintenanceRate: assumed('1 % of capital a year'),
  insuranceRate: assumed('0.3 % of capital a year for buildings and equipment insurance, invented'),
  existingHousingValue: assumed('no existing housing carried'),
  milkQualityPricePerKg: assumed("no somatic-cell premium or penalty; enter the milk buyer's scale"),
  'herdChange.addedCows': assumed('no cows added'),
  'herdChange.cowsByYear': assumed('no herd entered by year: the same herd every year, with any added cows'),
  'herdChange.addedCowCost': fromHerd("empty: the herd's replacement heifer cost"),
};

/** A bare-mattress freestall with rigid steel dividers; the flexible-divider one differs only in injuries. */
const STEEL_FREESTALL: Defaults = {
  kind: 'freestall',
  divider: 'steel',
  bed: 'mattress',
  manureRemoval: 'tractor-scraper',
  housedDaysPerYear: 365,
  lyingHoursPerDay: 12.3,
  health: { lamenessCasesPer100Cows: MATTRESS_LAMENESS_INCIDENCE, lamenessCostPerCase: 300, mastitisCasesPer100Cows: 30, mastitisCostPerCase: 250, injuriesPer100Cows: 10, injuryCostPerCase: 150, extraCullsPer100Cows: 0, lamenessCullsPerCase: LAMENESS_CULLS_PER_CASE },
  labour: { scrapingPassesPerDay: 2, minutesPerScrapingPass: 15, bedCleaningsPerDay: 2, secondsPerStallCleaning: 10, beddingTonnesPerHour: 1, troughCleaningsPerDay: 1, minutesPerTroughCleaning: 5, grazingHoursPerGrazingDay: 0 },
  bedding: { material: 'none', kgPerStallDay: 0, pricePerTonne: 0, bulkDensityTonnesPerM3: 0.25, shareToManureStorage: 0 },
  manure: { collectionEfficiency: 0.95, handlingCostPerM3: 2.5, sandExtraHandlingCostPerM3: 0, storageDays: 150, washWaterM3PerCowDay: 0.05, washWaterDiverted: false, storageNitrogenLoss: STORAGE_N_LOSS, pastureDungCredit: 0, netRainMPerYear: 0.4, freeboardM: 0.3 },
  maintenanceRate: 0.01,
  sources: {
    housedDaysPerYear: practice('a freestall herd is housed all year'),
    lyingHoursPerDay: ref(`${TUCKER_WEARY}: 12.3 h/day on bare mattresses`),
    'health.lamenessCasesPer100Cows': LAMENESS_MATTRESS_SOURCE,
    'health.mastitisCasesPer100Cows': assumed('planning figure for a bare mattress'),
    'health.injuriesPer100Cows': practice('rigid steel dividers give more injuries than flexible ones; the figure is an assumption'),
    'labour.scrapingPassesPerDay': practice('tractor or skid-steer scraping two to three times a day'),
    'labour.grazingHoursPerGrazingDay': practice('no grazing days'),
    'bedding.kgPerStallDay': assumed('bare mattress without top-dressing'),
    'bedding.pricePerTonne': assumed('no bedding bought'),
    'bedding.bulkDensityTonnesPerM3': assumed('loose sawdust if any is added'),
    'bedding.shareToManureStorage': assumed('no bedding'),
    'manure.sandExtraHandlingCostPerM3': assumed('no sand'),
  },
};

const STARTING_POINTS: Record<StartingPoint, Defaults> = {
  grazing: {
    kind: 'grazing',
    divider: 'steel',
    bed: 'mattress-topdressed',
    manureRemoval: 'tractor-scraper',
    housedDaysPerYear: 150,
    lyingHoursPerDay: 11,
    health: { lamenessCasesPer100Cows: 20, lamenessCostPerCase: 300, mastitisCasesPer100Cows: 25, mastitisCostPerCase: 250, injuriesPer100Cows: 5, injuryCostPerCase: 150, extraCullsPer100Cows: 0, lamenessCullsPerCase: LAMENESS_CULLS_PER_CASE },
    labour: { scrapingPassesPerDay: 2, minutesPerScrapingPass: 15, bedCleaningsPerDay: 2, secondsPerStallCleaning: 10, beddingTonnesPerHour: 1, troughCleaningsPerDay: 1, minutesPerTroughCleaning: 5, grazingHoursPerGrazingDay: 2.5 },
    bedding: { material: 'sawdust', kgPerStallDay: 1, pricePerTonne: 60, bulkDensityTonnesPerM3: 0.25, shareToManureStorage: 1 },
    manure: { collectionEfficiency: 0.9, handlingCostPerM3: 2.5, sandExtraHandlingCostPerM3: 0, storageDays: 150, washWaterM3PerCowDay: 0.05, washWaterDiverted: false, storageNitrogenLoss: STORAGE_N_LOSS, pastureDungCredit: 0, netRainMPerYear: 0.4, freeboardM: 0.3 },
    maintenanceRate: 0.01,
    sources: {
      housedDaysPerYear: assumed('winter housing period of a pasture-based herd; set to the farm\u2019s own'),
      lyingHoursPerDay: assumed('pasture-based herd over the year, below the 12–14 h housed budget (Grant, dairy cattle extension, Table 1)'),
      'health.lamenessCasesPer100Cows': assumed('new cases a year; pasture-based herds are usually less lame than housed herds'),
      'health.mastitisCasesPer100Cows': assumed('planning figure'),
      'health.injuriesPer100Cows': assumed('planning figure'),
      'labour.scrapingPassesPerDay': practice('tractor or skid-steer scraping two to three times a day'),
      'labour.grazingHoursPerGrazingDay': assumed('fetching cows, fencing, moving water'),
      'bedding.kgPerStallDay': practice('mattresses need a light organic top-dressing'),
      'bedding.pricePerTonne': assumed('sawdust delivered'),
      'bedding.bulkDensityTonnesPerM3': assumed('loose sawdust'),
      'bedding.shareToManureStorage': assumed('used top-dressing is scraped into the store'),
      'manure.sandExtraHandlingCostPerM3': assumed('no sand'),
    },
  },
  'steel-freestall': STEEL_FREESTALL,
  'flexible-freestall': {
    ...STEEL_FREESTALL,
    divider: 'flexible',
    health: { ...STEEL_FREESTALL.health, injuriesPer100Cows: 5 },
    sources: {
      ...STEEL_FREESTALL.sources,
      'health.injuriesPer100Cows': practice('flexible dividers give way when a cow hits them, so fewer injuries than steel; the figure is an assumption'),
    },
  },
  'mattress-freestall': {
    kind: 'freestall',
    divider: 'flexible',
    bed: 'mattress-topdressed',
    manureRemoval: 'automatic-scraper',
    housedDaysPerYear: 365,
    lyingHoursPerDay: 12.8,
    health: { lamenessCasesPer100Cows: MATTRESS_LAMENESS_INCIDENCE, lamenessCostPerCase: 300, mastitisCasesPer100Cows: 28, mastitisCostPerCase: 250, injuriesPer100Cows: 3, injuryCostPerCase: 150, extraCullsPer100Cows: 0, lamenessCullsPerCase: LAMENESS_CULLS_PER_CASE },
    labour: { scrapingPassesPerDay: 0, minutesPerScrapingPass: 0, bedCleaningsPerDay: 2, secondsPerStallCleaning: 10, beddingTonnesPerHour: 1, troughCleaningsPerDay: 1, minutesPerTroughCleaning: 5, grazingHoursPerGrazingDay: 0 },
    bedding: { material: 'sawdust', kgPerStallDay: 2.5, pricePerTonne: 60, bulkDensityTonnesPerM3: 0.25, shareToManureStorage: 1 },
    manure: { collectionEfficiency: 0.95, handlingCostPerM3: 2.5, sandExtraHandlingCostPerM3: 0, storageDays: 150, washWaterM3PerCowDay: 0.05, washWaterDiverted: false, storageNitrogenLoss: STORAGE_N_LOSS, pastureDungCredit: 0, netRainMPerYear: 0.4, freeboardM: 0.3 },
    maintenanceRate: 0.012,
    sources: {
      housedDaysPerYear: practice('a freestall herd is housed all year'),
      lyingHoursPerDay: assumed(`${TUCKER_WEARY} measured 12.3 h/day on bare mattresses and 13.8 h with 7.5 kg sawdust (read); 12.8 h for the 2.5 kg used here is a straight-line interpolation`),
      'health.lamenessCasesPer100Cows': LAMENESS_MATTRESS_SOURCE,
      'health.mastitisCasesPer100Cows': assumed('planning figure for a top-dressed mattress'),
      'health.injuriesPer100Cows': practice('top-dressing limits hock and knee abrasions; flexible dividers give fewer injuries; the figure is an assumption'),
      'labour.scrapingPassesPerDay': practice('an automatic alley scraper cycles every one to three hours with about no labour'),
      'labour.grazingHoursPerGrazingDay': practice('no grazing days'),
      'bedding.kgPerStallDay': practice('a light organic top-dressing on mattresses; 2.5 kg (one of the amounts Tucker & Weary tested) is an assumption'),
      'bedding.pricePerTonne': assumed('sawdust delivered'),
      'bedding.bulkDensityTonnesPerM3': assumed('loose sawdust'),
      'bedding.shareToManureStorage': assumed('used top-dressing is scraped into the store'),
      'manure.sandExtraHandlingCostPerM3': assumed('no sand'),
      maintenanceRate: assumed('1.2 % of capital a year with an automatic scraper'),
    },
  },
  'sand-freestall': {
    kind: 'freestall',
    divider: 'flexible',
    bed: 'deep-sand',
    manureRemoval: 'tractor-scraper',
    housedDaysPerYear: 365,
    lyingHoursPerDay: 13.8,
    health: { lamenessCasesPer100Cows: SAND_LAMENESS_INCIDENCE, lamenessCostPerCase: 300, mastitisCasesPer100Cows: 22, mastitisCostPerCase: 250, injuriesPer100Cows: 3, injuryCostPerCase: 150, extraCullsPer100Cows: 0, lamenessCullsPerCase: LAMENESS_CULLS_PER_CASE },
    labour: { scrapingPassesPerDay: 3, minutesPerScrapingPass: 15, bedCleaningsPerDay: 2, secondsPerStallCleaning: 15, beddingTonnesPerHour: 4, troughCleaningsPerDay: 1, minutesPerTroughCleaning: 5, grazingHoursPerGrazingDay: 0 },
    bedding: { material: 'sand', kgPerStallDay: 23, pricePerTonne: 15, bulkDensityTonnesPerM3: 1.6, shareToManureStorage: 0.9 },
    manure: { collectionEfficiency: 0.95, handlingCostPerM3: 2.5, sandExtraHandlingCostPerM3: 1.5, storageDays: 150, washWaterM3PerCowDay: 0.05, washWaterDiverted: false, storageNitrogenLoss: STORAGE_N_LOSS, pastureDungCredit: 0, netRainMPerYear: 0.4, freeboardM: 0.3 },
    maintenanceRate: 0.015,
    sources: {
      housedDaysPerYear: practice('a freestall herd is housed all year'),
      lyingHoursPerDay: practice(`deep sand is the surface cows choose most, so at least the best mattress figure: ${TUCKER_WEARY}, 13.8 h/day on mattresses with 7.5 kg sawdust (read); the sand figure is an assumption`),
      'health.lamenessCasesPer100Cows': assumed(`new cases a year; ${COOK} measured 11.1 % of cows lame in sand herds against 24.0 % in mattress herds (prevalence, read), so sand is set at the same ratio of the mattress incidence`),
      'health.mastitisCasesPer100Cows': practice('deep sand keeps bacteria low; the figure is an assumption'),
      'health.injuriesPer100Cows': assumed('planning figure for sand with flexible dividers'),
      'labour.scrapingPassesPerDay': practice('tractor or skid-steer scraping two to three times a day'),
      'labour.secondsPerStallCleaning': assumed('raking and levelling sand takes longer than a mattress'),
      'labour.beddingTonnesPerHour': assumed('sand topped up with a loader about twice a week'),
      'labour.grazingHoursPerGrazingDay': practice('no grazing days'),
      'bedding.kgPerStallDay': ref(SAND_GUIDANCE),
      'bedding.pricePerTonne': assumed('washed sand delivered'),
      'bedding.bulkDensityTonnesPerM3': assumed('damp sand'),
      'bedding.shareToManureStorage': practice('most sand leaves the beds with the manure and ends in the store'),
      'manure.sandExtraHandlingCostPerM3': practice('sand-laden manure costs more to handle (wear, settling); the figure is an assumption'),
      maintenanceRate: practice('sand wears equipment; 1.5 % of capital a year is an assumption'),
    },
  },
};

/** The five starting points, in the order the product lists them. */
export const STARTING_POINT_ORDER: readonly StartingPoint[] = ['grazing', 'steel-freestall', 'flexible-freestall', 'mattress-freestall', 'sand-freestall'];

/** Display names of the starting points. */
export const STARTING_POINT_NAMES: Record<StartingPoint, string> = {
  grazing: 'Grazing with seasonal housing',
  'steel-freestall': 'Freestall, steel dividers',
  'flexible-freestall': 'Freestall, flexible dividers',
  'mattress-freestall': 'Mattress-bedded freestall',
  'sand-freestall': 'Sand-bedded freestall',
};

// Storage depth used to turn a sized volume into an open surface area.
const STORE_DEPTH_M = 3;
// Building floor areas per stall: resting area, alleys and feed lane (planning figures).
const BARN_M2_PER_STALL = 8;
const ALLEY_M2_PER_STALL = 3.5;
// Stalls one automatic scraper serves (one alley pair of a typical pen).
const STALLS_PER_AUTOMATIC_SCRAPER = 60;
// Drinking edge per trough.
const TROUGH_PERIMETER_M = 3;

const middle = (range: Range): number => Math.round(((range.min + range.max) / 2) * 100) / 100;

/** Closed-front stall dimensions (m) in the middle of the guidance for the herd's breed size, to the cm. */
function guidanceStall(breedSize: Herd['breedSize']): NonNullable<Option['stallDimensions']> {
  const guidance = STALL_GUIDANCE[breedSize];
  return {
    front: 'closed',
    widthM: middle(guidance.widthM),
    lengthM: middle(guidance.lengthClosedFrontM),
    neckRailHeightM: middle(guidance.neckRailHeightM),
    neckRailFromCurbM: middle(guidance.neckRailFromCurbM),
    brisketLocatorFromCurbM: middle(guidance.brisketLocatorFromCurbM),
    brisketLocatorHeightM: middle(guidance.brisketLocatorHeightM),
  };
}

interface CreateOptionSettings {
  id: string;
  name?: string;
  /** The current option is the farm as it is: its housing is sunk cost, so it starts without capital lines. */
  current?: boolean;
}

function item(
  id: string,
  description: string,
  category: Extract<CapitalLine, { kind: 'item' }>['category'],
  unit: Extract<CapitalLine, { kind: 'item' }>['unit'],
  quantity: number | null,
  unitCost: number,
  lifeYears: number,
  replaceAtEndOfLife = true,
): CapitalLine {
  return { kind: 'item', id, description, category, unit, quantity, unitCost, lifeYears, replaceAtEndOfLife, taxClass: 'economic-life', taxLifeYears: null, documentIds: [] };
}

function capitalLinesFor(startingPoint: StartingPoint, defaults: Defaults, stalls: number): { lines: CapitalLine[]; sources: Record<string, Source> } {
  const lines: CapitalLine[] = [];
  const sources: Record<string, Source> = {};
  const add = (line: CapitalLine, note: string): void => {
    lines.push(line);
    sources[`capitalLines.${line.id}.${line.kind === 'item' ? 'unitCost' : 'rate'}`] = assumed(note);
    // The line's other figures (quantity, life, tax class) are planning figures too; the note names
    // no number, so it stays true when the farm edits one.
    const quantity = line.kind === 'item' && line.quantity === null ? 'quantity sized by Byrecast; ' : '';
    sources[`capitalLines.${line.id}`] = assumed(`${quantity}economic life and tax life are invented planning figures`);
  };
  if (startingPoint === 'grazing') {
    add(item('cubicle-refit', 'Cubicle house refit for winter housing', 'building-shell', 'per-stall', null, 900, 25, false), 'invented planning cost per stall');
    add(item('paddock-water', 'Paddock water system', 'water', 'lump-sum', null, 15000, 20), 'invented planning cost');
    add(item('laneways', 'Cow laneways', 'site-works', 'lump-sum', null, 20000, 20), 'invented planning cost');
  } else {
    add(item('shell', 'Building shell', 'building-shell', 'per-m2', stalls * BARN_M2_PER_STALL, 280, 30, false), `invented cost per m² of a steel-frame farm building, ${BARN_M2_PER_STALL} m² per stall`);
    add(
      item('dividers', defaults.divider === 'flexible' ? 'Flexible stall dividers' : 'Steel stall dividers', 'stall-dividers', 'per-stall', null, defaults.divider === 'flexible' ? 160 : 120, defaults.divider === 'flexible' ? 12 : 20),
      'invented cost per stall',
    );
    if (defaults.bed === 'deep-sand') add(item('beds', 'Sand bed curbs and initial fill', 'beds', 'per-stall', null, 90, 30, false), 'invented cost per stall');
    else add(item('beds', 'Stall mattresses', 'beds', 'per-stall', null, 220, 10), 'invented cost per stall');
    add(item('alley-floor', 'Grooved concrete alleys', 'alley-floor', 'per-m2', stalls * ALLEY_M2_PER_STALL, 55, 30, false), `invented cost per m², ${ALLEY_M2_PER_STALL} m² per stall`);
    if (defaults.manureRemoval === 'automatic-scraper') {
      add(item('scrapers', 'Automatic alley scrapers', 'manure-removal', 'per-item', Math.max(1, Math.ceil(stalls / STALLS_PER_AUTOMATIC_SCRAPER)), 14000, 15), 'invented cost per scraper');
    } else {
      add(item('scraper-blade', 'Tractor scraper blade', 'manure-removal', 'lump-sum', null, 4000, 10), 'invented cost');
    }
    add(item('storage', 'Manure storage', 'manure-storage', 'per-m3', null, 45, 25, false), 'invented cost per m³; volume from the sizing helper');
    if (defaults.bed === 'deep-sand') add(item('sand-lane', 'Sand settling lane', 'manure-storage', 'lump-sum', null, 35000, 25, false), 'invented cost of a concrete lane where sand settles out before the store');
    add(item('troughs', 'Water troughs', 'water', 'per-item', null, 900, 15), 'invented cost per trough');
    add(item('ventilation', 'Ventilation and lighting', 'ventilation-lighting', 'per-stall', null, 150, 15), 'invented cost per stall');
    add(item('feed-barrier', 'Feed barrier and feed lane', 'equipment', 'per-stall', null, 250, 20), 'invented cost per stall');
    add(item('mixer-wagon', 'Mixer wagon for the barn ration', 'equipment', 'lump-sum', null, 45000, 12), 'invented cost');
    add(item('feed-storage', 'Extra silage storage for year-round housing', 'equipment', 'lump-sum', null, 45000, 25, false), 'invented cost');
    add(item('pens', 'Calving and special-needs pens', 'other', 'lump-sum', null, 30000, 25, false), 'invented cost');
    add(item('parlour', 'Parlour units for the larger herd', 'equipment', 'lump-sum', null, 40000, 15), 'invented cost');
    add(item('site-works', 'Site works, drainage and services', 'site-works', 'per-stall', null, 350, 30, false), 'invented cost per stall');
    add(item('fees', 'Design and planning fees', 'fees', 'lump-sum', null, 25000, 30, false), 'invented cost');
    add({ kind: 'contingency', id: 'contingency', description: 'Contingency', rate: 0.1, lifeYears: 30 }, '10 % of the other lines');
  }
  return { lines, sources };
}

function runningCostsFor(defaults: Defaults): RunningCostLine[] {
  const lines: RunningCostLine[] = [];
  if (defaults.manureRemoval === 'tractor-scraper' && defaults.labour.scrapingPassesPerDay > 0) {
    lines.push({ id: 'tractor-scraping', description: 'Tractor fuel and wear for scraping', amountPerYear: 1500, growth: 'general' });
  }
  if (defaults.bed === 'deep-sand') {
    lines.push({ id: 'sand-wear', description: 'Extra pump and spreader wear from sand', amountPerYear: 2000, growth: 'general' });
  }
  return lines;
}

function energyLinesFor(defaults: Defaults, stalls: number): Option['energyLines'] {
  const lines: Option['energyLines'] = [];
  if (defaults.manureRemoval === 'automatic-scraper') {
    lines.push({ id: 'scrapers', description: 'Automatic scraper drives', kwhPerYear: 1500 * Math.max(1, Math.ceil(stalls / STALLS_PER_AUTOMATIC_SCRAPER)), pricePerKwh: 0.25 });
  }
  if (defaults.kind === 'freestall') {
    lines.push({ id: 'fans-lights', description: 'Fans and lighting', kwhPerYear: 120 * stalls, pricePerKwh: 0.25 });
  }
  lines.push({ id: 'water-pumps', description: 'Water pumps', kwhPerYear: 15 * stalls, pricePerKwh: 0.25 });
  return lines;
}

/**
 * A line id unique in the scenario: the option's id, a dot and the line's own name
 * ("sand-freestall.shell"), the option part shortened when the whole would pass the schema's limit.
 */
export function scopedLineId(optionId: string, name: string): string {
  const room = LINE_ID_MAX_LENGTH - name.length - 1;
  return room > 0 ? `${optionId.slice(0, room)}.${name}` : name.slice(0, LINE_ID_MAX_LENGTH);
}

/**
 * The option under a new id with its capital, energy and running-cost lines re-id'd to match:
 * a line named under the option's old id ("steel.shell") keeps its own name ("steel-2.shell"),
 * any other id is put under the new one; source tags keyed by a capital line follow their line.
 */
export function withOptionId(option: Option, optionId: string): Option {
  const oldPrefix = `${option.id}.`;
  const rename = (id: string): string => scopedLineId(optionId, id.startsWith(oldPrefix) ? id.slice(oldPrefix.length) : id);
  const capitalIds = new Map(option.capitalLines.map((line) => [line.id, rename(line.id)]));
  const sources: Option['sources'] = {};
  for (const [key, source] of Object.entries(option.sources)) {
    // A line's own tag ("capitalLines.<id>") or its cost's ("capitalLines.<id>.unitCost" or ".rate").
    const match = /^capitalLines\.(.+?)(\.unitCost|\.rate)?$/.exec(key);
    const renamed = match?.[1] === undefined ? undefined : capitalIds.get(match[1]);
    sources[renamed === undefined ? key : `capitalLines.${renamed}${match?.[2] ?? ''}`] = source;
  }
  return {
    ...option,
    id: optionId,
    capitalLines: option.capitalLines.map((line) => ({ ...line, id: capitalIds.get(line.id) ?? rename(line.id) })),
    energyLines: option.energyLines.map((line) => ({ ...line, id: rename(line.id) })),
    runningCosts: option.runningCosts.map((line) => ({ ...line, id: rename(line.id) })),
    sources,
  };
}

/**
 * A new option from a starting point for this herd: stalls sized from the herd and a stocking
 * rate of 1, stall dimensions in the middle of the guidance for the breed size, water troughs for 7.6 cm of edge per cow, the store's surface from its sized
 * volume, and invented capital costs tagged 'assumption'. Every default carries its source.
 * Line ids are put under the option id ("sand-freestall.shell", "sand-freestall.fans-lights"), so
 * capital line ids are unique in a scenario of options with distinct ids.
 */
export function createOption(startingPoint: StartingPoint, herd: Herd, settings: CreateOptionSettings): Option {
  const defaults = STARTING_POINTS[startingPoint];
  const stockingRate = 1;
  const stalls = defaults.bed === 'none' ? 0 : stallsFor(herd.cows, stockingRate);
  const troughs = Math.max(2, Math.ceil((herd.cows * MIN_TROUGH_PERIMETER_PER_COW_M) / TROUGH_PERIMETER_M));
  const beddingPerDay = beddingTonnesPerYear(defaults.bedding.kgPerStallDay, stalls, 1);
  const storageWithoutRain = manureStorageVolumeM3({
    manureM3PerDay: (herd.cows * herd.manureExcretion.massKgPerCowDay * defaults.manure.collectionEfficiency) / herd.manureDensityKgPerM3,
    washWaterM3PerDay: defaults.manure.washWaterM3PerCowDay * herd.cows,
    beddingM3PerDay: beddingToStorageM3PerYear(beddingPerDay, defaults.bedding.shareToManureStorage, defaults.bedding.bulkDensityTonnesPerM3),
    netRainMPerYear: 0,
    openStorageAreaM2: 0,
    storageDays: defaults.manure.storageDays,
    freeboardM: 0,
  });
  const capital = settings.current ? { lines: [], sources: {} } : capitalLinesFor(startingPoint, defaults, stalls);
  const option: Option = {
    id: settings.id,
    name: settings.name ?? STARTING_POINT_NAMES[startingPoint],
    startingPoint,
    current: settings.current ?? false,
    kind: defaults.kind,
    divider: defaults.divider,
    bed: defaults.bed,
    manureRemoval: defaults.manureRemoval,
    housedDaysPerYear: defaults.housedDaysPerYear,
    lyingHoursPerDay: defaults.lyingHoursPerDay,
    systemYieldAdjustment: 0,
    stockingRate,
    milkQualityPricePerKg: 0,
    ...(defaults.bed === 'none' ? {} : { stallDimensions: guidanceStall(herd.breedSize) }),
    feedCostPerCowDay: { ...herd.feedCostPerCowDay },
    health: { ...defaults.health },
    herdChange: { cowsByYear: null, addedCows: 0, addedCowCost: null },
    labour: { ...defaults.labour },
    water: { troughs, troughPerimeterM: TROUGH_PERIMETER_M, fillRateLitresPerMinute: 40 },
    bedding: { ...defaults.bedding },
    maintenanceRate: defaults.maintenanceRate,
    insuranceRate: INSURANCE_RATE,
    existingHousingValue: 0,
    energyLines: energyLinesFor(defaults, stalls),
    manure: { ...defaults.manure, openStorageAreaM2: Math.round(storageWithoutRain / STORE_DEPTH_M) },
    capitalLines: capital.lines,
    runningCosts: runningCostsFor(defaults),
    sources: {
      ...COMMON_SOURCES,
      ...defaults.sources,
      ...capital.sources,
      stallDimensions: ref('middle of the dairy cattle extension guidance "Design considerations for dairy cattle free stalls" for the breed size, closed front'),
      energyLines: assumed('invented electricity use and price'),
      runningCosts: assumed('invented yearly running costs'),
      ...(settings.current ? { capitalLines: assumed('the current housing is already paid for (sunk cost)') } : {}),
    },
  };
  return withOptionId(option, settings.id);
}

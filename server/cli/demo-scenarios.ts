/**
 * Writes the demo farm's scenario files in scenarios/ from the farm baseline in demo-farm.json
 * and the engine's starting points: `npx tsx server/cli/demo-scenarios.ts`. The files are
 * committed (they are also test fixtures); run this again after the starting points change.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { herdSchema, scenarioSchema, type Finance, type Herd, type Option, type Scenario, type ScenarioInput, type StartingPoint } from '../../shared/schema';
import { anchoredForShocks } from '../../shared/engine';
import { createOption } from '../../shared/starting-points';

const demoDir = fileURLToPath(new URL('../../scenarios/', import.meta.url));

interface DemoFarm {
  farm: { currency: string; locale: string; units: 'metric' | 'us'; baseline: unknown };
}

/** Cairnbrook's invented loan offer and discount rate. */
const CAIRNBROOK_FINANCE: ScenarioInput['finance'] = {
  equity: 80000,
  grants: 0,
  interestRate: 0.055,
  termYears: 20,
  paymentsPerYear: 12,
  discountRate: 0.06,
  coverageThreshold: 1.25,
} satisfies Partial<Finance>;

/**
 * The family's own view of what could move (invented for the demo, multipliers on the figures
 * entered): milk price swings most, building quotes tend to run over, the lying-time response
 * is the least certain figure in the case.
 */
const CAIRNBROOK_UNCERTAINTY: NonNullable<NonNullable<ScenarioInput['risk']>['monteCarlo']> = {
  draws: 5000,
  seed: 2026,
  inputs: [
    { key: 'milkPrice', distribution: 'triangular', min: 0.8, mode: 1, max: 1.15 },
    { key: 'capitalCost', distribution: 'triangular', min: 0.95, mode: 1.05, max: 1.3 },
    { key: 'yieldResponse', distribution: 'normal', mean: 1, sd: 0.3, min: 0.2, max: 1.8 },
    { key: 'wage', distribution: 'triangular', min: 0.95, mode: 1, max: 1.2 },
  ],
};

function scenario(farm: DemoFarm['farm'], herd: Herd, name: string, description: string, options: Option[]): Scenario {
  // The farm's existing cash is measured at these prices: write in the herd margin it holds, so a
  // file whose prices are changed moves the existing farm's cash with the current option's margin.
  return anchoredForShocks(scenarioSchema.parse({
    schemaVersion: 1,
    name,
    description,
    horizonYears: 20,
    currency: farm.currency,
    locale: farm.locale,
    units: farm.units,
    herd,
    options,
    finance: CAIRNBROOK_FINANCE,
    risk: { monteCarlo: CAIRNBROOK_UNCERTAINTY },
  } satisfies ScenarioInput));
}

/** Replacement value of the old cubicle house the grazing herd winters in (EUR, invented). */
const OLD_CUBICLE_HOUSE_VALUE = 400000;

/** Cows the new barn is built for: the herd grows from 190 to 230 when it moves in (the grazing platform holds no more). */
const ADDED_COWS = 40;
/**
 * Cairnbrook's planning figure for a mixed ration fed in the barn all year (kg/cow/day beyond the
 * lying-time effect): with the lying-time gain the barn herd gives about 25 to 26 kg a day
 * (9 200 to 9 600 kg a year) against the grazing herd's 16 kg, what housed Holstein-Friesian herds
 * fed a mixed ration commonly reach in Ireland and Britain (from memory).
 */
const BARN_FEEDING_YIELD_GAIN = 8;

/**
 * Where the demo's capital figures sit against what such work costs in Ireland (from memory; the
 * demo's own costs are invented): a steel-portal farm building about €200 to €350 per m²,
 * concrete slurry storage about €40 to €80 per m³, site works, drainage and services about
 * 5 to 10 % of the build.
 */
const CAPITAL_NOTES: Record<string, string> = {
  shell: 'invented; steel-portal farm buildings in Ireland cost about €200 to €350 per m² (from memory)',
  storage: 'invented; concrete slurry storage in Ireland costs about €40 to €80 per m³ (from memory); volume from the sizing helper',
  'site-works': 'invented; site works, drainage and services commonly run at about 5 to 10 % of the build (from memory)',
};

/** The capital lines' source tags with the regional notes above. */
function withCapitalNotes(option: Option): Option['sources'] {
  const sources = { ...option.sources };
  for (const [line, note] of Object.entries(CAPITAL_NOTES)) {
    const key = `capitalLines.${option.id}.${line}.unitCost`;
    if (sources[key]) sources[key] = { kind: 'assumption', note };
  }
  return sources;
}

/** Milk from a barn's extra lying time over the grazing herd's (kg/cow/day): response × hours × the share of days in milk. */
function barnLyingGainOverGrazing(herd: Herd, startingPoint: StartingPoint): number {
  const hours = createOption(startingPoint, herd, { id: 'barn' }).lyingHoursPerDay - createOption('grazing', herd, { id: 'grazing' }).lyingHoursPerDay;
  return herd.lyingResponseKgPerHour * hours * (1 - herd.dryDaysPerCowYear / 365);
}

/** A freestall option sized for the enlarged herd, with its extra cows and the barn-feeding yield gain. */
function barnOption(startingPoint: StartingPoint, herd: Herd, settings: { id: string; name?: string }): Option {
  const option = createOption(startingPoint, { ...herd, cows: herd.cows + ADDED_COWS }, settings);
  return {
    ...option,
    systemYieldAdjustment: BARN_FEEDING_YIELD_GAIN,
    herdChange: { ...option.herdChange, addedCows: ADDED_COWS },
    sources: {
      ...withCapitalNotes(option),
      systemYieldAdjustment: { kind: 'assumption', note: "the farm's planning figure for a mixed ration fed in the barn all year: about 25 to 26 kg a day with the lying-time gain, as housed Holstein-Friesian herds on a mixed ration commonly give (from memory)" },
      'herdChange.addedCows': { kind: 'user', note: `the barn is built for ${herd.cows + ADDED_COWS} cows; the herd grows by ${ADDED_COWS} heifers of its own rearing` },
    },
  };
}

/** Cairnbrook as it is: grazing with winter housing in the old cubicle house, which still needs upkeep and insurance. */
function grazingToday(herd: Herd): Option {
  const option = createOption('grazing', herd, { id: 'grazing', name: 'Grazing as today', current: true });
  return {
    ...option,
    existingHousingValue: OLD_CUBICLE_HOUSE_VALUE,
    sources: { ...option.sources, existingHousingValue: { kind: 'assumption', note: "the farm's estimate of what it would cost to rebuild the old cubicle house; it carries the maintenance and insurance rates" } },
  };
}

/** The grazing herd as it is today against the four freestall starting points. */
function fiveSystems(farm: DemoFarm['farm'], herd: Herd): Scenario {
  return scenario(
    farm,
    herd,
    'Stay on grass or build: five systems',
    'Cairnbrook today (grazing with winter housing in the old cubicle house) against a new freestall barn with each of the four stall and bed systems.',
    [
      grazingToday(herd),
      barnOption('steel-freestall', herd, { id: 'steel-freestall' }),
      barnOption('flexible-freestall', herd, { id: 'flexible-freestall' }),
      barnOption('mattress-freestall', herd, { id: 'mattress-freestall' }),
      barnOption('sand-freestall', herd, { id: 'sand-freestall' }),
    ],
  );
}

/**
 * A new barn for 230 cows either way: top-dressed mattresses (current) or deep sand. Both carry the
 * barn's capital. The farm's cash today was earned on grass, so the herd margin inside it is the
 * grazing herd's: the existing farm's cash then moves to the barn's, as in the five systems.
 */
function mattressOrSand(farm: DemoFarm['farm'], herd: Herd, grazingHerdMargin: number | null): Scenario {
  // The herd's 16 kg is the grazing herd's: lying times here count from the mattress barn, so both
  // options carry the mattress barn's lying gain over grazing in their system adjustment, and each
  // barn gives the same milk as in the five systems (from year 2, once the gain has ramped up).
  const mattressLyingGain = barnLyingGainOverGrazing(herd, 'mattress-freestall');
  const withGain = (option: Option): Option => ({
    ...option,
    systemYieldAdjustment: Math.round((BARN_FEEDING_YIELD_GAIN + mattressLyingGain) * 100) / 100,
    sources: {
      ...option.sources,
      systemYieldAdjustment: { kind: 'assumption', note: `the farm's planning figure for a mixed ration fed in the barn all year (${BARN_FEEDING_YIELD_GAIN} kg) plus the mattress barn's lying-time gain over the grazing herd the baseline yield was measured on` },
    },
  });
  const mattress = withGain({ ...barnOption('mattress-freestall', herd, { id: 'mattress', name: 'New barn, mattresses' }), current: true });
  const sand = withGain(barnOption('sand-freestall', herd, { id: 'sand', name: 'New barn, deep sand' }));
  return scenario(
    farm,
    { ...herd, existingCashHerdMarginPerYear: grazingHerdMargin },
    'New barn: mattress or sand',
    'The new freestall barn is decided; which bed goes in it? Top-dressed mattresses with an automatic scraper against deep sand beds scraped by tractor.',
    [mattress, sand],
  );
}

function write(fileName: string, document: Scenario): void {
  writeFileSync(`${demoDir}${fileName}`, `${JSON.stringify(document, null, 2)}\n`);
  process.stdout.write(`Wrote scenarios/${fileName}\n`);
}

const demo = JSON.parse(readFileSync(`${demoDir}demo-farm.json`, 'utf8')) as DemoFarm;
const herd = herdSchema.parse(demo.farm.baseline);
const stayOrBuild = fiveSystems(demo.farm, herd);
write('cairnbrook-five-systems.json', stayOrBuild);
write('cairnbrook-mattress-or-sand.json', mattressOrSand(demo.farm, herd, stayOrBuild.herd.existingCashHerdMarginPerYear));

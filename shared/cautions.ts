import type { Option } from './schema';

/**
 * Cautions where the work can hurt people or animals, keyed by what in an option raises them.
 * Byrecast shows them beside the inputs and lists them all on the workbook cover; each one defers
 * to local codes and licensed professionals.
 */
export const OPTION_CAUTIONS = {
  sandInSlurry:
    'Sand in slurry settles in reception pits and wears pumps, pipes and spreaders. Plan a sand lane or separator, and clear a blocked pit from outside it with the right equipment: never enter a pit or tank, not even to free a pump.',
  automaticScraper:
    'Automatic alley scrapers can trap and crush calves, and children who play near them. Fit guards and a clearly marked emergency stop, keep calves out of scraped alleys and keep children away from the barn.',
  movingIndoors:
    'Lameness usually rises while a pasture herd changes to concrete and stalls. Plan the move with the herd vet and hoof trimmer: train heifers to the stalls, trim before housing and watch locomotion closely in the first months.',
  permits:
    'A new barn, manure store or a larger herd usually needs building, planning and environmental permits, and the manure must fit the farm\'s nutrient rules. Check with the local authority and a nutrient adviser before committing.',
  biosecurity:
    'Growing the herd: cows bought in from other herds can bring disease (for example BVD, Johne\'s disease, bovine TB, digital dermatitis). Buy from herds of known health status, test and isolate new cows, and agree a plan with the herd vet; heifers reared at home bring in no disease from outside the herd.',
} as const;

export type OptionCautionKey = keyof typeof OPTION_CAUTIONS;

/** The cautions an option raises, in the order above, given the current option's housing kind and today's herd. */
export function optionCautions(option: Option, farm: { currentKind: Option['kind'] | null; herdCows: number }): OptionCautionKey[] {
  const keys: OptionCautionKey[] = [];
  if (option.bed === 'deep-sand') keys.push('sandInSlurry');
  if (option.manureRemoval === 'automatic-scraper') keys.push('automaticScraper');
  if (!option.current && option.kind === 'freestall' && farm.currentKind === 'grazing') keys.push('movingIndoors');
  if (!option.current && option.capitalLines.length > 0) keys.push('permits');
  const addsCows = option.herdChange.addedCows > 0 || (option.herdChange.cowsByYear ?? []).some((cows) => cows > farm.herdCows);
  if (addsCows) keys.push('biosecurity');
  return keys;
}

/** One caution a scenario raises, with the names of the options that raise it. */
export interface ScenarioCaution {
  key: OptionCautionKey;
  text: string;
  optionNames: string[];
  /** True when every option but the current one raises it: the print then says so instead of listing them. */
  everyNewOption: boolean;
}

/** The cautions the scenario's options raise, each once, in the order above: for the print view. */
export function scenarioCautions(scenario: { herd: { cows: number }; options: Option[] }): ScenarioCaution[] {
  const farm = { currentKind: scenario.options.find((o) => o.current)?.kind ?? null, herdCows: scenario.herd.cows };
  const raisedBy = new Map<OptionCautionKey, string[]>();
  for (const option of scenario.options) {
    for (const key of optionCautions(option, farm)) raisedBy.set(key, [...(raisedBy.get(key) ?? []), option.name]);
  }
  const newOptions = scenario.options.filter((o) => !o.current).length;
  return (Object.keys(OPTION_CAUTIONS) as OptionCautionKey[]).flatMap((key) => {
    const optionNames = raisedBy.get(key);
    return optionNames ? [{ key, text: OPTION_CAUTIONS[key], optionNames, everyNewOption: newOptions > 1 && optionNames.length === newOptions }] : [];
  });
}

import type { Option } from '../schema';
import { beddingCostPerYear, beddingToStorageM3PerYear, beddingTonnesPerYear } from './bedding';
import { bedCareHoursPerYear, beddingTopUpHoursPerYear, grazingHoursPerYear, scrapingHoursPerYear, troughHoursPerYear } from './labour';
import type { OptionPlan } from './plan';

/** The housing's own work and bedding in one year: they follow stalls and days, not cows. */
export interface HousingWork {
  /** Labour hours per year by task (h/yr) and their sum. */
  scrapingHours: number;
  bedCareHours: number;
  beddingTopUpHours: number;
  troughHours: number;
  grazingHours: number;
  totalHours: number;
  /** Bedding bought (t/yr), its cost in today's money (currency/yr) and its share in the manure store (m³/yr). */
  beddingTonnes: number;
  beddingCostToday: number;
  beddingStoredM3: number;
}

/** An option's yearly housing work and bedding from its labour drivers, stalls and housed and grazing days. */
export function housingWork(option: Option, plan: OptionPlan): HousingWork {
  const { housedDays, grazingDays, stalls } = plan;
  const { labour, bedding } = option;
  const scrapingHours = scrapingHoursPerYear(labour.scrapingPassesPerDay, labour.minutesPerScrapingPass, housedDays);
  const bedCareHours = bedCareHoursPerYear(labour.bedCleaningsPerDay, labour.secondsPerStallCleaning, stalls, housedDays);
  const troughHours = troughHoursPerYear(labour.troughCleaningsPerDay, labour.minutesPerTroughCleaning, option.water.troughs, housedDays);
  const grazingHours = grazingHoursPerYear(labour.grazingHoursPerGrazingDay, grazingDays);
  const beddingTonnes = beddingTonnesPerYear(bedding.kgPerStallDay, stalls, housedDays);
  const beddingTopUpHours = beddingTopUpHoursPerYear(beddingTonnes, labour.beddingTonnesPerHour);
  return {
    scrapingHours,
    bedCareHours,
    beddingTopUpHours,
    troughHours,
    grazingHours,
    totalHours: scrapingHours + bedCareHours + beddingTopUpHours + troughHours + grazingHours,
    beddingTonnes,
    beddingCostToday: beddingCostPerYear(beddingTonnes, bedding.pricePerTonne),
    beddingStoredM3: beddingToStorageM3PerYear(beddingTonnes, bedding.shareToManureStorage, bedding.bulkDensityTonnesPerM3),
  };
}

import type { Option, Scenario } from '../schema';
import {
  collectedManurePerYear,
  creditedNutrients,
  creditedValue,
  cropNeedCap,
  manureHandlingCostPerYear,
  scaleManure,
  storedVolumeM3PerYear,
  type CollectedManure,
} from './manure';
import type { OptionPlan } from './plan';
import { MILK_DAYS_PER_YEAR } from './yield';

/** An option's manure as the ledger prices it, linear in the cows of the year. */
export interface OptionManure {
  /** Manure collected per cow-year on housed days (kg of mass, N, P, K). */
  perCow: CollectedManure;
  /** Fertiliser value in today's money of the manure of `cows` cows (currency/yr): collected plus credited pasture dung, capped by crop need. */
  valueToday(cows: number): number;
  /** Volume stored in a year with `cows` cows (m³/yr): manure, wash water, bedding share and net rain. */
  storedM3(cows: number): number;
  /** Handling cost per stored m³ in today's money (currency per m³), the sand extra included. */
  handlingPerM3: number;
}

/** The manure model of one option: what is collected, credited, stored and handled. */
export function optionManure(herd: Scenario['herd'], option: Option, plan: OptionPlan, beddingStoredM3: number): OptionManure {
  const manure = option.manure;
  const perCow = collectedManurePerYear(herd.manureExcretion, 1, plan.housedDays, manure.collectionEfficiency);
  // Dung dropped on grazing days, of which the credited share counts as fertiliser saved.
  const pasturePerCow = collectedManurePerYear(herd.manureExcretion, 1, plan.grazingDays, manure.pastureDungCredit);
  const nutrientCap = {
    phosphateKg: cropNeedCap(herd.land.phosphateNeedKgPerHa, herd.land.hectares),
    potashKg: cropNeedCap(herd.land.potashNeedKgPerHa, herd.land.hectares),
  };
  const storedVolume = (cows: number): number =>
    storedVolumeM3PerYear({
      manureKgPerYear: perCow.massKg * cows,
      manureDensityKgPerM3: herd.manureDensityKgPerM3,
      washWaterM3PerCowDay: manure.washWaterM3PerCowDay,
      cows,
      washWaterDays: manure.washWaterDiverted ? 0 : MILK_DAYS_PER_YEAR,
      beddingM3PerYear: beddingStoredM3,
      openStorageAreaM2: manure.openStorageAreaM2,
      netRainMPerYear: manure.netRainMPerYear,
    });
  const storedFixedM3 = storedVolume(0);
  const storedPerCowM3 = storedVolume(1) - storedFixedM3;
  return {
    perCow,
    valueToday: (cows) =>
      creditedValue(
        creditedNutrients(scaleManure(perCow, cows), scaleManure(pasturePerCow, cows), manure.storageNitrogenLoss, herd.nutrientAvailability, nutrientCap),
        herd.fertiliserPrices,
      ),
    storedM3: (cows) => storedFixedM3 + storedPerCowM3 * cows,
    handlingPerM3: manureHandlingCostPerYear(1, manure.handlingCostPerM3, manure.sandExtraHandlingCostPerM3),
  };
}

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
  const pasturePerCow = collectedManurePerYear(herd.manureExcretion, 1, plan.grazingDays, manure.pastureDungCredit);
  const volume = {
    manureKgPerYear: 0,
    manureDensityKgPerM3: herd.manureDensityKgPerM3,
    washWaterM3PerCowDay: manure.washWaterM3PerCowDay,
    cows: 0,
    washWaterDays: manure.washWaterDiverted ? 0 : MILK_DAYS_PER_YEAR,
    beddingM3PerYear: beddingStoredM3,
    openStorageAreaM2: manure.openStorageAreaM2,
    netRainMPerYear: manure.netRainMPerYear,
  };
  const storedFixedM3 = storedVolumeM3PerYear(volume);
  const storedPerCowM3 = storedVolumeM3PerYear({ ...volume, manureKgPerYear: perCow.massKg, cows: 1 }) - storedFixedM3;
  return new ManureModel(herd, manure, perCow, pasturePerCow, storedFixedM3, storedPerCowM3);
}

// A class rather than closures: the model is built for every option of every Monte Carlo draw.
class ManureModel implements OptionManure {
  readonly handlingPerM3: number;
  private readonly nutrientCap: { phosphateKg: number | null; potashKg: number | null };
  // The herd is the same size most years: the last value asked for, by its cows.
  private lastCows = Number.NaN;
  private lastValue = 0;

  constructor(
    private readonly herd: Scenario['herd'],
    private readonly manure: Option['manure'],
    readonly perCow: CollectedManure,
    private readonly pasturePerCow: CollectedManure,
    private readonly storedFixedM3: number,
    private readonly storedPerCowM3: number,
  ) {
    this.nutrientCap = {
      phosphateKg: cropNeedCap(herd.land.phosphateNeedKgPerHa, herd.land.hectares),
      potashKg: cropNeedCap(herd.land.potashNeedKgPerHa, herd.land.hectares),
    };
    this.handlingPerM3 = manureHandlingCostPerYear(1, manure.handlingCostPerM3, manure.sandExtraHandlingCostPerM3);
  }

  valueToday(cows: number): number {
    if (cows !== this.lastCows) {
      const { herd, manure } = this;
      this.lastValue = creditedValue(
        creditedNutrients(scaleManure(this.perCow, cows), scaleManure(this.pasturePerCow, cows), manure.storageNitrogenLoss, herd.nutrientAvailability, this.nutrientCap),
        herd.fertiliserPrices,
      );
      this.lastCows = cows;
    }
    return this.lastValue;
  }

  storedM3(cows: number): number {
    return this.storedFixedM3 + this.storedPerCowM3 * cows;
  }
}

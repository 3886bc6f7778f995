import { straightLineFast, wholeCents } from './cents';

/**
 * Taxable income of one year (currency): operating margin − depreciation − loan interest +
 * gain on disposal (salvage − tax book value, in the horizon year only).
 */
export function taxableIncome(operatingMargin: number, depreciation: number, interest: number, disposalGain: number): number {
  return operatingMargin - depreciation - interest + disposalGain;
}

/**
 * Tax of one year (currency; negative = a tax saving against other farm income) at `rate`, with
 * `lossCarried` brought in from earlier years. When losses offset other income, a negative
 * taxable income gives a saving that year; otherwise the loss is carried forward
 * ({@link lossCarriedOn}) and set against the next years' taxable income, and any loss left at
 * the horizon is lost.
 */
export function taxOfYear(taxable: number, rate: number, lossesOffsetOtherIncome: boolean, lossCarried: number): number {
  if (rate === 0) return 0;
  if (lossesOffsetOtherIncome) return rate * taxable;
  if (taxable <= 0) return 0;
  return rate * (taxable - Math.min(lossCarried, taxable));
}

/** The loss carried into the next year (currency, ≥ 0) after a year taxed by {@link taxOfYear}. */
export function lossCarriedOn(taxable: number, rate: number, lossesOffsetOtherIncome: boolean, lossCarried: number): number {
  if (rate === 0 || lossesOffsetOtherIncome) return 0;
  if (taxable <= 0) return lossCarried - taxable;
  return lossCarried - Math.min(lossCarried, taxable);
}

/** Depreciation schedule for one purchase: cost and life → amounts in years 1..life after purchase (currency/yr). */
export type DepreciationSchedule = (cost: number, lifeYears: number) => number[];

export interface TaxDepreciation {
  /** Depreciation per year (currency), index = year (0 at year 0). */
  byYear: number[];
  /** Undepreciated tax book value of all purchases at the horizon (currency). */
  bookValueAtHorizon: number;
}

/**
 * Tax depreciation per year (currency), added one purchase at a time: each purchase depreciated
 * over its life from the year after it is bought; amounts falling after the horizon stay in the
 * book value at H. Summed in whole cents, so every year's total is exact; no record is kept per
 * purchase (this runs for the plan of every Monte Carlo draw).
 */
export class TaxDepreciationSum {
  // Whole cents per year as differences (an amount in year y is +a at y, −a at y + 1), summed once
  // in result(): a straight-line purchase, level but for its last year, is then one run of two
  // entries. Every entry is a whole number of cents, so the order of the sums changes no cent.
  private readonly steps: number[];
  private bookCents = 0;

  constructor(
    private readonly horizon: number,
    private readonly schedule: DepreciationSchedule,
  ) {
    this.steps = new Array<number>(horizon + 2).fill(0);
  }

  /** A purchase in `year` at `cost` (currency) over `lifeYears`, on its own schedule when it has one (else the scenario's). */
  add(year: number, cost: number, lifeYears: number, own?: (cost: number) => number[]): void {
    if (cost <= 0) return;
    const steps = this.steps;
    const from = year + 1;
    const inHorizon = Math.max(0, Math.min(lifeYears, this.horizon - year));
    if (!own && this.schedule === straightLineFast) {
      // straightLineFast's amounts without building its array.
      const base = wholeCents(cost);
      const yearly = Math.round(base / lifeYears);
      const lastAmount = base - yearly * (lifeYears - 1);
      const levelYears = Math.min(lifeYears - 1, inHorizon);
      steps[from] = (steps[from] as number) + yearly;
      steps[from + levelYears] = (steps[from + levelYears] as number) - yearly;
      this.bookCents += yearly * (lifeYears - 1 - levelYears);
      if (inHorizon === lifeYears) {
        steps[from + lifeYears - 1] = (steps[from + lifeYears - 1] as number) + lastAmount;
        steps[from + lifeYears] = (steps[from + lifeYears] as number) - lastAmount;
      } else this.bookCents += lastAmount;
      return;
    }
    const amounts = own ? own(cost) : this.schedule(cost, lifeYears);
    const last = Math.min(amounts.length, inHorizon);
    for (let i = 0; i < amounts.length; i++) {
      const amount = Math.round((amounts[i] ?? 0) * 100);
      if (i < last) {
        steps[from + i] = (steps[from + i] as number) + amount;
        steps[from + i + 1] = (steps[from + i + 1] as number) - amount;
      } else this.bookCents += amount;
    }
  }

  result(): TaxDepreciation {
    const byYear = new Array<number>(this.horizon + 1);
    byYear[0] = 0;
    let cents = 0;
    for (let year = 1; year <= this.horizon; year++) {
      cents += this.steps[year] as number;
      byYear[year] = cents / 100;
    }
    return { byYear, bookValueAtHorizon: this.bookCents / 100 };
  }
}

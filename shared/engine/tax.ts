import { straightLineFast, wholeCents } from './cents';

/**
 * Taxable income of one year (currency): operating margin − depreciation − loan interest +
 * gain on disposal (salvage − tax book value, in the horizon year only).
 */
export function taxableIncome(operatingMargin: number, depreciation: number, interest: number, disposalGain: number): number {
  return operatingMargin - depreciation - interest + disposalGain;
}

export interface TaxStep {
  /** Tax of the year (currency); negative = a tax saving against other farm income. */
  tax: number;
  /** Loss carried into the next year (currency, ≥ 0). */
  lossCarried: number;
}

/**
 * Tax of one year (currency) at `rate`. When losses offset other income, a negative taxable
 * income gives a saving (negative tax) that year; otherwise the loss is carried forward and
 * set against the next years' taxable income, and any loss left at the horizon is lost.
 */
export function taxForYear(taxable: number, rate: number, lossesOffsetOtherIncome: boolean, lossCarried: number): TaxStep {
  return { tax: taxOfYear(taxable, rate, lossesOffsetOtherIncome, lossCarried), lossCarried: lossCarriedOn(taxable, rate, lossesOffsetOtherIncome, lossCarried) };
}

/** The tax of {@link taxForYear} alone (currency), without a record per year. */
export function taxOfYear(taxable: number, rate: number, lossesOffsetOtherIncome: boolean, lossCarried: number): number {
  if (rate === 0) return 0;
  if (lossesOffsetOtherIncome) return rate * taxable;
  if (taxable <= 0) return 0;
  return rate * (taxable - Math.min(lossCarried, taxable));
}

/** The loss carried on by {@link taxForYear} alone (currency, ≥ 0). */
export function lossCarriedOn(taxable: number, rate: number, lossesOffsetOtherIncome: boolean, lossCarried: number): number {
  if (rate === 0 || lossesOffsetOtherIncome) return 0;
  if (taxable <= 0) return lossCarried - taxable;
  return lossCarried - Math.min(lossCarried, taxable);
}

/** Depreciation schedule for one purchase: cost and life → amounts in years 1..life after purchase (currency/yr). */
export type DepreciationSchedule = (cost: number, lifeYears: number) => number[];

export interface PurchaseForTax {
  year: number;
  cost: number;
  lifeYears: number;
  /** The purchase's own schedule (its tax class); absent = the scenario's schedule over lifeYears. */
  schedule?: (cost: number) => number[];
}

export interface TaxDepreciation {
  /** Depreciation per year (currency), index = year (0 at year 0). */
  byYear: number[];
  /** Undepreciated tax book value of all purchases at the horizon (currency). */
  bookValueAtHorizon: number;
}

/**
 * Tax depreciation per year (currency): each purchase depreciated over its life from the year
 * after it is bought; amounts falling after the horizon stay in the book value at H. Summed in
 * whole cents, so every year's total is exact.
 */
export function taxDepreciation(purchases: readonly PurchaseForTax[], horizon: number, schedule: DepreciationSchedule): TaxDepreciation {
  // Whole cents per year as differences (an amount in year y is +a at y, −a at y + 1), summed once
  // below: a straight-line purchase, level but for its last year, is then one run of two entries.
  // Every entry is a whole number of cents, so the order of the sums changes no cent.
  const steps = new Array<number>(horizon + 2).fill(0);
  let bookCents = 0;
  for (const purchase of purchases) {
    if (purchase.cost <= 0) continue;
    const from = purchase.year + 1;
    const inHorizon = Math.max(0, Math.min(purchase.lifeYears, horizon - purchase.year));
    if (!purchase.schedule && schedule === straightLineFast) {
      // straightLineFast's amounts without building its array (this runs for every purchase of
      // every option of every Monte Carlo draw).
      const life = purchase.lifeYears;
      const base = wholeCents(purchase.cost);
      const yearly = Math.round(base / life);
      const lastAmount = base - yearly * (life - 1);
      const levelYears = Math.min(life - 1, inHorizon);
      steps[from] = (steps[from] as number) + yearly;
      steps[from + levelYears] = (steps[from + levelYears] as number) - yearly;
      bookCents += yearly * (life - 1 - levelYears);
      if (inHorizon === life) {
        steps[from + life - 1] = (steps[from + life - 1] as number) + lastAmount;
        steps[from + life] = (steps[from + life] as number) - lastAmount;
      } else bookCents += lastAmount;
      continue;
    }
    const amounts = purchase.schedule ? purchase.schedule(purchase.cost) : schedule(purchase.cost, purchase.lifeYears);
    const last = Math.min(amounts.length, inHorizon);
    for (let i = 0; i < amounts.length; i++) {
      const amount = Math.round((amounts[i] ?? 0) * 100);
      if (i < last) {
        steps[from + i] = (steps[from + i] as number) + amount;
        steps[from + i + 1] = (steps[from + i + 1] as number) - amount;
      } else bookCents += amount;
    }
  }
  const byYear = new Array<number>(horizon + 1);
  byYear[0] = 0;
  let cents = 0;
  for (let year = 1; year <= horizon; year++) {
    cents += steps[year] as number;
    byYear[year] = cents / 100;
  }
  return { byYear, bookValueAtHorizon: bookCents / 100 };
}

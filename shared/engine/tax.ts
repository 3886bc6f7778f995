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
  if (rate === 0) return { tax: 0, lossCarried: 0 };
  if (lossesOffsetOtherIncome) return { tax: rate * taxable, lossCarried: 0 };
  if (taxable <= 0) return { tax: 0, lossCarried: lossCarried - taxable };
  const used = Math.min(lossCarried, taxable);
  return { tax: rate * (taxable - used), lossCarried: lossCarried - used };
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
  const cents = new Float64Array(horizon + 1);
  // Straight-line amounts are level but for the last year: added as a run (start +, end −), summed once below.
  const levelRuns = new Float64Array(horizon + 2);
  let bookCents = 0;
  for (const purchase of purchases) {
    if (purchase.cost <= 0) continue;
    const inHorizon = Math.max(0, Math.min(purchase.lifeYears, horizon - purchase.year));
    if (!purchase.schedule && schedule === straightLineFast) {
      // straightLineFast's amounts without building its array (this runs for every purchase of
      // every option of every Monte Carlo draw).
      const life = purchase.lifeYears;
      const base = wholeCents(purchase.cost);
      const yearly = Math.round(base / life);
      const lastAmount = base - yearly * (life - 1);
      const levelYears = Math.min(life - 1, inHorizon);
      levelRuns[purchase.year + 1] = (levelRuns[purchase.year + 1] ?? 0) + yearly;
      levelRuns[purchase.year + 1 + levelYears] = (levelRuns[purchase.year + 1 + levelYears] ?? 0) - yearly;
      bookCents += yearly * (life - 1 - levelYears);
      if (inHorizon === life) cents[purchase.year + life] = (cents[purchase.year + life] ?? 0) + lastAmount;
      else bookCents += lastAmount;
      continue;
    }
    const amounts = purchase.schedule ? purchase.schedule(purchase.cost) : schedule(purchase.cost, purchase.lifeYears);
    const last = Math.min(amounts.length, inHorizon);
    for (let i = 0; i < amounts.length; i++) {
      const amount = Math.round((amounts[i] ?? 0) * 100);
      if (i < last) cents[purchase.year + i + 1] = (cents[purchase.year + i + 1] ?? 0) + amount;
      else bookCents += amount;
    }
  }
  const byYear = new Array<number>(horizon + 1).fill(0);
  let level = 0;
  for (let year = 1; year <= horizon; year++) {
    level += levelRuns[year] ?? 0;
    byYear[year] = ((cents[year] ?? 0) + level) / 100;
  }
  return { byYear, bookValueAtHorizon: bookCents / 100 };
}

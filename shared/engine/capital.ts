import type { CapitalItem, CapitalLine, TaxClass } from '../schema';
import { growthFactor } from './growth';

/** Quantities the sizing helpers give to capital lines whose quantity is left null. */
export interface SizedQuantities {
  stalls: number;
  storageM3: number;
  troughs: number;
}

/** One depreciable, replaceable asset: a capital item or a contingency allowance (cost in today's money). */
export interface CapitalAsset {
  id: string;
  description: string;
  cost: number;
  lifeYears: number;
  replace: boolean;
  /** How it is depreciated for tax, and the straight-line tax life (years) for 'straight-line'. */
  taxClass: TaxClass;
  taxLifeYears: number;
}

/** A purchase of an asset: at year 0, or a replacement at the end of its life (cost grown to that year). */
export interface Purchase {
  asset: number;
  year: number;
  cost: number;
}

/**
 * Quantity of a capital item (its unit): the typed quantity, or when null the sized one —
 * per-stall → stalls, per-m3 manure storage → storage m³, per-item water → troughs, lump-sum → 1.
 */
export function capitalLineQuantity(line: CapitalItem, sized: SizedQuantities): number {
  if (line.quantity !== null) return line.quantity;
  if (line.unit === 'per-stall') return sized.stalls;
  if (line.unit === 'lump-sum') return 1;
  if (line.unit === 'per-m3' && line.category === 'manure-storage') return sized.storageM3;
  if (line.unit === 'per-item' && line.category === 'water') return sized.troughs;
  return 0;
}

/**
 * Capital lines as assets in today's money (currency): items at quantity × unit cost × the
 * cost multiplier (1 as entered); each contingency line at its rate × the sum of the items.
 */
export function capitalAssets(lines: readonly CapitalLine[], sized: SizedQuantities, costMultiplier = 1): CapitalAsset[] {
  const items: CapitalAsset[] = [];
  let itemsTotal = 0;
  for (const line of lines) {
    if (line.kind !== 'item') continue;
    const cost = capitalLineQuantity(line, sized) * line.unitCost * costMultiplier;
    itemsTotal += cost;
    items.push({ id: line.id, description: line.description, cost, lifeYears: line.lifeYears, replace: line.replaceAtEndOfLife, taxClass: line.taxClass, taxLifeYears: line.taxLifeYears ?? line.lifeYears });
  }
  for (const line of lines) {
    if (line.kind !== 'contingency') continue;
    items.push({ id: line.id, description: line.description, cost: line.rate * itemsTotal, lifeYears: line.lifeYears, replace: false, taxClass: 'economic-life', taxLifeYears: line.lifeYears });
  }
  return items;
}

/** Total capital at year 0 (currency): the sum of every asset's cost, contingency included. */
export function capitalTotal(assets: readonly CapitalAsset[]): number {
  let total = 0;
  for (const asset of assets) total += asset.cost;
  return total;
}

/**
 * Purchases over the horizon: every asset at year 0, and each replaceable asset again at
 * years L, 2L, … strictly before the horizon H, at cost × (1 + inflation)^year.
 */
export function purchaseSchedule(assets: readonly CapitalAsset[], horizon: number, inflation: number): Purchase[] {
  const purchases: Purchase[] = [];
  assets.forEach((asset, index) => {
    purchases.push({ asset: index, year: 0, cost: asset.cost });
    if (!asset.replace || asset.cost === 0) return;
    for (let year = asset.lifeYears; year < horizon; year += asset.lifeYears) {
      purchases.push({ asset: index, year, cost: asset.cost * growthFactor(inflation, year) });
    }
  });
  return purchases;
}

/** Replacement spending per year (currency), index = year, year 0 excluded (that is the initial capital). */
export function replacementsByYear(purchases: readonly Purchase[], horizon: number): number[] {
  const byYear = new Array<number>(horizon + 1).fill(0);
  for (const purchase of purchases) {
    if (purchase.year > 0 && purchase.year <= horizon) byYear[purchase.year] = (byYear[purchase.year] ?? 0) + purchase.cost;
  }
  return byYear;
}

/** Straight-line residual value (currency): cost × remaining life ÷ life, 0 once fully used. */
export function residualValue(cost: number, lifeYears: number, ageYears: number): number {
  return (cost * Math.max(0, lifeYears - ageYears)) / lifeYears;
}

/**
 * Salvage at the horizon H (currency): for each asset, the straight-line residual value of its
 * latest purchase (earlier purchases are fully used by the time they are replaced).
 */
export function salvageAtHorizon(assets: readonly CapitalAsset[], purchases: readonly Purchase[], horizon: number): number {
  const latest = new Array<Purchase | undefined>(assets.length);
  for (const purchase of purchases) {
    const seen = latest[purchase.asset];
    if (!seen || purchase.year > seen.year) latest[purchase.asset] = purchase;
  }
  // In asset order, as purchaseSchedule lists them.
  let salvage = 0;
  latest.forEach((purchase, index) => {
    const asset = assets[index];
    if (asset && purchase) salvage += residualValue(purchase.cost, asset.lifeYears, horizon - purchase.year);
  });
  return salvage;
}

/** Maintenance in today's money (currency/yr): rate per year × capital at year 0. */
export function maintenanceCostPerYear(rate: number, capital: number): number {
  return rate * capital;
}

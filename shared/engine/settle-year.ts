/** Year t after its operating margin: tax with losses carried, the project's net flow, cash for debt service. */
import type { Scenario } from '../schema';
import type { OptionPlan } from './plan';
import { taxableIncome, taxForYear } from './tax';

/** How a money amount enters the year's totals: to cents on the ledger, unrounded in the milk model. */
export type Rounding = (amount: number) => number;

/** No rounding (the milk model: a smooth function of the price). */
export const identity: Rounding = (amount) => amount;

/**
 * A sum of amounts already in whole cents, freed of binary noise (currency). No half-cent can
 * arise in such a sum, so this decides nothing that half-up rounding would.
 */
export const noiseFreeCents: Rounding = (sum) => Math.round(sum * 100) / 100;

/** Tax and net flows of one year, written into by {@link settleYear} (currency). */
export interface Settlement {
  taxable: number;
  tax: number;
  net: number;
  cashForDebtService: number;
  lossCarried: number;
  replacements: number;
  herdPurchases: number;
  salvage: number;
  herdValue: number;
  depreciation: number;
}

/** A settlement record to write into, all zero. */
export const emptySettlement = (): Settlement => ({ taxable: 0, tax: 0, net: 0, cashForDebtService: 0, lossCarried: 0, replacements: 0, herdPurchases: 0, salvage: 0, herdValue: 0, depreciation: 0 });

/**
 * Year t after the operating margin: tax (with losses carried from earlier years), the project's
 * net cash flow and the cash available for debt service (currency). The disposal at the horizon
 * is a valuation, not an operating receipt: its salvage stays out of the cash available for debt
 * service, and so does the tax on its gain (the tax on the year's operations alone).
 */
export function settleYear(out: Settlement, plan: OptionPlan, finance: Scenario['finance'], t: number, operatingMargin: number, lossCarried: number, round: Rounding, centsTotal: Rounding): void {
  const last = t === plan.horizon;
  // Most years buy nothing; rounding ±0 gives it back as it is.
  const replacements = plan.replacementsByYear[t] ?? 0;
  const herdPurchases = plan.herdPurchasesByYear[t] ?? 0;
  out.replacements = replacements === 0 ? replacements : round(replacements);
  out.herdPurchases = herdPurchases === 0 ? herdPurchases : round(herdPurchases);
  out.salvage = last ? round(plan.salvage) : 0;
  out.herdValue = last ? round(plan.herdValueAtHorizon) : 0;
  // Tax depreciation is summed in whole cents (tax.ts), so rounding it again changes nothing.
  out.depreciation = plan.depreciationByYear[t] ?? 0;
  const interest = plan.interestByYear[t] ?? 0;
  const disposalGain = last ? out.salvage - round(plan.taxBookValueAtHorizon) : 0;
  out.taxable = centsTotal(taxableIncome(operatingMargin, out.depreciation, interest, disposalGain));
  const step = taxForYear(out.taxable, finance.taxRate, finance.lossesOffsetOtherIncome, lossCarried);
  out.lossCarried = step.lossCarried;
  out.tax = round(step.tax);
  out.net = centsTotal(operatingMargin - out.replacements - out.herdPurchases - out.tax + out.salvage + out.herdValue);
  let operatingTax = out.tax;
  if (disposalGain !== 0) {
    operatingTax = round(taxForYear(centsTotal(out.taxable - disposalGain), finance.taxRate, finance.lossesOffsetOtherIncome, lossCarried).tax);
  }
  out.cashForDebtService = centsTotal(operatingMargin - operatingTax);
}

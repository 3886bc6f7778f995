/** Year t after its operating margin: tax with losses carried, the project's net flow, cash for debt service. */
import type { Scenario } from '../schema';
import type { OptionPlan } from './plan';
import { roundCentsFast, WHOLE_NEAR_BELOW, wholeNear } from './cents';
import { lossCarriedOn, taxableIncome, taxOfYear } from './tax';

/**
 * A sum of amounts already in whole cents, freed of binary noise (currency). No half-cent can
 * arise in such a sum, so this decides nothing that half-up rounding would.
 */
export function noiseFreeCents(sum: number): number {
  // Math.round(sum × 100) / 100, without the branch V8 settles Math.round's half with: the sum's
  // noise has either sign, so that branch would go either way (see cents.ts wholeNear).
  const scaled = sum * 100;
  const cents = wholeNear(scaled);
  const off = scaled - cents;
  // Math.round's zero keeps the sum's sign (−1e-12 → −0), and so does the sum × 0.
  if (off < 0.5 && off > -0.5 && scaled < WHOLE_NEAR_BELOW && scaled > -WHOLE_NEAR_BELOW) return cents === 0 ? sum * 0 : cents / 100;
  return Math.round(scaled) / 100;
}

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
 * service, and so does the tax on its gain (the tax on the year's operations alone). `inCents`:
 * every line rounded to cents as the ledger does (roundCentsFast, sums by noiseFreeCents); false
 * leaves them unrounded (the milk model: a smooth function of the price).
 */
export function settleYear(out: Settlement, plan: OptionPlan, finance: Scenario['finance'], t: number, operatingMargin: number, lossCarried: number, inCents: boolean): void {
  const last = t === plan.horizon;
  const { taxRate, lossesOffsetOtherIncome } = finance;
  // Most years buy nothing; rounding ±0 gives it back as it is.
  const replacements = plan.replacementsByYear[t] as number;
  const herdPurchases = plan.herdPurchasesByYear[t] as number;
  out.replacements = replacements === 0 || !inCents ? replacements : roundCentsFast(replacements);
  out.herdPurchases = herdPurchases === 0 || !inCents ? herdPurchases : roundCentsFast(herdPurchases);
  out.salvage = last ? (inCents ? roundCentsFast(plan.salvage) : plan.salvage) : 0;
  out.herdValue = last ? (inCents ? roundCentsFast(plan.herdValueAtHorizon) : plan.herdValueAtHorizon) : 0;
  // Tax depreciation is summed in whole cents (tax.ts), so rounding it again changes nothing.
  out.depreciation = plan.depreciationByYear[t] as number;
  const interest = plan.interestByYear[t] as number;
  const disposalGain = last ? out.salvage - (inCents ? roundCentsFast(plan.taxBookValueAtHorizon) : plan.taxBookValueAtHorizon) : 0;
  const taxable = taxableIncome(operatingMargin, out.depreciation, interest, disposalGain);
  out.taxable = inCents ? noiseFreeCents(taxable) : taxable;
  out.lossCarried = lossCarriedOn(out.taxable, taxRate, lossesOffsetOtherIncome, lossCarried);
  const tax = taxOfYear(out.taxable, taxRate, lossesOffsetOtherIncome, lossCarried);
  out.tax = inCents ? roundCentsFast(tax) : tax;
  const net = operatingMargin - out.replacements - out.herdPurchases - out.tax + out.salvage + out.herdValue;
  out.net = inCents ? noiseFreeCents(net) : net;
  let operatingTax = out.tax;
  if (disposalGain !== 0) {
    const taxableOperations = inCents ? noiseFreeCents(out.taxable - disposalGain) : out.taxable - disposalGain;
    const tax = taxOfYear(taxableOperations, taxRate, lossesOffsetOtherIncome, lossCarried);
    operatingTax = inCents ? roundCentsFast(tax) : tax;
  }
  const cash = operatingMargin - operatingTax;
  out.cashForDebtService = inCents ? noiseFreeCents(cash) : cash;
}

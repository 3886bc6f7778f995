/**
 * The projection of one option, in parts: its plan (plan.ts), its year ledger (year-ledger.ts)
 * and its milk model (milk-model.ts). Engine modules import the parts from here.
 */
export { loanAmountFor, optionStalls, optionStorageM3, planOption, planOptionsFast, withFinanceTerms, type OptionPlan, type PlanMode } from './plan';
export { projectOption, withCapitalOf, type Projection } from './year-ledger';
export { flowsAtPrice, milkAtResponse, milkingLyingHours, npvAtMilk, npvAtPrice, type MilkAtResponse, type MilkModel } from './milk-model';

import type { CoverageBreakEven } from './coverage-break-even';
import type { LoanSchedule } from './finance';
import type { StallCheck, WaterCheck } from './sizing';
import type { SourcesAndUses } from './sources-and-uses';
import type { StressResult } from './stress';

/** Labour hours of one year by task (h/yr). */
export interface LabourHours {
  scraping: number;
  bedCare: number;
  beddingTopUp: number;
  troughs: number;
  grazing: number;
  total: number;
}

/** Manure collected and stored in one year: volume (m³/yr) and nutrients (kg/yr, as N, P2O5, K2O). */
export interface ManureYear {
  storedM3: number;
  nitrogenKg: number;
  phosphateKg: number;
  potashKg: number;
}

/**
 * One year of one option. Money in the farm's currency, nominal, rounded to cents. Income
 * lines (milkIncome, manureValue, salvage, herdValueAtHorizon, grants) and cost lines (all
 * others) are both positive amounts; tax < 0 is a saving; herdPurchases < 0 is a net sale.
 * netCashFlow = milkIncome + manureValue + salvage + herdValueAtHorizon + grants − capital −
 * feed − labour… − bedding − health − culling − maintenance − energy − runningCosts −
 * manureHandling − replacements − herdPurchases − tax (the project, unlevered view).
 */
export interface YearLine {
  year: number;
  cows: number;
  yieldKgPerCowDay: number;
  milkSoldKg: number;
  milkIncome: number;
  feed: number;
  labourScraping: number;
  labourBedCare: number;
  labourBeddingTopUp: number;
  labourTroughs: number;
  labourGrazing: number;
  bedding: number;
  health: number;
  culling: number;
  maintenance: number;
  energy: number;
  runningCosts: number;
  manureValue: number;
  manureHandling: number;
  /** Income minus operating costs, before capital, tax and debt (currency). */
  operatingMargin: number;
  capital: number;
  grants: number;
  replacements: number;
  herdPurchases: number;
  salvage: number;
  herdValueAtHorizon: number;
  depreciation: number;
  taxableIncome: number;
  tax: number;
  netCashFlow: number;
  loanInterest: number;
  loanPrincipal: number;
  /** Net cash flow after loan proceeds (year 0) and debt service; the balance left at H is repaid in year H. */
  financedCashFlow: number;
  /** Operating margin − tax: the FFSC numerator before family living (currency). */
  cashAvailableForDebtService: number;
  labourHours: LabourHours;
  beddingTonnes: number;
  manure: ManureYear;
}

export interface CoverageYear {
  year: number;
  /** (this option's cash for debt service − the current option's) ÷ (this loan's P+I − the current option's); null for the current option or when the change borrows nothing. */
  project: number | null;
  /** (existing farm cash in year t + the change above) ÷ (existing debt payments in year t + this loan's P+I); null when nothing is due. */
  wholeFarm: number | null;
}

export type IrrReason = 'no-sign-change' | 'multiple-roots' | 'no-root';

export type PaybackReason = 'not-within-horizon' | 'no-net-investment';

export interface Metrics {
  cashFlows: number[];
  npv: number;
  irr: number | null;
  irrReason?: IrrReason;
  /**
   * With an IRR: 'investment' when the flows start with an outlay (a higher IRR is better);
   * 'borrowing' when they start with a saving and cost later (the IRR is the rate paid — lower is better).
   */
  irrKind?: 'investment' | 'borrowing';
  mirr: number | null;
  paybackYears: number | null;
  /** Why paybackYears is null: never reached within the horizon, or (incremental series) no outlay at year 0 to pay back. */
  paybackReason?: PaybackReason;
  discountedPaybackYears: number | null;
  discountedPaybackReason?: PaybackReason;
  profitabilityIndex: number | null;
}

export interface IncrementalResult extends Metrics {
  /** Payback of the change from operations alone: without the year-H salvage and herd value (years); null with a reason. */
  paybackFromOperationsYears: number | null;
  paybackFromOperationsReason?: PaybackReason;
  /** Share of the change's year-0 outlay its operations recover over the horizon (fraction); null without an outlay. */
  operationsRecoveredShare: number | null;
  breakEvenMilkPrice: number | null;
  breakEvenMilkPriceReason?: 'none-in-range';
  breakEvenLyingResponse: number | null;
  breakEvenLyingResponseReason?: 'none-in-range' | 'same-lying-time';
}

export interface SizingResult {
  designCows: number;
  stalls: number;
  stallCheck: StallCheck;
  waterCheck: WaterCheck;
  manureStorageM3: number;
}

/** The decision figures `evaluateScenario` adds to `evaluateCore`'s: the lender's stress and the coverage break-evens. */
export interface DecisionFigures {
  /** The lender's stress table: this option re-evaluated under each shock (stress.ts STRESS_TESTS order). */
  stress: StressResult[];
  /** Milk prices at which the lowest whole-farm coverage is exactly 1.0 and the threshold. */
  breakEvenMilkPriceForCoverage: CoverageBreakEven;
}

/** One option's figures from `evaluateCore`: everything but the decision figures. */
export type CoreOptionResult = Omit<OptionResult, keyof DecisionFigures>;

/** `evaluateCore`'s results: `ScenarioResults` without the decision figures. */
export type CoreScenarioResults = Omit<ScenarioResults, 'options'> & { options: CoreOptionResult[] };

export interface OptionResult extends Metrics, DecisionFigures {
  id: string;
  name: string;
  current: boolean;
  stalls: number;
  capitalTotal: number;
  capitalPerStall: number | null;
  equivalentAnnualCostPerStall: number | null;
  /** Year-0 financing of the capital (currency). */
  financing: { grants: number; equity: number; loanAmount: number };
  years: YearLine[];
  financedCashFlows: number[];
  loan: LoanSchedule & { amount: number };
  coverage: CoverageYear[];
  /** Lowest whole-farm coverage and its year. */
  lowestCoverage: { year: number; value: number } | null;
  lowestProjectCoverage: { year: number; value: number } | null;
  /** Years whose whole-farm coverage is below the lender's threshold. */
  yearsBelowCoverageThreshold: number[];
  sourcesAndUses: SourcesAndUses;
  /** Per-year arrays: index = year, [0] = year 0. */
  labourHoursPerYear: number[];
  beddingTonnesPerYear: number[];
  manureFertiliserValuePerYear: number[];
  sizing: SizingResult;
  /** The change against the current option; null for the current option itself. */
  incremental: IncrementalResult | null;
}

/** Something about the inputs a reader should check before trusting the figures. */
export interface ModelWarning {
  code: 'milk-growth-below-feed' | 'organic-nitrogen-over-limit';
  message: string;
  /** The option it concerns; absent when it concerns the whole scenario. */
  optionId?: string;
}

export interface ScenarioResults {
  horizonYears: number;
  currency: string;
  currentOptionId: string;
  /** True when the current option itself buys capital: its loan and its margin are both in its coverage. */
  currentOptionCarriesCapital: boolean;
  /** The existing farm as whole-farm coverage counts it (currency per year, index = year, [0] = 0). */
  existingFarm: {
    /** The herd margin inside the existing farm cash figure: entered, or the current option's year 1. */
    herdMarginInExistingCash: number;
    /** Existing farm cash for debt service in year t: the figure entered − that margin + the current option's cash in year t. */
    cashForDebtServiceByYear: number[];
    debtPaymentsByYear: number[];
  };
  options: OptionResult[];
  /** Input checks: empty when nothing needs a second look. */
  warnings: ModelWarning[];
}

/** One option from the fast path (floating point, no ledger detail). */
export interface FastOptionResult {
  id: string;
  npv: number;
  /** NPV of this option's flows minus the current option's; null for the current option. */
  incrementalNpv: number | null;
  irr: number | null;
  /** Incremental IRR, only when asked for ({ incrementalIrr: true }); otherwise null. */
  incrementalIrr: number | null;
  /** Lowest whole-farm coverage over the horizon; null when no year has debt service. */
  minCoverage: number | null;
  minProjectCoverage: number | null;
  /** Years whose whole-farm coverage is below the lender's threshold (count). */
  yearsBelowThreshold: number;
}

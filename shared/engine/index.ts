/**
 * The engine's public surface: callers outside shared/engine (screens, stores, the worker, the
 * server, the CLI, the workbook, starting points) import from here and nowhere deeper. Each name
 * is documented where it is defined; docs/model.md has the formulas.
 */

// Evaluation of a scenario: the full ledger, the fast path and the scenario ready for shocks.
export { anchoredForShocks, currentOptionOf, evaluateCore, evaluateNpvOnly, evaluateScenario, evaluateStressYears, type FastEvaluationOptions } from './evaluate';
export type {
  CoreOptionResult,
  CoreScenarioResults,
  CoverageYear,
  DecisionFigures,
  ExpansionSplit,
  FastOptionResult,
  IncrementalResult,
  IrrReason,
  LabourHours,
  ManureYear,
  Metrics,
  ModelWarning,
  OptionResult,
  PaybackReason,
  ScenarioResults,
  SizingResult,
  YearLine,
} from './results';

// Results split for reading: the summary every read sends and the heavy yearly/loan detail; the kept results' key.
export { joinOption, splitResults, type OptionDetail, type OptionSummary, type ScenarioResultsSummary } from './result-parts';
export { ENGINE_VERSION, resultsCacheKey } from './version';

// The herd per year as an option plans it (head, [0] = today).
export { cowsPerYear } from './herd-size';

// The lender's stress table: its shocks and results.
export { STRESS_TESTS, type StressResult, type StressYears } from './stress';

// Risk: sensitivity and the seeded Monte Carlo.
export {
  DEFAULT_MILK_FEED_CORRELATION,
  mergeMonteCarloSamples,
  monteCarloBlockCount,
  prepareMonteCarlo,
  runMonteCarlo,
  runMonteCarloBlocks,
  type MonteCarloResult,
  type MonteCarloSamples,
  type MonteCarloSettings,
  type OptionMonteCarloResult,
  type PreparedMonteCarlo,
} from './risk/monte-carlo';
export { sensitivity, type InputSwing, type SensitivityRanges, type SensitivityResult } from './risk/sensitivity';

// Finance primitives: present value, series, IRR, payback and the loan types.
export { presentValue, signChanges } from './discounting';
export { cumulative, discount, irr, mirr, npv, paybackYears, type LoanPayment, type LoanSchedule } from './finance';

// Sizing helpers and the pieces the starting points size options with.
export { beddingToStorageM3PerYear, beddingTonnesPerYear } from './bedding';
export { capitalAssets, type SizedQuantities } from './capital';
export {
  checkStallDimensions,
  checkWater,
  manureStorageVolumeM3,
  MIN_TROUGH_PERIMETER_PER_COW_M,
  MIN_WATERERS_PER_GROUP,
  STALL_GUIDANCE,
  stallsFor,
  type Range,
  type StallCheck,
  type WaterCheck,
} from './sizing';

// Coverage ties and price growth as the screens read them.
export { COVERAGE_TIE } from './coverage';
export { milkLagsFeedBy, resolvedGrowth } from './growth';

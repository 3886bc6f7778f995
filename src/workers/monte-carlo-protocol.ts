/** Messages between the page and the Monte Carlo worker; every message carries the run it belongs to. */
import type { MonteCarloResult, MonteCarloSettings } from '@shared/engine';
import type { Scenario } from '@shared/schema';

export type MonteCarloWorkerRequest =
  | { type: 'start'; runId: number; scenario: Scenario; settings: MonteCarloSettings }
  | { type: 'cancel'; runId: number };

export type MonteCarloWorkerMessage =
  | { type: 'progress'; runId: number; done: number; total: number }
  | { type: 'done'; runId: number; result: MonteCarloResult }
  | { type: 'error'; runId: number; message: string };

/** Everything a lender workbook needs from one scenario, computed and written in one call (the CLI's --xlsx). */
import { evaluateScenario, runMonteCarlo, type ScenarioResults, sensitivity } from '../../shared/engine/index.js';
import type { Scenario } from '../../shared/schema/index.js';
import { buildLenderWorkbook, writeWorkbook, type LenderWorkbookInput } from './build-workbook.js';

export type WorkbookDetails = Pick<LenderWorkbookInput, 'farm' | 'version' | 'preparedBy' | 'created'>;

/**
 * Evaluates the scenario (unless results are given), runs its sensitivity and its Monte Carlo
 * with the scenario's own settings (seeded, so the same file gives the same workbook), and
 * writes the lender workbook to `path`.
 */
export async function exportLenderWorkbookFile(
  scenario: Scenario,
  path: string,
  details: WorkbookDetails,
  results: ScenarioResults = evaluateScenario(scenario),
): Promise<void> {
  const workbook = await buildLenderWorkbook({
    scenario,
    results,
    ...details,
    risk: { sensitivity: sensitivity(scenario), monteCarlo: runMonteCarlo(scenario) },
  });
  await writeWorkbook(workbook, path);
}

import { readFile } from 'node:fs/promises';
import { parseArgs } from 'node:util';
import { scenarioSchema, type Scenario } from '../../shared/schema';
import { evaluateScenario } from '../../shared/engine';
import type { IncrementalResult, OptionResult, ScenarioResults } from '../../shared/engine';
import { exportLenderWorkbookFile } from '../workbook/export-file';

/** Exit codes: 0 success, 1 the workbook could not be written, 2 bad usage or bad scenario file. */
const EXIT_OK = 0;
const EXIT_WRITE_FAILED = 1;
const EXIT_BAD_INPUT = 2;

const USAGE =
  'Usage: npm run evaluate -- <scenario.json> [--json] [--xlsx out.xlsx [--farm NAME] [--location PLACE] [--prepared-by NAME] [--label VERSION]]';

/** Outcome of reading and validating a scenario file: the scenario, or the lines to print. */
type LoadResult = { ok: true; scenario: Scenario } | { ok: false; lines: string[] };

/** Reads, parses and validates a scenario file; every problem becomes one line naming the field. */
async function loadScenarioFile(path: string): Promise<LoadResult> {
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error);
    return { ok: false, lines: [`Cannot read scenario file ${path}: ${reason}`] };
  }
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error);
    return { ok: false, lines: [`Scenario file ${path} is not valid JSON: ${reason}`] };
  }
  const parsed = scenarioSchema.safeParse(json);
  if (!parsed.success) {
    return {
      ok: false,
      lines: parsed.error.issues.map((issue) => `${issue.path.length > 0 ? issue.path.join('.') : '(scenario)'}: ${issue.message}`),
    };
  }
  return { ok: true, scenario: parsed.data };
}

/** Formats money in the scenario's currency and locale, whole units (a summary, not the ledger). */
function moneyFormatter(locale: string, currency: string): (amount: number) => string {
  const format = new Intl.NumberFormat(locale, { style: 'currency', currency, maximumFractionDigits: 0 });
  return (amount) => format.format(amount);
}

const percent = (rate: number | null, reason?: string): string =>
  rate === null ? `n/a${reason ? ` (${reason})` : ''}` : `${(rate * 100).toFixed(2)} %`;

const years = (value: number | null, reason?: string): string =>
  value !== null ? `${value.toFixed(1)} years` : reason === 'no-net-investment' ? 'n/a (no outlay at year 0 to pay back)' : 'not within horizon';

// A borrowing IRR is the rate the change costs (it saves money first and pays it back later): lower is better.
const irrKindNote = (metrics: OptionResult | IncrementalResult): string =>
  metrics.irrKind === 'borrowing' ? ' (a borrowing rate: saves first, costs later; lower is better)' : '';

const ratio = (value: number | null | undefined): string => (value === null || value === undefined ? 'n/a' : value.toFixed(2));

/**
 * Readable summary that leads with the change against the current option (NPV, IRR, MIRR, the
 * paybacks, coverage beside project coverage, the lender's stress) and shows each option's own
 * flows only as the whole herd's margin.
 */
function formatSummary(scenario: Scenario, results: ScenarioResults): string {
  const money = moneyFormatter(scenario.locale, results.currency);
  const threshold = scenario.finance.coverageThreshold;
  const current = results.options.find((option) => option.current);
  const lines = [
    `${scenario.name} — ${results.options.length} option(s), ${results.horizonYears} years, ${results.currency}`,
    `Every option is measured against the current option, ${current?.name ?? 'the current option'}.`,
    '',
  ];
  const coverageLine = (option: OptionResult): string => {
    const lowest = option.lowestCoverage;
    const project = option.lowestProjectCoverage;
    const wholeFarm = lowest === null ? 'n/a (no debt service)' : `${lowest.value.toFixed(2)} in year ${lowest.year}${lowest.value < threshold ? ` — below the lender's ${threshold.toFixed(2)}` : ''}`;
    return `  Lowest coverage   whole farm ${wholeFarm}; project ${project === null ? 'n/a' : `${project.value.toFixed(2)} in year ${project.year}`}`;
  };
  for (const option of results.options) {
    const change = option.incremental;
    if (!change) continue;
    lines.push(`${option.name} — the change against ${current?.name ?? 'the current option'}`);
    lines.push(`  NPV of the change ${money(change.npv)}`);
    lines.push(`  IRR               ${percent(change.irr, change.irrReason)}${irrKindNote(change)}`);
    lines.push(`  MIRR              ${percent(change.mirr)}`);
    lines.push(`  Payback           ${years(change.paybackYears, change.paybackReason)} (with the year-${results.horizonYears} salvage and herd value)`);
    const recovered = change.operationsRecoveredShare;
    lines.push(
      `  From operations   ${years(change.paybackFromOperationsYears, change.paybackFromOperationsReason)}${recovered !== null && change.paybackFromOperationsYears === null ? ` (operations recover ${Math.round(recovered * 100)} % of the outlay)` : ''}`,
    );
    if (change.split) {
      // The barn as planned with today's herd in it, and what the herd change adds (docs/model.md "Housing and expansion").
      lines.push(`  Housing, today's herd NPV ${money(change.split.housingTodaysHerd.npv)}; herd change NPV ${money(change.split.expansion.npv)}`);
    }
    lines.push(coverageLine(option));
    const breakEven = change.breakEvenMilkPrice;
    lines.push(`  Break-even milk price ${breakEven === null ? 'none in range' : `${breakEven.toFixed(3)} ${results.currency} per kg`} (NPV of the change = 0)`);
    const cover = option.breakEvenMilkPriceForCoverage;
    lines.push(`  Milk price for whole-farm coverage 1.00: ${cover.atOne === null ? 'none in range' : cover.atOne.toFixed(3)}; ${threshold.toFixed(2)}: ${cover.atThreshold === null ? 'none in range' : cover.atThreshold.toFixed(3)} ${results.currency} per kg`);
    lines.push("  Lender's stress   lowest whole farm / project coverage, NPV of the change, years below threshold");
    for (const row of option.stress) {
      lines.push(`    ${row.label.padEnd(46)} ${ratio(row.lowestCoverage).padStart(6)} ${ratio(row.lowestProjectCoverage).padStart(6)} ${(row.npvAgainstCurrent === null ? 'n/a' : money(row.npvAgainstCurrent)).padStart(13)} ${String(row.yearsBelowThreshold).padStart(3)}`);
    }
    if (option.sourcesAndUses.termPastLifeWarning) lines.push(`  Warning: ${option.sourcesAndUses.termPastLifeWarning}`);
    lines.push(`  Whole herd's margin under this option (not a return on the barn): NPV ${money(option.npv)}`);
    lines.push('');
  }
  if (current) {
    lines.push(`${current.name} (current option)`);
    lines.push(coverageLine(current));
    if (results.currentOptionCarriesCapital) lines.push('  The current option itself buys new capital: its loan and its margin are both in its coverage.');
    lines.push(`  Whole herd's margin under this option: NPV ${money(current.npv)}`);
    lines.push('');
  }
  return lines.join('\n');
}

/** Runs the command line; returns the exit code (stdout gets results, stderr gets problems). */
async function main(argv: readonly string[]): Promise<number> {
  let parsed;
  try {
    parsed = parseArgs({
      args: [...argv],
      allowPositionals: true,
      options: {
        json: { type: 'boolean', default: false },
        xlsx: { type: 'string' },
        // Cover details of the lender workbook; a scenario file does not carry them.
        farm: { type: 'string', default: 'Farm not named' },
        location: { type: 'string', default: 'not given' },
        'prepared-by': { type: 'string', default: 'Byrecast command line' },
        label: { type: 'string' },
      },
    });
  } catch (error) {
    process.stderr.write(`${error instanceof Error ? error.message : String(error)}\n${USAGE}\n`);
    return EXIT_BAD_INPUT;
  }
  const [path, ...extra] = parsed.positionals;
  if (path === undefined || extra.length > 0) {
    process.stderr.write(`${path === undefined ? 'Missing the scenario file.' : `Unexpected arguments: ${extra.join(' ')}`}\n${USAGE}\n`);
    return EXIT_BAD_INPUT;
  }
  const loaded = await loadScenarioFile(path);
  if (!loaded.ok) {
    process.stderr.write(`${loaded.lines.join('\n')}\n`);
    return EXIT_BAD_INPUT;
  }
  const results = evaluateScenario(loaded.scenario);
  process.stdout.write(parsed.values.json ? `${JSON.stringify(results)}\n` : `${formatSummary(loaded.scenario, results)}\n`);
  const { xlsx, farm, location, label } = parsed.values;
  if (xlsx !== undefined) {
    try {
      await exportLenderWorkbookFile(
        loaded.scenario,
        xlsx,
        { farm: { name: farm, location }, version: label ?? `scenario file ${path}`, preparedBy: parsed.values['prepared-by'], created: new Date() },
        results,
      );
    } catch (error) {
      process.stderr.write(`Cannot write the lender workbook ${xlsx}: ${error instanceof Error ? error.message : String(error)}\n`);
      return EXIT_WRITE_FAILED;
    }
    // stderr, so that --json output on stdout stays pure JSON.
    process.stderr.write(`Lender workbook written to ${xlsx}\n`);
  }
  return EXIT_OK;
}

process.exitCode = await main(process.argv.slice(2));

import { readFile } from 'node:fs/promises';
import { parseArgs } from 'node:util';
import { scenarioSchema, type Scenario } from '../../shared/schema';
import { evaluateScenario } from '../../shared/engine/evaluate';
import type { IncrementalResult, OptionResult, ScenarioResults } from '../../shared/engine/results';
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

function metricLines(metrics: OptionResult | IncrementalResult, money: (amount: number) => string, indent: string): string[] {
  return [
    `${indent}NPV             ${money(metrics.npv)}`,
    `${indent}IRR             ${percent(metrics.irr, metrics.irrReason)}${irrKindNote(metrics)}`,
    `${indent}Payback         ${years(metrics.paybackYears, metrics.paybackReason)}`,
  ];
}

/** Readable per-option summary: NPV, IRR, payback, lowest coverage, and the change against the current option. */
function formatSummary(scenario: Scenario, results: ScenarioResults): string {
  const money = moneyFormatter(scenario.locale, results.currency);
  const threshold = scenario.finance.coverageThreshold;
  const lines = [`${scenario.name} — ${results.options.length} option(s), ${results.horizonYears} years, ${results.currency}`, ''];
  for (const option of results.options) {
    lines.push(`${option.name}${option.current ? ' (current option)' : ''}`);
    lines.push(...metricLines(option, money, '  '));
    const lowest = option.lowestCoverage;
    lines.push(
      `  Lowest coverage ${lowest === null ? 'n/a (no debt service)' : `${lowest.value.toFixed(2)} in year ${lowest.year}${lowest.value < threshold ? ` — below the lender's ${threshold.toFixed(2)}` : ''}`}`,
    );
    if (option.incremental) {
      lines.push('  Against the current option:');
      lines.push(...metricLines(option.incremental, money, '    '));
      const breakEven = option.incremental.breakEvenMilkPrice;
      lines.push(`    Break-even milk price ${breakEven === null ? 'none in range' : `${breakEven.toFixed(3)} ${results.currency} per kg`}`);
    }
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

/**
 * The lender workbook: an XLSX whose key results are live formulas over the assumption and
 * cash-flow cells, each written with the engine's value as its cached result.
 */
import type { Writable } from 'node:stream';
import ExcelJS from 'exceljs';
import { resolvedGrowth, type ScenarioResults } from '../../shared/engine/index.js';
import type { Scenario } from '../../shared/schema/index.js';
import type { CapitalLineQuotes } from '../../shared/schema/documents.js';
import { addAssumptionsSheet, ASSUMPTIONS_SHEET } from './assumptions.js';
import { addCashFlowSheet } from './cash-flows.js';
import { addComparisonSheet, COMPARISON_SHEET } from './comparison.js';
import { layoutOptions, type WorkbookContext } from './context.js';
import { COVER_SHEET, fillCoverSheet } from './cover.js';
import { addCoverageSheet, COVERAGE_SHEET } from './coverage.js';
import { currencyFormat } from './layout.js';
import { addLoanSheets, LOAN_BY_YEAR_SHEET, LOAN_PAYMENTS_SHEET } from './loan.js';
import { addRiskSheet, RISK_SHEET, type WorkbookRisk } from './risk.js';
import { fillStressSheet, STRESS_SHEET } from './stress.js';
import { addStressYearsSheet, STRESS_YEARS_SHEET } from './stress-years.js';

export type { WorkbookRisk } from './risk.js';

export interface LenderWorkbookInput {
  scenario: Scenario;
  /** evaluateScenario(scenario): the workbook's cached values and the values its lines hold. */
  results: ScenarioResults;
  farm: { name: string; location: string };
  /** Version label of the scenario, e.g. "v3" or "Version 3 of 2026-11-30". */
  version: string;
  preparedBy: string;
  /** Export time; the document's created date and the cover's date (the engine has no clock). */
  created: Date;
  risk?: WorkbookRisk;
  /** Quotes on the scenario's capital lines (documents with an amount); their lines' costs are tagged "Quote". */
  quotes?: readonly CapitalLineQuotes[];
}

/**
 * Builds the lender workbook in memory: cover, assumptions, one cash-flow sheet per option,
 * loan schedule by year and by payment, coverage, comparison and risk. Money in the scenario's
 * currency (nominal); formulas carry the engine's values as cached results.
 */
export async function buildLenderWorkbook(input: LenderWorkbookInput): Promise<ExcelJS.Workbook> {
  const { results } = input;
  // The sheets show and compute with every growth rate the engine used, general inflation where the farm entered none.
  const scenario: Scenario = { ...input.scenario, herd: { ...input.scenario.herd, growth: resolvedGrowth(input.scenario.herd.growth) } };
  if (results.options.length !== scenario.options.length) {
    throw new RangeError(`results: ${results.options.length} option result(s) for ${scenario.options.length} option(s); evaluate the same scenario`);
  }
  const workbook = new ExcelJS.Workbook();
  workbook.creator = 'Byrecast';
  workbook.lastModifiedBy = 'Byrecast';
  workbook.title = `Lender workbook — ${input.farm.name} — ${scenario.name}`;
  workbook.subject = `Dairy housing investment case: ${scenario.options.map((o) => o.name).join(', ')}`;
  workbook.keywords = 'Byrecast; lender workbook; NPV; IRR; DSCR';
  workbook.category = 'Investment appraisal';
  workbook.company = input.farm.name;
  workbook.description = `Version ${input.version}, prepared by ${input.preparedBy}. Planning estimates, not financial advice.`;
  workbook.created = input.created;
  workbook.modified = input.created;

  const options = layoutOptions(results);
  const current = options.find((o) => o.result.current) ?? options[0];
  if (!current) throw new RangeError('results: no options to export');
  const context: WorkbookContext = {
    workbook,
    scenario,
    results,
    horizon: results.horizonYears,
    formats: {
      money: currencyFormat(results.currency, scenario.locale, 2),
      moneyWhole: currencyFormat(results.currency, scenario.locale, 0),
    },
    options,
    current,
    quotes: new Map(
      (input.quotes ?? [])
        .filter((q) => q.quoted && q.quoteTotal !== null)
        .map((q) => [q.capitalLineId, { total: q.quoteTotal ?? 0, files: q.documents.filter((d) => d.quoteAmount !== null).map((d) => d.fileName) }]),
    ),
  };

  const cover = workbook.addWorksheet(COVER_SHEET);
  addAssumptionsSheet(context);
  addComparisonSheet(context);
  for (const layout of options) addCashFlowSheet(context, layout);
  const loans = addLoanSheets(context);
  addCoverageSheet(context, loans);
  // The stress table comes first in the file; its formulas read the yearly rows built after it.
  const stress = workbook.addWorksheet(STRESS_SHEET);
  fillStressSheet(stress, context, addStressYearsSheet(context));
  addRiskSheet(context, input.risk);
  fillCoverSheet(cover, context, {
    farm: input.farm,
    version: input.version,
    preparedBy: input.preparedBy,
    created: input.created,
    sheets: [
      { name: ASSUMPTIONS_SHEET, what: 'Every input with its unit and source; the named inputs the formulas use.' },
      { name: COMPARISON_SHEET, what: "The change against the current option first (NPV, IRR, MIRR, both paybacks), coverage, capital and financing; the whole herd's margin last." },
      ...options.map((o) => ({ name: o.cashFlowSheet, what: `Yearly cash flow, discounting and metrics of "${o.result.name}".` })),
      { name: LOAN_BY_YEAR_SHEET, what: 'Loan of each option per year: payments, interest, principal, closing balance.' },
      { name: LOAN_PAYMENTS_SHEET, what: 'The same loan payment by payment (level payment via PMT()).' },
      { name: COVERAGE_SHEET, what: 'Project and whole-farm debt-service coverage per year, against the lender threshold.' },
      { name: STRESS_SHEET, what: "The lender's stress test per option (milk −10 % and −20 %, interest +2 points, feed +10 %, capital +15 %, milk −10 % with interest +2) and the sources and uses of funds." },
      { name: STRESS_YEARS_SHEET, what: 'Each shock year by year: the change in project cash flow and the whole-farm cash and debt service (engine values), and whole-farm and project coverage per year as live ratios.' },
      { name: RISK_SHEET, what: 'Sensitivity of the NPV of the change to each key input; the Monte Carlo chance that the change loses money and its percentiles.' },
    ],
  });
  return workbook;
}

/** Writes the workbook as XLSX to a file path or a stream (e.g. an HTTP response). */
export async function writeWorkbook(workbook: ExcelJS.Workbook, target: string | Writable): Promise<void> {
  if (typeof target === 'string') await workbook.xlsx.writeFile(target);
  else await workbook.xlsx.write(target);
}

/** Download file name for the workbook: farm, scenario and version, safe for a Content-Disposition header. */
export function workbookFileName(farmName: string, scenarioName: string, version: string): string {
  const slug = (text: string) =>
    text
      .normalize('NFKD')
      .replace(/[^\w\s-]/g, '')
      .trim()
      .replace(/\s+/g, '-')
      .toLowerCase()
      .slice(0, 40);
  return `${[slug(farmName), slug(scenarioName), slug(version)].filter(Boolean).join('_')}_lender-workbook.xlsx`;
}

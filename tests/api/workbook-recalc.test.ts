/**
 * The lender workbook recalculated by an independent spreadsheet engine: LibreOffice Calc
 * (headless, forced to recalculate every formula on load) must reproduce the Byrecast engine's
 * results from the workbook's own formulas, and the cached values written into the file must
 * equal what LibreOffice computes. No database: it lives with the API tests because it drives
 * an outside program and takes tens of seconds.
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import ExcelJS from 'exceljs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluateScenario } from '../../shared/engine/evaluate';
import type { OptionResult, ScenarioResults } from '../../shared/engine/results';
import { runMonteCarlo } from '../../shared/engine/risk/monte-carlo';
import { sensitivity } from '../../shared/engine/risk/sensitivity';
import { scenarioSchema, type Scenario } from '../../shared/schema';
import { buildLenderWorkbook } from '../../server/workbook/build-workbook';
import { INPUT_NAMES } from '../../server/workbook/context';
import { recalculateWithLibreOffice } from '../helpers/libreoffice';

const CREATED = new Date('2026-11-30T09:00:00Z');
const CHANGED_RATES = { discountRate: 0.09, interestRate: 0.07 };

function demoScenario(name = 'cairnbrook-five-systems'): Scenario {
  const file = new URL(`../../scenarios/${name}.json`, import.meta.url);
  return scenarioSchema.parse(JSON.parse(readFileSync(file, 'utf8')));
}

type Read = number | string | null;

/** A cell's value as a spreadsheet shows it: the formula result, '' for an empty text result, '#ERR …' for an error. */
function shown(cell: ExcelJS.Cell): Read {
  const value = cell.value;
  if (value === null || value === undefined) return null;
  if (typeof value === 'number' || typeof value === 'string') return value;
  if (typeof value === 'object' && 'formula' in value) {
    // cell.value leaves out a result of 0; cell.result keeps it.
    const result = cell.result;
    if (result === undefined || result === null) return '';
    if (typeof result === 'object' && 'error' in result) return `#ERR ${String(result.error)}`;
    return result as number | string;
  }
  if (typeof value === 'object' && 'error' in value) return `#ERR ${String(value.error)}`;
  return String(value);
}

/** Values of a workbook-level defined name, row by row. */
function named(workbook: ExcelJS.Workbook, name: string): Read[] {
  const [range] = workbook.definedNames.getRanges(name).ranges;
  if (!range) throw new Error(`the workbook has no defined name ${name}`);
  const match = /^'?(.+?)'?!\$?([A-Z]+)\$?(\d+)(?::\$?([A-Z]+)\$?(\d+))?$/.exec(range);
  if (!match) throw new Error(`cannot read the range ${range} of ${name}`);
  const [, sheetName = '', fromCol = '', fromRow = '', toCol = fromCol, toRow = fromRow] = match;
  const sheet = workbook.getWorksheet(sheetName.replace(/''/g, "'"));
  if (!sheet) throw new Error(`${name} points at a missing sheet ${sheetName}`);
  const values: Read[] = [];
  const c1 = sheet.getColumn(fromCol).number;
  const c2 = sheet.getColumn(toCol).number;
  for (let r = Number(fromRow); r <= Number(toRow); r++) for (let c = c1; c <= c2; c++) values.push(shown(sheet.getCell(r, c)));
  return values;
}

function one(workbook: ExcelJS.Workbook, name: string): Read {
  return named(workbook, name)[0] ?? null;
}

/** Money agrees to the cent (docs/model.md: ledger money in cents). */
function expectMoney(actual: Read, expected: number, label: string): void {
  expect(typeof actual, `${label}: ${String(actual)}`).toBe('number');
  expect(Math.abs((actual as number) - expected), `${label}: ${String(actual)} vs ${expected}`).toBeLessThanOrEqual(0.01 + 1e-9);
}

/** Rates, ratios and years agree to 1e-6; a metric the engine cannot compute (null) shows as text. */
function expectRate(actual: Read, expected: number | null, label: string): void {
  if (expected === null) {
    expect(typeof actual === 'string' && !actual.startsWith('#ERR'), `${label}: ${String(actual)} should be text`).toBe(true);
    return;
  }
  expect(typeof actual, `${label}: ${String(actual)}`).toBe('number');
  expect(Math.abs((actual as number) - expected), `${label}: ${String(actual)} vs ${expected}`).toBeLessThanOrEqual(1e-6);
}

/** Every formula-bearing key cell of one option against the engine's JSON result. */
function checkOption(workbook: ExcelJS.Workbook, n: number, option: OptionResult, horizon: number): void {
  const name = (key: string) => `Opt${n}_${key}`;
  const label = (key: string, t?: number) => `${option.name} ${key}${t === undefined ? '' : ` year ${t}`}`;
  const rows: [string, (t: number) => number][] = [
    ['NetCashFlow', (t) => option.cashFlows[t] ?? NaN],
    ['OperatingMargin', (t) => option.years[t]?.operatingMargin ?? NaN],
    ['MilkIncome', (t) => option.years[t]?.milkIncome ?? NaN],
    ['CashForDebtService', (t) => option.years[t]?.cashAvailableForDebtService ?? NaN],
  ];
  for (const [key, expected] of rows) {
    const values = named(workbook, name(key));
    expect(values).toHaveLength(horizon + 1);
    values.forEach((value, t) => expectMoney(value, expected(t), label(key, t)));
  }
  expectMoney(one(workbook, name('NPV')), option.npv, label('NPV'));
  expectRate(one(workbook, name('IRR')), option.irr, label('IRR'));
  expectRate(one(workbook, name('MIRR')), option.mirr, label('MIRR'));
  expectRate(one(workbook, name('Payback')), option.paybackYears, label('payback'));
  expectRate(one(workbook, name('DiscountedPayback')), option.discountedPaybackYears, label('discounted payback'));
  expectRate(one(workbook, name('ProfitabilityIndex')), option.profitabilityIndex, label('profitability index'));

  if (option.incremental) {
    named(workbook, name('IncrementalNetCashFlow')).forEach((value, t) =>
      expectMoney(value, option.incremental?.cashFlows[t] ?? NaN, label('incremental flow', t)),
    );
    expectMoney(one(workbook, name('IncrementalNPV')), option.incremental.npv, label('incremental NPV'));
    expectRate(one(workbook, name('IncrementalIRR')), option.incremental.irr, label('incremental IRR'));
  }

  if (option.loan.amount > 0) {
    expectMoney(one(workbook, name('LoanAmount')), option.loan.amount, label('loan amount'));
    // No interest-only months in the demo: the first payment is the level payment.
    expectMoney(one(workbook, name('LevelPayment')), option.loan.payments[0]?.payment ?? NaN, label('level payment (PMT)'));
    const byYear: [string, (y: number) => number][] = [
      ['LoanInterestByYear', (y) => option.loan.years[y]?.interest ?? NaN],
      ['LoanPrincipalByYear', (y) => option.loan.years[y]?.principal ?? NaN],
      ['LoanBalanceByYear', (y) => option.loan.years[y]?.closingBalance ?? NaN],
    ];
    for (const [key, expected] of byYear) {
      const values = named(workbook, name(key));
      expect(values).toHaveLength(option.loan.years.length);
      values.forEach((value, y) => expectMoney(value, expected(y), label(key, y + 1)));
    }
  }

  const debtService = named(workbook, name('DebtService'));
  const wholeFarm = named(workbook, name('WholeFarmCoverage'));
  expect(wholeFarm).toHaveLength(horizon);
  for (let t = 1; t <= horizon; t++) {
    expectMoney(debtService[t - 1] ?? null, option.loan.years[t - 1]?.payment ?? 0, label('debt service', t));
    const coverage = option.coverage[t - 1];
    expectRate(wholeFarm[t - 1] ?? null, coverage?.wholeFarm ?? null, label('whole-farm DSCR', t));
  }
  if (!option.current) {
    named(workbook, name('ProjectCoverage')).forEach((value, i) => expectRate(value, option.coverage[i]?.project ?? null, label('project DSCR', i + 1)));
  }
  expectRate(one(workbook, name('LowestCoverage')), option.lowestCoverage?.value ?? null, label('lowest DSCR'));
  expectRate(one(workbook, name('LowestCoverageYear')), option.lowestCoverage?.year ?? null, label('year of lowest DSCR'));
  expectRate(one(workbook, name('YearsBelowThreshold')), option.yearsBelowCoverageThreshold.length, label('years below threshold'));
}

function checkAllOptions(workbook: ExcelJS.Workbook, results: ScenarioResults): void {
  results.options.forEach((option, index) => checkOption(workbook, index + 1, option, results.horizonYears));
}

/**
 * The Stress sheet's live cells (base case, then each shock in the engine's order) against the
 * engine's stress rows: NPV of the change, lowest whole-farm and project coverage, years below the threshold.
 */
function checkStress(workbook: ExcelJS.Workbook, results: ScenarioResults, parts: { npv: boolean; coverage: boolean } = { npv: true, coverage: true }): number {
  let checked = 0;
  results.options.forEach((option, index) => {
    const n = index + 1;
    const lowest = named(workbook, `Opt${n}_StressLowestCoverage`);
    const lowestProject = named(workbook, `Opt${n}_StressLowestProjectCoverage`);
    const npv = named(workbook, `Opt${n}_StressNPV`);
    const below = named(workbook, `Opt${n}_StressYearsBelowThreshold`);
    const rows = [
      {
        label: 'base case',
        lowestCoverage: option.lowestCoverage?.value ?? null,
        lowestProjectCoverage: option.lowestProjectCoverage?.value ?? null,
        npvAgainstCurrent: option.incremental?.npv ?? null,
        yearsBelowThreshold: option.yearsBelowCoverageThreshold.length,
      },
      ...option.stress,
    ];
    expect(lowest).toHaveLength(rows.length);
    rows.forEach((row, k) => {
      const label = `${option.name} stress ${row.label}`;
      if (parts.coverage) {
        expectRate(lowest[k] ?? null, row.lowestCoverage, `${label} lowest coverage`);
        expectRate(lowestProject[k] ?? null, row.lowestProjectCoverage, `${label} lowest project coverage`);
        expectRate(below[k] ?? null, row.yearsBelowThreshold, `${label} years below threshold`);
      }
      if (parts.npv) {
        if (row.npvAgainstCurrent === null) expect(npv[k], `${label} NPV`).toBe('n/a');
        else expectMoney(npv[k] ?? null, row.npvAgainstCurrent, `${label} NPV of the change`);
      }
      checked += 1;
    });
  });
  return checked;
}

async function setNamedInput(workbook: ExcelJS.Workbook, name: string, value: number): Promise<void> {
  const [range] = workbook.definedNames.getRanges(name).ranges;
  const match = range ? /^'?(.+?)'?!\$?([A-Z]+)\$?(\d+)$/.exec(range) : null;
  if (!match) throw new Error(`no single-cell defined name ${name}`);
  const [, sheetName = '', column = '', row = ''] = match;
  const sheet = workbook.getWorksheet(sheetName);
  if (!sheet) throw new Error(`no sheet ${sheetName}`);
  sheet.getCell(`${column}${row}`).value = value;
}

describe('lender workbook recalculated by LibreOffice, the independent reference', { timeout: 300_000 }, () => {
  const dir = mkdtempSync(join(tmpdir(), 'byrecast-workbook-'));
  const scenario = demoScenario();
  const results = evaluateScenario(scenario);
  const changedResults = evaluateScenario({ ...scenario, finance: { ...scenario.finance, ...CHANGED_RATES } });
  let written: ExcelJS.Workbook;
  let recalculated: ExcelJS.Workbook;
  let recalculatedWithNewRates: ExcelJS.Workbook;
  let fileBytes: Buffer;
  // The second demo, whose years of coverage lie close together.
  const levelScenario = demoScenario('cairnbrook-mattress-or-sand');
  const levelResults = evaluateScenario(levelScenario);
  let recalculatedLevel: ExcelJS.Workbook;
  // The first demo with a two-year milk price trough and a feed spike (the yearly price index),
  // herd costs per cow-year, a milk quality premium on one option and 20 added cows on another.
  const indexedScenario = scenarioSchema.parse({
    ...scenario,
    herd: {
      ...scenario.herd,
      yearlyPriceIndex: { milkPrice: [0.82, 0.9, 1], feed: [1.12, 1.05] },
      otherVariableCostPerCowYear: 180,
      milkingHoursPerCowYear: 9,
      replacementRate: 0.28,
      firstLactationYieldFactor: 0.82,
    },
    options: scenario.options.map((option, index) => {
      if (index === 1) return { ...option, milkQualityPricePerKg: 0.006 };
      if (index === 2) return { ...option, herdChange: { ...option.herdChange, addedCows: 20 } };
      return option;
    }),
  });
  const indexedResults = evaluateScenario(indexedScenario);
  let recalculatedIndexed: ExcelJS.Workbook;

  beforeAll(async () => {
    const workbook = await buildLenderWorkbook({
      scenario,
      results,
      farm: { name: 'Cairnbrook Farm', location: 'Lower Tessly (invented)' },
      version: 'Version 1',
      preparedBy: 'Selka Dunmore',
      created: CREATED,
      risk: { sensitivity: sensitivity(scenario), monteCarlo: runMonteCarlo(scenario, { ...scenario.risk.monteCarlo, draws: 200 }) },
    });
    const original = join(dir, 'demo.xlsx');
    await workbook.xlsx.writeFile(original);
    fileBytes = readFileSync(original);

    // The lender's edit: new discount and interest rates typed into the named cells, nothing else.
    const edited = new ExcelJS.Workbook();
    await edited.xlsx.readFile(original);
    await setNamedInput(edited, INPUT_NAMES.discountRate, CHANGED_RATES.discountRate);
    await setNamedInput(edited, INPUT_NAMES.interestRate, CHANGED_RATES.interestRate);
    const editedPath = join(dir, 'demo-new-rates.xlsx');
    await edited.xlsx.writeFile(editedPath);

    const level = await buildLenderWorkbook({
      scenario: levelScenario,
      results: levelResults,
      farm: { name: 'Cairnbrook Farm', location: 'Lower Tessly (invented)' },
      version: 'Version 1',
      preparedBy: 'Selka Dunmore',
      created: CREATED,
    });
    const levelPath = join(dir, 'level.xlsx');
    await level.xlsx.writeFile(levelPath);

    const indexed = await buildLenderWorkbook({
      scenario: indexedScenario,
      results: indexedResults,
      farm: { name: 'Cairnbrook Farm', location: 'Lower Tessly (invented)' },
      version: 'Version 2',
      preparedBy: 'Selka Dunmore',
      created: CREATED,
    });
    const indexedPath = join(dir, 'indexed.xlsx');
    await indexed.xlsx.writeFile(indexedPath);

    written = new ExcelJS.Workbook();
    await written.xlsx.readFile(original);
    [recalculated, recalculatedWithNewRates, recalculatedLevel, recalculatedIndexed] = (await recalculateWithLibreOffice([original, editedPath, levelPath, indexedPath], dir)) as [
      ExcelJS.Workbook,
      ExcelJS.Workbook,
      ExcelJS.Workbook,
      ExcelJS.Workbook,
    ];
  }, 300_000);

  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('reproduces every key result of the engine from the formulas: cash flows, NPV, IRR, payback, loan, DSCR', () => {
    checkAllOptions(recalculated, results);
  });

  it('reproduces the stress table from live formulas over the shocked years: NPV of the change, lowest whole-farm and project coverage, years below', () => {
    // Six shocks and the base case for each of the five options (shared/engine/stress.ts STRESS_TESTS).
    expect(checkStress(recalculated, results)).toBe(5 * 7);
    expect(checkStress(recalculatedLevel, levelResults)).toBe(2 * 7);
  });

  it('moves the stressed NPVs of the change with a new discount rate, as the engine does', () => {
    // Pre-tax demo: the shocked project flows do not depend on the interest rate, only their discounting moves.
    expect(scenario.finance.taxRate).toBe(0);
    const sand = results.options.findIndex((o) => o.id === 'sand-freestall');
    const milk10 = (r: ScenarioResults) => r.options[sand]?.stress.find((row) => row.id === 'milk-10')?.npvAgainstCurrent ?? NaN;
    expect(Math.abs(milk10(changedResults) - milk10(results))).toBeGreaterThan(1000);
    checkStress(recalculatedWithNewRates, changedResults, { npv: true, coverage: false });
  });

  it('shades coverage below the threshold on the Comparison sheet with a live rule and shows it as ×', () => {
    const sheet = recalculated.getWorksheet('Comparison');
    expect(sheet).toBeDefined();
    const threshold = scenario.finance.coverageThreshold;
    const labelRow = (label: string): number => {
      let found = 0;
      sheet?.eachRow((row, r) => {
        if (row.getCell(1).value === label) found = r;
      });
      expect(found, label).toBeGreaterThan(0);
      return found;
    };
    const rules = (sheet as unknown as { conditionalFormattings: { ref: string; rules: { formulae?: string[] }[] }[] }).conditionalFormattings ?? [];
    const engineValue = {
      'Lowest whole-farm coverage': (o: OptionResult) => o.lowestCoverage?.value ?? null,
      'Lowest project coverage (the change)': (o: OptionResult) => o.lowestProjectCoverage?.value ?? null,
    };
    const shaded: boolean[] = [];
    for (const [label, valueOf] of Object.entries(engineValue)) {
      const r = labelRow(label);
      // The rule LibreOffice wrote back after reading it: on this row, against the named threshold cell.
      const rule = rules.find((cf) => cf.ref.replace(/\$/g, '') === `B${r}:${String.fromCharCode(65 + results.options.length)}${r}`);
      expect(rule, `${label}: conditional format on row ${r}`).toBeDefined();
      expect(rule?.rules[0]?.formulae?.[0]).toMatch(new RegExp(`^AND\\(ISNUMBER\\(B${r}\\),B${r}<${INPUT_NAMES.coverageThreshold}\\)$`));
      results.options.forEach((option, i) => {
        const cell = sheet?.getCell(r, i + 2);
        const expected = valueOf(option);
        if (expected === null) return;
        expect(cell?.numFmt, `${label} ${option.name} format`).toContain('×');
        const value = shown(cell as ExcelJS.Cell);
        expectRate(value, expected, `${label} ${option.name}`);
        // The rule's condition on LibreOffice's value shades exactly where the app marks coverage below the threshold.
        shaded.push(typeof value === 'number' && value < threshold);
        expect(typeof value === 'number' && value < threshold, `${label} ${option.name}`).toBe(expected < threshold);
      });
    }
    // The demo has both: whole-farm coverage above 1.25 for every option, project coverage below it.
    expect(shaded).toContain(true);
    expect(shaded).toContain(false);
  });

  it('finds the same year of lowest coverage as the app on the second demo too', () => {
    // The tie rule itself (equal lows to 1e-9 go to the earliest year) is checked on noisy ratios
    // in tests/unit/engine/model-tax.test.ts; here LibreOffice must land on the engine's year.
    checkAllOptions(recalculatedLevel, levelResults);
  });

  it('follows the yearly price index, the milk quality premium and the herd costs as the app does', () => {
    // docs/model.md "Yearly price index": year t's milk price is today's × growth × entry [t − 1], 1 past the list.
    const index = named(recalculatedIndexed, INPUT_NAMES.milkPriceIndex);
    expect(index).toHaveLength(indexedResults.horizonYears);
    expect(index.slice(0, 4)).toEqual([0.82, 0.9, 1, 1]);
    // The index and the premium move milk income: the workbook must not be reading the plain grown price.
    const plain = results.options[1]?.years[1]?.milkIncome ?? 0;
    const indexedIncome = indexedResults.options[1]?.years[1]?.milkIncome ?? 0;
    expect(indexedIncome).toBeLessThan(plain * 0.85);
    expect(indexedResults.options[2]?.incremental?.split).not.toBeNull();
    checkAllOptions(recalculatedIndexed, indexedResults);
    // docs/model.md "Housing and expansion": the Comparison sheet carries both parts, which add up to the change.
    const comparison = recalculatedIndexed.getWorksheet('Comparison');
    const rowOf = (label: string) => {
      let found = 0;
      comparison?.eachRow((row, number) => {
        if (row.getCell(1).value === label) found = number;
      });
      return found;
    };
    const housingRow = rowOf("NPV of the housing, today's herd");
    const expansionRow = rowOf('NPV of the expansion (the added cows)');
    expect(housingRow).toBeGreaterThan(0);
    indexedResults.options.forEach((option, index) => {
      if (!option.incremental?.split || !comparison) return;
      expectMoney(shown(comparison.getCell(housingRow, index + 2)), option.incremental.split.housingTodaysHerd.npv, `${option.name} housing NPV`);
      expectMoney(shown(comparison.getCell(expansionRow, index + 2)), option.incremental.split.expansion.npv, `${option.name} expansion NPV`);
    });
  });

  it('writes cached values equal to what LibreOffice recalculates, in every formula cell', () => {
    let formulas = 0;
    written.eachSheet((sheet) => {
      const other = recalculated.getWorksheet(sheet.name);
      expect(other, `sheet ${sheet.name} after recalculation`).toBeDefined();
      sheet.eachRow((row) =>
        row.eachCell((cell) => {
          if (cell.type !== ExcelJS.ValueType.Formula) return;
          formulas++;
          const cached = shown(cell);
          const fresh = other ? shown(other.getCell(cell.address)) : null;
          const where = `${sheet.name}!${cell.address} ${String((cell.value as ExcelJS.CellFormulaValue).formula)}`;
          if (typeof cached === 'number') {
            expect(typeof fresh, `${where}: ${String(fresh)}`).toBe('number');
            const money = cell.numFmt.includes('€');
            const tolerance = money ? 0.01 + 1e-9 : 1e-6 * Math.max(1, Math.abs(cached));
            expect(Math.abs((fresh as number) - cached), `${where}: cached ${cached}, LibreOffice ${String(fresh)}`).toBeLessThanOrEqual(tolerance);
          } else {
            expect(fresh, where).toBe(cached);
          }
        }),
      );
    });
    // Five options × 20 years of live lines, loan payments and coverage: thousands of formulas.
    expect(formulas).toBeGreaterThan(5000);
  });

  it('moves NPV, the loan schedule and coverage as the engine does when the lender changes the named rates', () => {
    // The demo is a pre-tax analysis; with tax the yearly tax line is an engine value that would not follow the interest rate.
    expect(scenario.finance.taxRate).toBe(0);
    const before = results.options[1];
    const after = changedResults.options[1];
    expect(Math.abs((after?.npv ?? 0) - (before?.npv ?? 0))).toBeGreaterThan(1000);
    checkAllOptions(recalculatedWithNewRates, changedResults);
  });

  it('names the inputs the formulas use on the Assumptions sheet, with the scenario values', () => {
    const expected: Record<string, number> = {
      [INPUT_NAMES.discountRate]: scenario.finance.discountRate,
      [INPUT_NAMES.interestRate]: scenario.finance.interestRate,
      [INPUT_NAMES.paymentsPerYear]: scenario.finance.paymentsPerYear,
      [INPUT_NAMES.termYears]: scenario.finance.termYears,
      [INPUT_NAMES.coverageThreshold]: scenario.finance.coverageThreshold,
      [INPUT_NAMES.milkPrice]: scenario.herd.milkPricePerKg,
      // The demo leaves milk price growth empty: the named cell holds general inflation, the rate the engine used.
      [INPUT_NAMES.milkPriceGrowth]: scenario.herd.growth.milkPrice ?? scenario.herd.growth.general,
      [INPUT_NAMES.existingCash]: scenario.herd.existingCashForDebtServicePerYear,
      [INPUT_NAMES.existingDebt]: scenario.herd.existingDebtPaymentsPerYear,
    };
    for (const [name, value] of Object.entries(expected)) {
      expect(written.definedNames.getRanges(name).ranges[0], name).toMatch(/^'?Assumptions'?!/);
      expect(one(recalculated, name), name).toBe(value);
    }
  });

  it('carries the document properties, landscape page setup, frozen headers, the cautions and no macros', () => {
    // docs/product.md (Lender package) and docs/product.md capability 8: document property block, A4/Letter landscape, frozen header rows, no macros.
    expect(written.creator).toBe('Byrecast');
    expect(written.title).toContain('Cairnbrook Farm');
    expect(written.created.toISOString()).toBe(CREATED.toISOString());
    expect(fileBytes.includes('vbaProject')).toBe(false);
    written.eachSheet((sheet) => {
      expect(sheet.pageSetup.orientation, sheet.name).toBe('landscape');
      expect(sheet.pageSetup.paperSize, sheet.name).toBe(9);
      expect(sheet.pageSetup.fitToPage, sheet.name).toBe(true);
      expect(sheet.pageSetup.printArea, sheet.name).toMatch(/^A\$?1:[A-Z]+\$?\d+$/);
      if (sheet.name !== 'Cover') expect(sheet.views[0]?.state, sheet.name).toBe('frozen');
    });
    const cover: string[] = [];
    written.getWorksheet('Cover')?.eachRow((row) => row.eachCell((cell) => cover.push(String(cell.value))));
    const text = cover.join('\n');
    // docs/product.md, "Cautions the product shows" (read).
    for (const phrase of ['planning estimates', 'hydrogen sulfide', 'local building codes', 'nutrient management plan']) expect(text).toContain(phrase);
    for (const detail of ['Cairnbrook Farm', 'Lower Tessly (invented)', scenario.name, 'Version 1', 'Selka Dunmore', '2026-11-30']) expect(text).toContain(detail);
  });
});

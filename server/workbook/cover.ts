/** The cover: who and what the workbook is about, how to read it, and the product's cautions. */
import type ExcelJS from 'exceljs';
import { OPTION_CAUTIONS } from '../../shared/cautions.js';
import { assumptionShare } from './assumptions.js';
import { INPUT_NAMES as N, type WorkbookContext } from './context.js';
import { BASE_FONT, COLOURS, fitWrappedRow, setupPrint, styleSection, styleTotal } from './layout.js';

export const COVER_SHEET = 'Cover';

/** The cautions Byrecast shows everywhere (docs/product.md), in the order it lists them. */
export const CAUTIONS = [
  'Results are planning estimates, not financial, legal, tax, engineering or veterinary advice.',
  'Manure storage and agitation release toxic and explosive gases (hydrogen sulfide, methane): never enter a manure pit or closed space; keep people and animals away while agitating.',
  'Building, stall and storage dimensions must follow local building codes, animal-welfare rules and a qualified designer; published guidance is a starting point.',
  'Manure application must follow the farm\'s nutrient management plan and local rules.',
  ...Object.values(OPTION_CAUTIONS),
] as const;

export interface CoverDetails {
  farm: { name: string; location: string };
  version: string;
  preparedBy: string;
  /** When the export was made; the engine has no clock, so the caller passes it. */
  created: Date;
  sheets: { name: string; what: string }[];
}

/** Fills the cover sheet (created first so it is the first tab). */
export function fillCoverSheet(ws: ExcelJS.Worksheet, context: WorkbookContext, details: CoverDetails): void {
  const { scenario } = context;
  ws.getColumn(1).width = 28;
  ws.getColumn(2).width = 100;
  const title = ws.getCell(1, 1);
  title.value = 'Byrecast lender workbook';
  title.font = { name: 'Arial', size: 18, bold: true, color: { argb: COLOURS.green } };
  ws.getCell(2, 1).value = `${details.farm.name} — ${scenario.name}`;
  ws.getCell(2, 1).font = { name: 'Arial', size: 12, bold: true, color: { argb: COLOURS.slate } };

  let r = 4;
  const line = (label: string, value: ExcelJS.CellValue) => {
    ws.getCell(r, 1).value = label;
    ws.getCell(r, 1).font = { ...BASE_FONT, bold: true };
    const cell = ws.getCell(r, 2);
    cell.value = value;
    cell.alignment = { wrapText: true, vertical: 'top', horizontal: 'left' };
    ws.getCell(r, 1).alignment = { vertical: 'top' };
    fitWrappedRow(ws, r, [2]);
    r++;
  };
  line('Farm', details.farm.name);
  line('Location', details.farm.location);
  line('Scenario', scenario.name);
  if (scenario.description) line('Description', scenario.description);
  line('Version', details.version);
  line('Prepared', details.created.toISOString().slice(0, 10));
  line('Prepared by', details.preparedBy);
  line('Currency', `${context.results.currency}, nominal (inputs in today's money, grown at their own rates)`);
  line('Horizon', `${context.horizon} operating years after year 0 (the investment at the end of construction); flows at the end of each year`);
  line('Options', context.options.map((o) => `${o.result.name}${o.result.current ? ' (current option, the baseline)' : ''}`).join('; '));
  const share = assumptionShare(scenario);
  if (share.total > 0) {
    line('Assumptions', `${Math.round((share.assumed / share.total) * 100)} % of the options' inputs (${share.assumed} of ${share.total}) are tagged as assumptions: planning figures to replace with the farm's own or a quote (see Assumptions, column Source)`);
  }

  // What the decision turns on comes first: each option's change against the current option, stressed.
  r++;
  ws.getCell(r, 1).value = 'The change against the current option';
  styleSection(ws.getCell(r, 1));
  r++;
  const whole = new Intl.NumberFormat(scenario.locale, { style: 'currency', currency: context.results.currency, maximumFractionDigits: 0 });
  const threshold = scenario.finance.coverageThreshold;
  for (const { result } of context.options) {
    const change = result.incremental;
    if (!change) continue;
    const payback = (years: number | null) => (years === null ? 'not reached' : `${years.toFixed(1)} years`);
    const milk10 = result.stress.find((row) => row.id === 'milk-10');
    const lowest = result.lowestCoverage;
    line(
      result.name,
      `NPV of the change ${whole.format(change.npv)}; payback ${payback(change.paybackYears)} with the year-${context.horizon} salvage and herd value, ${payback(change.paybackFromOperationsYears)} from operations alone; ` +
        `lowest whole-farm coverage ${lowest ? lowest.value.toFixed(2) : 'n/a'} (threshold ${threshold.toFixed(2)}), ${milk10?.lowestCoverage != null ? milk10.lowestCoverage.toFixed(2) : 'n/a'} with milk −10 % (Stress sheet).`,
    );
  }

  r++;
  ws.getCell(r, 1).value = 'Cautions';
  styleSection(ws.getCell(r, 1));
  styleTotal(ws, r, 1, 2);
  ws.getCell(r, 1).font = { name: 'Arial', size: 10, bold: true, color: { argb: COLOURS.clay } };
  r++;
  for (const caution of CAUTIONS) {
    ws.getCell(r, 1).value = '!';
    ws.getCell(r, 1).alignment = { horizontal: 'right', vertical: 'top' };
    ws.getCell(r, 1).font = { ...BASE_FONT, bold: true, color: { argb: COLOURS.clay } };
    ws.getCell(r, 2).value = caution;
    ws.getCell(r, 2).alignment = { wrapText: true, vertical: 'top' };
    fitWrappedRow(ws, r, [2]);
    r++;
  }
  r++;
  ws.getCell(r, 1).value = 'How to read this workbook';
  styleSection(ws.getCell(r, 1));
  r++;
  const guide = [
    `Cells in blue on straw are inputs: ${N.discountRate}, ${N.interestRate}, ${N.milkPrice}, ${N.milkPriceGrowth}, ${N.coverageThreshold}, ${N.existingCash} and ${N.existingDebt} on Assumptions. Change one and NPV, IRR, payback, the loan schedule and coverage recalculate.`,
    'Yearly lines are Byrecast engine values rounded to cents; totals, net cash flow, discounting, NPV, IRR, MIRR, payback, the loan schedule (PMT) and coverage are live formulas over them.',
    'NPV = year-0 flow + NPV(rate, years 1..H): spreadsheet NPV() discounts its first value one period, so the year-0 flow stays outside it.',
    'Key cells have workbook names (Formulas → Name Manager), e.g. Opt1_NPV, Opt2_WholeFarmCoverage. Tax (if any) and risk results are engine values and do not move with the inputs.',
    'Printed landscape on A4 (US Letter prints the same layout). The workbook contains no macros.',
  ];
  for (const text of guide) {
    ws.getCell(r, 2).value = text;
    ws.getCell(r, 2).alignment = { wrapText: true, vertical: 'top' };
    ws.getCell(r, 1).value = '•';
    ws.getCell(r, 1).alignment = { horizontal: 'right', vertical: 'top' };
    fitWrappedRow(ws, r, [2]);
    r++;
  }

  r++;
  ws.getCell(r, 1).value = 'Sheets';
  styleSection(ws.getCell(r, 1));
  r++;
  for (const sheet of details.sheets) {
    ws.getCell(r, 1).value = sheet.name;
    ws.getCell(r, 2).value = sheet.what;
    ws.getCell(r, 2).alignment = { wrapText: true, vertical: 'top' };
    r++;
  }

  ws.eachRow((row) => row.eachCell((cell) => (cell.font ??= BASE_FONT)));
  ws.views = [{ showGridLines: false }];
  setupPrint(ws, { lastRow: r - 1, lastColumn: 2, pagesTall: 1 });
}

/** Cell addressing, number formats, styles and page setup shared by every sheet of the lender workbook. */
import type ExcelJS from 'exceljs';

/** Column letters of a 1-based column number (1 → A, 27 → AA). */
export function columnLetter(column: number): string {
  let n = column;
  let letters = '';
  while (n > 0) {
    const rest = (n - 1) % 26;
    letters = String.fromCharCode(65 + rest) + letters;
    n = Math.floor((n - 1) / 26);
  }
  return letters;
}

/** A1 address of (row, column), both 1-based; `absolute` adds the $ signs. */
export function address(row: number, column: number, absolute = false): string {
  const d = absolute ? '$' : '';
  return `${d}${columnLetter(column)}${d}${row}`;
}

/** A sheet name quoted for use in a formula ('Cash flow 1'!A1). */
export function quoteSheet(name: string): string {
  return `'${name.replace(/'/g, "''")}'`;
}

/** Absolute reference to a cell or range on a named sheet, as defined names and cross-sheet formulas need. */
export function sheetRef(sheet: string, row: number, column: number, toRow = row, toColumn = column): string {
  const from = address(row, column, true);
  const to = address(toRow, toColumn, true);
  return `${quoteSheet(sheet)}!${from === to ? from : `${from}:${to}`}`;
}

/**
 * A worksheet name Excel accepts: at most 31 characters, none of []:*?/\ and no apostrophe
 * (an apostrophe would need doubling in every formula that names the sheet).
 */
export function safeSheetName(name: string): string {
  return name.replace(/[[\]:*?/\\']/g, ' ').replace(/\s+/g, ' ').trim().slice(0, 31).trim();
}

/** Excel's 31-character limit on sheet names, met by whole words ("2. New barn, deep sand"), never cut mid-word. */
export function wholeWordSheetName(name: string, max = 31): string {
  const words = name.replace(/[[\]:*?/\\']/g, ' ').replace(/\s+/g, ' ').trim().split(' ');
  let out = '';
  for (const word of words) {
    const next = out ? `${out} ${word}` : word;
    if (next.length > max) break;
    out = next;
  }
  // Only a first word longer than the limit is cut.
  return (out || (words[0] ?? '').slice(0, max)).replace(/[\s,;:–—-]+$/, '');
}

/** A cached formula result: the engine's number, or '' where the engine has none (null). */
export type CachedResult = number | string;

/** Writes a formula with its cached result so a reader sees the value before any recalculation. */
export function setFormula(cell: ExcelJS.Cell, formula: string, result: CachedResult | null): void {
  cell.value = { formula, result: result ?? '' } as ExcelJS.CellFormulaValue;
}

/**
 * Number format for money in `currency` as `locale` writes it (symbol before or after), e.g.
 * `#,##0.00 "€"` for EUR in en-IE… or `"$"#,##0.00` for USD; negatives carry a minus and show red.
 */
export function currencyFormat(currency: string, locale: string, decimals: 0 | 2): string {
  const parts = new Intl.NumberFormat(locale, { style: 'currency', currency }).formatToParts(-1234.5);
  const symbol = parts.find((p) => p.type === 'currency')?.value ?? currency;
  const symbolIndex = parts.findIndex((p) => p.type === 'currency');
  const numberIndex = parts.findIndex((p) => p.type === 'integer');
  const body = decimals === 2 ? '#,##0.00' : '#,##0';
  const quoted = `"${symbol.replace(/"/g, '')}"`;
  const positive = symbolIndex >= 0 && symbolIndex < numberIndex ? `${quoted}${body}` : `${body} ${quoted}`;
  return `${positive};[Red]-${positive};${positive}`;
}

export const PERCENT_FORMAT = '0.00%';
export const RATIO_FORMAT = '0.00';
/** Debt-service coverage: a ratio read as "times" (1.25×). */
export const COVERAGE_FORMAT = '0.00"×"';
export const YEARS_FORMAT = '0.00';
export const COUNT_FORMAT = '#,##0';
export const QUANTITY_FORMAT = '#,##0.00';

/** Formats one workbook uses, fixed by the farm's currency and locale. */
export interface Formats {
  money: string;
  moneyWhole: string;
}

/** Palette from docs/design.md: slate text, byre green headers, straw inputs, clay warnings. */
export const COLOURS = {
  slate: 'FF26323A',
  green: 'FF3F6F5A',
  straw: 'FFFDF3D6',
  surface: 'FFF7F5F0',
  surfaceDark: 'FFECE8DF',
  clay: 'FFB5562B',
  inputBlue: 'FF1F4E9A',
  muted: 'FF6B7378',
} as const;

const FONT = 'Arial';

/** The workbook's base font; Arial renders the same in Excel and LibreOffice. */
export const BASE_FONT: Partial<ExcelJS.Font> = { name: FONT, size: 9, color: { argb: COLOURS.slate } };

/** Sheet title in row 1. */
export function writeTitle(ws: ExcelJS.Worksheet, title: string, subtitle?: string): void {
  const cell = ws.getCell(1, 1);
  cell.value = title;
  cell.font = { name: FONT, size: 13, bold: true, color: { argb: COLOURS.green } };
  if (subtitle) {
    const sub = ws.getCell(2, 1);
    sub.value = subtitle;
    sub.font = { name: FONT, size: 8, italic: true, color: { argb: COLOURS.muted } };
  }
}

/** A table header row: white bold text on byre green. */
export function styleHeaderRow(ws: ExcelJS.Worksheet, row: number, fromColumn: number, toColumn: number): void {
  for (let c = fromColumn; c <= toColumn; c++) {
    const cell = ws.getCell(row, c);
    cell.font = { name: FONT, size: 9, bold: true, color: { argb: 'FFFFFFFF' } };
    cell.fill = { type: 'pattern', pattern: 'solid', fgColor: { argb: COLOURS.green } };
    cell.alignment = { vertical: 'middle', horizontal: c === fromColumn ? 'left' : 'right', wrapText: true };
  }
}

/** A section heading inside a sheet. */
export function styleSection(cell: ExcelJS.Cell): void {
  cell.font = { name: FONT, size: 10, bold: true, color: { argb: COLOURS.green } };
}

/** An input a reader may change: blue text on straw (the usual convention for model inputs; common practice). */
export function styleInput(cell: ExcelJS.Cell): void {
  cell.font = { name: FONT, size: 9, bold: true, color: { argb: COLOURS.inputBlue } };
  cell.fill = { type: 'pattern', pattern: 'solid', fgColor: { argb: COLOURS.straw } };
}

/** A total or key result: bold with a top rule. */
export function styleTotal(ws: ExcelJS.Worksheet, row: number, fromColumn: number, toColumn: number): void {
  for (let c = fromColumn; c <= toColumn; c++) {
    const cell = ws.getCell(row, c);
    cell.font = { name: FONT, size: 9, bold: true, color: { argb: COLOURS.slate } };
    cell.border = { top: { style: 'thin', color: { argb: COLOURS.slate } } };
  }
}

/** Small grey helper text (formula helpers, notes). */
export function styleNote(cell: ExcelJS.Cell): void {
  cell.font = { name: FONT, size: 8, italic: true, color: { argb: COLOURS.muted } };
}

export interface PrintSetup {
  lastRow: number;
  lastColumn: number;
  /** Rows repeated at the top of every printed page, e.g. '4:4'. */
  titleRows?: string;
  /** Repeat column A on every page (wide year grids printed over several pages). */
  repeatFirstColumn?: boolean;
  /** Pages across; 1 = fit to one page wide. */
  pagesWide?: number;
  /** Pages down; 0 (default) = as many as the rows need. */
  pagesTall?: number;
}

/**
 * Landscape, fit to width (`pagesWide` pages across, as many down as needed), A4 by default —
 * paperSize 9; US Letter is 1 and prints the same layout — with the print area set and a footer
 * naming the sheet and page.
 */
export function setupPrint(ws: ExcelJS.Worksheet, setup: PrintSetup): void {
  ws.pageSetup = {
    ...ws.pageSetup,
    paperSize: 9,
    orientation: 'landscape',
    fitToPage: true,
    fitToWidth: setup.pagesWide ?? 1,
    fitToHeight: setup.pagesTall ?? 0,
    horizontalCentered: false,
    margins: { left: 0.5, right: 0.5, top: 0.6, bottom: 0.6, header: 0.3, footer: 0.3 },
    // exceljs puts a $ before each end only, giving $A1:$D9; the row $ makes the range fully absolute.
    printArea: `A$1:${columnLetter(setup.lastColumn)}$${setup.lastRow}`,
  };
  if (setup.titleRows) ws.pageSetup.printTitlesRow = setup.titleRows;
  if (setup.repeatFirstColumn) ws.pageSetup.printTitlesColumn = 'A:A';
  ws.headerFooter = {
    oddFooter: '&L&8Byrecast lender workbook — &A&R&8Page &P of &N',
  };
}

/** Frozen panes below `rows` header rows and right of `columns` label columns. */
export function freeze(ws: ExcelJS.Worksheet, rows: number, columns = 0): void {
  ws.views = [{ state: 'frozen', xSplit: columns, ySplit: rows, topLeftCell: address(rows + 1, columns + 1), showGridLines: false }];
}

/**
 * Sets a row's height so wrapped text in the given columns shows in full: spreadsheets do not
 * grow rows for wrapped text written by a library, and LibreOffice prints them clipped.
 * Arial 9 pt fits about 1.4 characters per unit of column width (measured on the rendered PDF).
 */
export function fitWrappedRow(ws: ExcelJS.Worksheet, row: number, columns: readonly number[]): void {
  let lines = 1;
  for (const c of columns) {
    const text = ws.getCell(row, c).value;
    if (typeof text !== 'string' || text.length === 0) continue;
    const perLine = Math.max(1, Math.floor((ws.getColumn(c).width ?? 10) * 1.4));
    lines = Math.max(lines, Math.ceil(text.length / perLine));
  }
  if (lines > 1) ws.getRow(row).height = lines * 11.5 + 2;
}

/**
 * Shades the cells of `ref` (e.g. "B7:F7") whose number is below the named threshold cell; the
 * rule is a formula on the first cell of the range, so it follows the threshold when a lender
 * types a new one.
 */
export function shadeBelowThreshold(ws: ExcelJS.Worksheet, ref: string, thresholdName: string): void {
  const first = ref.split(':')[0] ?? ref;
  ws.addConditionalFormatting({
    ref,
    rules: [
      {
        type: 'expression',
        priority: 1,
        formulae: [`AND(ISNUMBER(${first}),${first}<${thresholdName})`],
        // A pale clay fill with clay bold text (docs/design.md: clay for warnings).
        style: { fill: { type: 'pattern', pattern: 'solid', bgColor: { argb: 'FFF4D9CC' } }, font: { color: { argb: COLOURS.clay }, bold: true } },
      },
    ],
  });
}

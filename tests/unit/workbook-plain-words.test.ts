/**
 * The lender workbook's Assumptions sheet reads in plain words for a family and a bank
 * (docs/product.md "Lender package": the assumptions with units and sources): no field paths,
 * internal ids, "null =", ISO/BCP codes or "[0] = year 1"; sheet names within Excel's
 * 31-character limit made of whole words; a capital line backed by a quote says "Quote".
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { evaluateScenario } from '../../shared/engine/evaluate';
import { scenarioSchema } from '../../shared/schema';
import { buildLenderWorkbook } from '../../server/workbook/build-workbook';
import { wholeWordSheetName } from '../../server/workbook/layout';
import { plainLabel } from '../../server/workbook/plain-words';

const scenario = scenarioSchema.parse(JSON.parse(readFileSync('scenarios/cairnbrook-mattress-or-sand.json', 'utf8')));
const sand = scenario.options.find((option) => option.bed === 'deep-sand') ?? scenario.options[1];
const shell = sand?.capitalLines.find((line) => line.kind === 'item');

async function assumptionRows(): Promise<{ names: string[]; rows: string[][] }> {
  if (!shell) throw new Error('demo scenario has no capital line');
  const workbook = await buildLenderWorkbook({
    scenario,
    results: evaluateScenario(scenario),
    farm: { name: 'Cairnbrook Farm', location: 'Invented' },
    version: 'v1',
    preparedBy: 'Maren Holt',
    created: new Date('2026-12-02T10:00:00Z'),
    quotes: [{ capitalLineId: shell.id, quoted: true, quoteTotal: 386_400, documents: [{ id: 1, fileName: 'shell-quote.pdf', quoteAmount: 386_400 }] }],
  });
  const sheet = workbook.getWorksheet('Assumptions');
  const rows: string[][] = [];
  sheet?.eachRow((row) => rows.push((row.values as unknown[]).slice(1).map((v) => String(v ?? ''))));
  return { names: workbook.worksheets.map((ws) => ws.name), rows };
}

describe('Assumptions sheet in plain words', () => {
  it('shows no field paths, ids or code explanations', async () => {
    const { rows } = await assumptionRows();
    const text = rows.map((row) => row.join(' | ')).join('\n');
    expect(rows.length).toBeGreaterThan(100);
    // A dotted field path such as herd.cows or options.sand.bedding.pricePerTonne.
    expect(text).not.toMatch(/\b[a-z]+[A-Za-z]*\.[a-z]+[A-Za-z]*\.[a-zA-Z]/);
    for (const code of ['null =', 'null means', '[0] =', 'ISO 4217', 'BCP 47', 'Stable id', 'cowsByYear', 'en-IE', "'economic-life' ="]) expect(text, code).not.toContain(code);
    // Money units by symbol, not the ISO code.
    expect(text).toContain('€ per kg');
    expect(text).not.toMatch(/\bEUR\b/);
    // The header has no Field column any more.
    expect(rows.find((row) => row[0] === 'Input')).toEqual(['Input', 'Value', 'Unit', 'Source']);
  });

  it('names the number style and the currency instead of their codes', async () => {
    const { rows } = await assumptionRows();
    expect(rows.find((row) => row[0] === 'Number style')?.[1]).toBe('Ireland — 1,234.5');
    expect(rows.find((row) => row[0] === 'Currency of every money figure')?.[1]).toBe('Euro (€)');
  });

  it('tags a quoted line cost "Quote" with the file and amount, not "Assumption"', async () => {
    const { rows } = await assumptionRows();
    const section = rows.findIndex((row) => row[0]?.startsWith(`Option: ${sand?.name}`));
    const cost = rows.slice(section).find((row) => row[0] === `${shell?.description}: Cost per unit today`);
    expect(section).toBeGreaterThan(0);
    expect(cost?.[3]).toBe('Quote: €386,400 (shell-quote.pdf)');
    // The same line in the other option has no quote: its tag stays.
    const other = rows.slice(0, section).find((row) => row[0] === `${shell?.description}: Cost per unit today`);
    if (other) expect(other[3]).not.toMatch(/^Quote/);
  });

  it('names sheets with whole words within 31 characters', async () => {
    const { names } = await assumptionRows();
    for (const name of names) expect(name.length, name).toBeLessThanOrEqual(31);
    // Excel's sheet-name limit is 31 characters (Microsoft support, "Excel specifications and limits", from memory).
    expect(wholeWordSheetName('1. New barn with sand-bedded freestalls and a separator')).toBe('1. New barn with sand-bedded');
    expect(wholeWordSheetName('2. New barn, deep sand')).toBe('2. New barn, deep sand');
    expect(wholeWordSheetName('3. Loose housing, deep straw yards')).toBe('3. Loose housing, deep straw');
  });

  it('drops code clauses from a description and keeps the words', () => {
    expect(plainLabel('herd.growth.feed', 'Feed cost growth: nominal growth per year, null = general inflation')).toBe('Feed cost growth: nominal growth per year');
    expect(plainLabel('herd.yearlyPriceIndex.milkPrice', 'Milk price multiplier per operating year, [0] = year 1, null = 1 every year')).toBe('Milk price multiplier per operating year');
    expect(plainLabel('finance.x', 'True: grants reduce the tax depreciation')).toBe('Grants reduce the tax depreciation');
  });
});

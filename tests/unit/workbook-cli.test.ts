import { execFile } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import ExcelJS from 'exceljs';
import { afterAll, describe, expect, it } from 'vitest';
import { evaluateScenario } from '../../shared/engine/evaluate';
import { scenarioSchema } from '../../shared/schema';

const root = fileURLToPath(new URL('../..', import.meta.url));
const dir = mkdtempSync(join(tmpdir(), 'byrecast-xlsx-cli-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const demoFile = join(root, 'scenarios', 'cairnbrook-mattress-or-sand.json');

function npmEvaluate(...args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  return new Promise((resolve) => {
    execFile('npm', ['run', '--silent', 'evaluate', '--', ...args], { cwd: root, maxBuffer: 64 * 1024 * 1024 }, (error, stdout, stderr) => {
      resolve({ code: error && typeof error.code === 'number' ? error.code : 0, stdout, stderr });
    });
  });
}

describe('npm run evaluate -- <file> --xlsx out.xlsx', { timeout: 120_000 }, () => {
  it('writes the lender workbook for a demo scenario, with the engine results cached in its key cells', async () => {
    const out = join(dir, 'mattress-or-sand.xlsx');
    const { code, stderr } = await npmEvaluate(demoFile, '--xlsx', out, '--farm', 'Cairnbrook Farm', '--prepared-by', 'Maren Holt', '--label', 'v2');
    expect(code, stderr).toBe(0);
    expect(stderr).toContain(`Lender workbook written to ${out}`);
    expect(existsSync(out)).toBe(true);

    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.readFile(out);
    expect(workbook.worksheets.map((sheet) => sheet.name)).toEqual(
      expect.arrayContaining(['Cover', 'Assumptions', 'Comparison', 'Loan by year', 'Loan payments', 'Coverage', 'Risk']),
    );
    const results = evaluateScenario(scenarioSchema.parse(JSON.parse(readFileSync(demoFile, 'utf8'))));
    results.options.forEach((option, index) => {
      const [range] = workbook.definedNames.getRanges(`Opt${index + 1}_NPV`).ranges;
      const match = /^'(.+)'!\$([A-Z]+)\$(\d+)$/.exec(range ?? '');
      const cell = match ? workbook.getWorksheet(match[1] ?? '')?.getCell(`${match[2]}${match[3]}`) : undefined;
      // The engine's own JSON (npm run evaluate -- --json gives the same) is the value the cell must carry.
      expect(cell?.result, option.name).toBeCloseTo(option.npv, 2);
    });
    const cover: string[] = [];
    workbook.getWorksheet('Cover')?.eachRow((row) => row.eachCell((cell) => cover.push(String(cell.value))));
    expect(cover).toEqual(expect.arrayContaining(['Cairnbrook Farm', 'Maren Holt', 'v2']));
  });

  it('keeps stdout pure JSON with --json and reports an unwritable path with exit code 1', async () => {
    const ok = await npmEvaluate(demoFile, '--json', '--xlsx', join(dir, 'with-json.xlsx'));
    expect(ok.code).toBe(0);
    expect(() => JSON.parse(ok.stdout) as unknown).not.toThrow();

    const bad = await npmEvaluate(demoFile, '--xlsx', join(dir, 'missing-folder', 'out.xlsx'));
    expect(bad.code).toBe(1);
    expect(bad.stderr).toMatch(/Cannot write the lender workbook .*missing-folder/);
  });
});

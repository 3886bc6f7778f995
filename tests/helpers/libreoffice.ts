/**
 * LibreOffice as an independent spreadsheet engine for tests: converts files with `soffice
 * --headless` in a throwaway profile that forces a full recalculation of OOXML files on load
 * (LibreOffice otherwise keeps the cached values it finds in the file), then reads the result
 * back with exceljs.
 */
import { execFile } from 'node:child_process';
import { copyFileSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { basename, extname, join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { promisify } from 'node:util';
import ExcelJS from 'exceljs';

const run = promisify(execFile);

// 0 = "always recalculate" for both OOXML and ODF files; see the stack notes on recalculation.
const RECALCULATE_ALWAYS = `<?xml version="1.0" encoding="UTF-8"?>
<oor:items xmlns:oor="http://openoffice.org/2001/registry" xmlns:xs="http://www.w3.org/2001/XMLSchema" xmlns:xsi="http://www.w3.org/2001/XMLSchema-instance">
<item oor:path="/org.openoffice.Office.Calc/Formula/Load"><prop oor:name="OOXMLRecalcMode" oor:op="fuse"><value>0</value></prop></item>
<item oor:path="/org.openoffice.Office.Calc/Formula/Load"><prop oor:name="ODFRecalcMode" oor:op="fuse"><value>0</value></prop></item>
</oor:items>
`;

/**
 * Converts each input file to `format` ('xlsx', 'pdf', …) with LibreOffice headless in one run
 * and a fresh profile; returns the output paths in input order, inside `outDir`.
 * Inputs are copied under distinct names first so two inputs never write the same output.
 */
export async function convertWithLibreOffice(inputs: readonly string[], format: string, outDir: string): Promise<string[]> {
  const work = mkdtempSync(join(tmpdir(), 'byrecast-soffice-'));
  try {
    mkdirSync(join(work, 'profile', 'user'), { recursive: true });
    writeFileSync(join(work, 'profile', 'user', 'registrymodifications.xcu'), RECALCULATE_ALWAYS);
    const staged = inputs.map((input, index) => {
      const name = `${String(index).padStart(2, '0')}-${basename(input)}`;
      const target = join(work, name);
      copyFileSync(input, target);
      return target;
    });
    const converted = join(work, 'out');
    await run(
      'soffice',
      [
        `-env:UserInstallation=${pathToFileURL(join(work, 'profile')).href}`,
        '--headless',
        '--norestore',
        '--nolockcheck',
        '--convert-to',
        format,
        '--outdir',
        converted,
        ...staged,
      ],
      { timeout: 120_000 },
    );
    mkdirSync(outDir, { recursive: true });
    return staged.map((file, index) => {
      const produced = join(converted, `${basename(file, extname(file))}.${format}`);
      const input = inputs[index] ?? file;
      const target = join(outDir, `${basename(input, extname(input))}.recalculated.${format}`);
      copyFileSync(produced, target);
      return target;
    });
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}

/** Recalculates each workbook with LibreOffice and reads the recalculated copies back with exceljs. */
export async function recalculateWithLibreOffice(inputs: readonly string[], outDir: string): Promise<ExcelJS.Workbook[]> {
  const outputs = await convertWithLibreOffice(inputs, 'xlsx', outDir);
  return Promise.all(
    outputs.map(async (file) => {
      const workbook = new ExcelJS.Workbook();
      await workbook.xlsx.readFile(file);
      return workbook;
    }),
  );
}

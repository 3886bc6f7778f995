import { execFile } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { evaluateScenario } from '../../shared/engine/evaluate';
import { riskScenario, riskScenarioInput } from './engine/fixtures';

const root = fileURLToPath(new URL('../..', import.meta.url));
const dir = mkdtempSync(join(tmpdir(), 'byrecast-cli-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

interface CliRun {
  code: number;
  stdout: string;
  stderr: string;
}

function runCli(...args: string[]): Promise<CliRun> {
  return new Promise((resolve) => {
    execFile(process.execPath, ['--import', 'tsx', 'server/cli/evaluate.ts', ...args], { cwd: root, maxBuffer: 64 * 1024 * 1024 }, (error, stdout, stderr) => {
      const code = error && typeof error.code === 'number' ? error.code : 0;
      resolve({ code, stdout, stderr });
    });
  });
}

function writeScenario(name: string, content: unknown): string {
  const path = join(dir, name);
  writeFileSync(path, typeof content === 'string' ? content : JSON.stringify(content));
  return path;
}

describe('npm run evaluate', { timeout: 60_000, concurrent: true }, () => {
  const valid = writeScenario('valid.json', riskScenarioInput());

  it('prints exactly the evaluation as JSON with --json', async () => {
    const { code, stdout } = await runCli(valid, '--json');
    expect(code).toBe(0);
    const parsed = JSON.parse(stdout) as { options: { id: string; current: boolean; incremental: unknown }[] };
    expect(parsed.options.map((o) => o.id)).toEqual(['now', 'steel', 'flex', 'mattress', 'sand']);
    // Every option keeps the key `incremental`: null for the current option, the change for the others;
    // and the decision figures the core evaluation leaves out (stress table, coverage break-evens).
    for (const option of parsed.options) {
      expect(Object.keys(option)).toEqual(expect.arrayContaining(['incremental', 'stress', 'breakEvenMilkPriceForCoverage']));
      expect(option.incremental === null).toBe(option.current);
    }
    expect(parsed).toEqual(JSON.parse(JSON.stringify(evaluateScenario(riskScenario()))));
  });

  it('prints a readable summary by default, one block per option', async () => {
    const { code, stdout } = await runCli(valid);
    expect(code).toBe(0);
    expect(stdout).toContain('As now (current option)');
    // Each of the four candidates leads with its change against the current option, then the stress.
    expect(stdout.match(/— the change against As now/g)?.length).toBe(4);
    expect(stdout.match(/NPV of the change -?€/g)?.length).toBe(4);
    expect(stdout.match(/From operations/g)?.length).toBe(4);
    expect(stdout.match(/Milk price −10 % and interest rate \+2 points/g)?.length).toBe(4);
    expect(stdout).toContain('Lowest coverage');
    expect(stdout).toMatch(/whole farm [\d.-]+ in year \d+.*; project/);
    // Own flows only as the whole herd's margin, after the change.
    const first = stdout.indexOf('NPV of the change');
    expect(stdout.indexOf("Whole herd's margin")).toBeGreaterThan(first);
  });

  it('refuses an invalid scenario with exit code 2 and one line per bad field', async () => {
    // docs/model.md, Validation: a negative herd, a 300 % interest rate and a horizon of 0 are refused
    // with a message naming the field.
    const input = riskScenarioInput();
    const bad = writeScenario('invalid.json', {
      ...input,
      horizonYears: 0,
      herd: { ...input.herd, cows: -5 },
      finance: { ...input.finance, interestRate: 3 },
    });
    const { code, stdout, stderr } = await runCli(bad, '--json');
    expect(code).toBe(2);
    expect(stdout).toBe('');
    const lines = stderr.trim().split('\n');
    expect(lines.some((l) => l.startsWith('horizonYears: ') && l.includes('Horizon'))).toBe(true);
    expect(lines.some((l) => l.startsWith('herd.cows: ') && l.includes('Herd size'))).toBe(true);
    expect(lines.some((l) => l.startsWith('finance.interestRate: ') && l.includes('Interest rate'))).toBe(true);
    expect(lines).toHaveLength(3);
  });

  it('refuses a file that is not JSON with exit code 2', async () => {
    const { code, stderr } = await runCli(writeScenario('broken.json', '{ "name": '));
    expect(code).toBe(2);
    expect(stderr).toMatch(/is not valid JSON/);
  });

  it('refuses a missing file with exit code 2', async () => {
    const { code, stderr } = await runCli(join(dir, 'absent.json'));
    expect(code).toBe(2);
    expect(stderr).toMatch(/Cannot read scenario file/);
  });
});

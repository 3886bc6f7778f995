/**
 * The programs Byrecast needs from outside npm, and the Debian packages that bring them. The start
 * command needs MariaDB; `npm test` also needs Chromium (browser tests), LibreOffice Calc (the
 * workbook recalculation check) and poppler (PDF pages to pictures). When one is missing and we
 * run as root, it is installed with apt-get; otherwise the caller stops with the one line to run.
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join } from 'node:path';

export interface SystemProgram {
  /** The executable looked for on the PATH (and in the sbin folders, where Debian puts daemons). */
  binary: string;
  debianPackage: string;
  neededFor: string;
}

export const MARIADB: SystemProgram = { binary: 'mariadbd', debianPackage: 'mariadb-server', neededFor: 'the database' };

export const TEST_PROGRAMS: readonly SystemProgram[] = [
  MARIADB,
  { binary: 'chromium', debianPackage: 'chromium', neededFor: 'the browser tests' },
  { binary: 'soffice', debianPackage: 'libreoffice-calc', neededFor: 'the workbook recalculation test' },
  { binary: 'pdftoppm', debianPackage: 'poppler-utils', neededFor: 'turning the printed workbook into pictures' },
];

const SBIN_FOLDERS = ['/usr/sbin', '/usr/bin', '/sbin'];

/** The full path of `name` on the PATH or in the sbin folders, or null. */
export function findBinary(name: string, pathVariable = process.env.PATH ?? ''): string | null {
  for (const dir of pathVariable.split(':').concat(SBIN_FOLDERS)) {
    const candidate = join(dir, name);
    if (dir && existsSync(candidate)) return candidate;
  }
  return null;
}

export function missingPrograms(
  programs: readonly SystemProgram[],
  find: (binary: string) => string | null = (binary) => findBinary(binary),
): SystemProgram[] {
  return programs.filter((program) => find(program.binary) === null);
}

/** The one shell line that installs `packages` on Debian. */
export function aptInstallCommand(packages: readonly string[]): string {
  return `apt-get update && apt-get install -y --no-install-recommends ${packages.join(' ')}`;
}

export interface EnsureOptions {
  isRoot?: boolean;
  find?: (binary: string) => string | null;
  /** Runs a shell line with the output shown; returns its exit status. */
  runShell?: (command: string) => number | null;
  log?: (message: string) => void;
}

/**
 * Makes sure every program is there: installs the missing ones' packages when root, else throws
 * an error whose message is the `sudo` line to run. Throws too when an install did not bring them.
 */
export function ensurePrograms(programs: readonly SystemProgram[], options: EnsureOptions = {}): void {
  const find = options.find ?? ((binary: string) => findBinary(binary));
  const missing = missingPrograms(programs, find);
  if (missing.length === 0) return;
  const packages = [...new Set(missing.map((program) => program.debianPackage))];
  const command = aptInstallCommand(packages);
  const why = missing.map((program) => `${program.binary} (${program.neededFor})`).join(', ');
  if (!(options.isRoot ?? process.getuid?.() === 0)) {
    throw new Error(`Missing ${why}. Install with:\n  sudo sh -c '${command}'`);
  }
  (options.log ?? console.log)(`Missing ${why}: installing Debian packages ${packages.join(', ')} …`);
  const runShell = options.runShell ?? defaultRunShell;
  const status = runShell(command);
  if (status !== 0) throw new Error(`Installing ${packages.join(', ')} failed (${command})`);
  const stillMissing = missingPrograms(missing, find);
  if (stillMissing.length > 0) {
    throw new Error(`Still missing after install: ${stillMissing.map((program) => program.binary).join(', ')}`);
  }
}

function defaultRunShell(command: string): number | null {
  return spawnSync('sh', ['-c', command], {
    stdio: 'inherit',
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  }).status;
}

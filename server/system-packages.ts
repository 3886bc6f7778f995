/**
 * Programs from Debian that Byrecast needs outside npm (MariaDB for `npm start`; MariaDB,
 * Chromium, LibreOffice Calc and poppler for `npm test`). Missing ones are installed with
 * apt-get when we run as root; otherwise we stop at once with the one command to run.
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join } from 'node:path';

export interface SystemTool {
  /** Every program that must be found; the package is missing when any one is not. */
  binaries: readonly string[];
  debianPackage: string;
}

export const MARIADB: SystemTool = { binaries: ['mariadbd', 'mariadb-install-db'], debianPackage: 'mariadb-server' };
export const CHROMIUM: SystemTool = { binaries: ['chromium'], debianPackage: 'chromium' };
export const LIBREOFFICE_CALC: SystemTool = { binaries: ['soffice'], debianPackage: 'libreoffice-calc' };
export const POPPLER: SystemTool = { binaries: ['pdftoppm'], debianPackage: 'poppler-utils' };

/** Debian keeps server programs in sbin, which a non-root PATH often lacks. */
const ALWAYS_SEARCHED = ['/usr/sbin', '/usr/bin', '/sbin'];

export function findBinary(name: string, path = process.env.PATH ?? '', exists: (file: string) => boolean = existsSync): string | null {
  for (const dir of path.split(':').concat(ALWAYS_SEARCHED)) {
    if (!dir) continue;
    const candidate = join(dir, name);
    if (exists(candidate)) return candidate;
  }
  return null;
}

export function missingPackages(tools: readonly SystemTool[], find: (name: string) => string | null = (name) => findBinary(name)): string[] {
  const missing = tools.filter((tool) => tool.binaries.some((binary) => !find(binary))).map((tool) => tool.debianPackage);
  return [...new Set(missing)];
}

export function aptInstallCommand(packages: readonly string[]): string {
  return `apt-get update && apt-get install -y --no-install-recommends ${packages.join(' ')}`;
}

export class MissingSystemPackagesError extends Error {
  constructor(
    readonly packages: readonly string[],
    readonly command: string,
    purpose: string,
  ) {
    super(`${purpose} needs ${packages.join(', ')}, not installed. Install with:\n  sudo sh -c '${command}'`);
    this.name = 'MissingSystemPackagesError';
  }
}

export interface EnsureOptions {
  /** Who needs them, for the message ("npm test", "MariaDB"). */
  purpose: string;
  isRoot?: boolean;
  find?: (name: string) => string | null;
  /** Runs a shell command, returns its exit status (default: sh -c, output shown). */
  runShell?: (command: string) => number | null;
  log?: (line: string) => void;
}

function runShellVisibly(command: string): number | null {
  const result = spawnSync('sh', ['-c', command], { stdio: 'inherit', env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
  return result.status;
}

/**
 * Installs the Debian packages of `tools` that are missing when running as root; throws
 * MissingSystemPackagesError with the apt-get line otherwise (nothing is run then).
 */
export function ensureSystemPackages(tools: readonly SystemTool[], options: EnsureOptions): void {
  const find = options.find ?? ((name: string) => findBinary(name));
  const missing = missingPackages(tools, find);
  if (missing.length === 0) return;
  const command = aptInstallCommand(missing);
  const isRoot = options.isRoot ?? process.getuid?.() === 0;
  if (!isRoot) throw new MissingSystemPackagesError(missing, command, options.purpose);
  (options.log ?? console.log)(`${options.purpose}: installing Debian packages ${missing.join(' ')} …`);
  const status = (options.runShell ?? runShellVisibly)(command);
  if (status !== 0) throw new Error(`Installing ${missing.join(' ')} failed (${command})`);
  const stillMissing = missingPackages(tools, find);
  if (stillMissing.length > 0) throw new Error(`${stillMissing.join(', ')} still missing after ${command}`);
}

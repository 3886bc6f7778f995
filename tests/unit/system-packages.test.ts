import { describe, expect, it } from 'vitest';
import { aptInstallCommand, ensurePrograms, missingPrograms, TEST_PROGRAMS } from '../../server/system/debian-packages.js';

const nothingInstalled = (): string | null => null;

describe('the programs npm test needs from Debian', () => {
  it('names MariaDB, Chromium, LibreOffice Calc and poppler with their Debian packages', () => {
    expect(TEST_PROGRAMS.map((program) => [program.binary, program.debianPackage])).toEqual([
      ['mariadbd', 'mariadb-server'],
      ['chromium', 'chromium'],
      ['soffice', 'libreoffice-calc'],
      ['pdftoppm', 'poppler-utils'],
    ]);
  });

  it('lists only the programs that are not found', () => {
    const find = (binary: string) => (binary === 'soffice' || binary === 'pdftoppm' ? null : `/usr/bin/${binary}`);
    expect(missingPrograms(TEST_PROGRAMS, find).map((program) => program.debianPackage)).toEqual([
      'libreoffice-calc',
      'poppler-utils',
    ]);
  });

  it('stops at once with the one apt-get line when not root', () => {
    let ran = false;
    expect(() =>
      ensurePrograms(TEST_PROGRAMS, {
        isRoot: false,
        find: nothingInstalled,
        runShell: () => {
          ran = true;
          return 0;
        },
      }),
    ).toThrow("sudo sh -c 'apt-get update && apt-get install -y --no-install-recommends mariadb-server chromium libreoffice-calc poppler-utils'");
    expect(ran).toBe(false);
  });

  it('installs the missing packages as root and checks they arrived', () => {
    const installed = new Set(['mariadbd']);
    const commands: string[] = [];
    ensurePrograms(TEST_PROGRAMS, {
      isRoot: true,
      log: () => {},
      find: (binary) => (installed.has(binary) ? `/usr/bin/${binary}` : null),
      runShell: (command) => {
        commands.push(command);
        for (const binary of ['chromium', 'soffice', 'pdftoppm']) installed.add(binary);
        return 0;
      },
    });
    expect(commands).toEqual([aptInstallCommand(['chromium', 'libreoffice-calc', 'poppler-utils'])]);
  });

  it('fails when the install ran but a program is still missing, or the install failed', () => {
    const options = { isRoot: true, log: () => {}, find: nothingInstalled };
    expect(() => ensurePrograms(TEST_PROGRAMS.slice(0, 1), { ...options, runShell: () => 0 })).toThrow('Still missing after install: mariadbd');
    expect(() => ensurePrograms(TEST_PROGRAMS.slice(0, 1), { ...options, runShell: () => 100 })).toThrow('Installing mariadb-server failed');
  });

  it('does nothing when everything is there', () => {
    expect(() => ensurePrograms(TEST_PROGRAMS, { isRoot: false, find: (binary) => `/usr/bin/${binary}` })).not.toThrow();
  });
});

import { describe, expect, it } from 'vitest';
import {
  aptInstallCommand,
  CHROMIUM,
  ensureSystemPackages,
  findBinary,
  LIBREOFFICE_CALC,
  MARIADB,
  MissingSystemPackagesError,
  missingPackages,
  POPPLER,
} from '../../server/system-packages.js';

const ALL = [MARIADB, CHROMIUM, LIBREOFFICE_CALC, POPPLER];

/** A machine whose file system holds exactly `files`; installing adds `installs`. */
function fakeMachine(files: string[], installs: string[] = []) {
  const present = new Set(files);
  const commands: string[] = [];
  return {
    commands,
    find: (name: string) => findBinary(name, '/usr/local/bin:/usr/bin', (file) => present.has(file)),
    runShell: (command: string) => {
      commands.push(command);
      for (const file of installs) present.add(file);
      return 0;
    },
  };
}

describe('finding the Debian programs the tests need', () => {
  it('looks on the PATH first, then in sbin where Debian keeps mariadbd', () => {
    const exists = (file: string) => file === '/usr/local/bin/soffice' || file === '/usr/bin/soffice' || file === '/usr/sbin/mariadbd';
    expect(findBinary('soffice', '/usr/local/bin:/usr/bin', exists)).toBe('/usr/local/bin/soffice');
    expect(findBinary('mariadbd', '/usr/bin', exists)).toBe('/usr/sbin/mariadbd');
    expect(findBinary('pdftoppm', '/usr/bin', exists)).toBeNull();
  });

  it('names the package of each missing program once, in a fixed order', () => {
    // mariadb-server is missing when either of its two programs is.
    const machine = fakeMachine(['/usr/sbin/mariadbd', '/usr/bin/chromium']);
    expect(missingPackages(ALL, machine.find)).toEqual(['mariadb-server', 'libreoffice-calc', 'poppler-utils']);
    expect(missingPackages([MARIADB, MARIADB], fakeMachine([]).find)).toEqual(['mariadb-server']);
  });

  it('builds one apt-get line that installs them all without recommended extras', () => {
    expect(aptInstallCommand(['libreoffice-calc', 'poppler-utils'])).toBe(
      'apt-get update && apt-get install -y --no-install-recommends libreoffice-calc poppler-utils',
    );
  });
});

describe('ensuring the programs are there', () => {
  const everything = ['/usr/sbin/mariadbd', '/usr/bin/mariadb-install-db', '/usr/bin/chromium', '/usr/bin/soffice', '/usr/bin/pdftoppm'];

  it('runs nothing when everything is installed', () => {
    const machine = fakeMachine(everything);
    ensureSystemPackages(ALL, { purpose: 'npm test', isRoot: false, find: machine.find, runShell: machine.runShell });
    expect(machine.commands).toEqual([]);
  });

  it('stops at once without root, with the one command to run', () => {
    const machine = fakeMachine(['/usr/sbin/mariadbd', '/usr/bin/mariadb-install-db', '/usr/bin/chromium']);
    let thrown: unknown;
    try {
      ensureSystemPackages(ALL, { purpose: 'npm test', isRoot: false, find: machine.find, runShell: machine.runShell });
    } catch (error) {
      thrown = error;
    }
    expect(thrown).toBeInstanceOf(MissingSystemPackagesError);
    const error = thrown as MissingSystemPackagesError;
    expect(error.packages).toEqual(['libreoffice-calc', 'poppler-utils']);
    expect(error.message).toContain("sudo sh -c 'apt-get update && apt-get install -y --no-install-recommends libreoffice-calc poppler-utils'");
    expect(machine.commands).toEqual([]);
  });

  it('installs the missing packages as root and checks they arrived', () => {
    const machine = fakeMachine(['/usr/bin/chromium'], everything);
    const log: string[] = [];
    ensureSystemPackages(ALL, { purpose: 'npm test', isRoot: true, find: machine.find, runShell: machine.runShell, log: (l) => log.push(l) });
    expect(machine.commands).toEqual([aptInstallCommand(['mariadb-server', 'libreoffice-calc', 'poppler-utils'])]);
    expect(log[0]).toContain('mariadb-server libreoffice-calc poppler-utils');
  });

  it('fails loudly when apt-get fails or the program is still missing afterwards', () => {
    const failing = fakeMachine([]);
    expect(() => ensureSystemPackages([POPPLER], { purpose: 'npm test', isRoot: true, find: failing.find, runShell: () => 100, log: () => {} })).toThrow(
      /Installing poppler-utils failed/,
    );
    const empty = fakeMachine([]);
    expect(() => ensureSystemPackages([POPPLER], { purpose: 'npm test', isRoot: true, find: empty.find, runShell: empty.runShell, log: () => {} })).toThrow(
      /poppler-utils still missing/,
    );
  });
});

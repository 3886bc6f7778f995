/**
 * The start command's private MariaDB is supervised: `npm start` (server/start.ts, as a child
 * process, on its own data directory) is run, its mariadbd killed with SIGKILL; the start
 * command logs the death and the restart, the server answers 503 meanwhile and 200 again after,
 * with the data kept. Common practice for supervisors (restart with growing delay), no source.
 * The backup and restore commands find that same private MariaDB when DATABASE_URL is unset.
 */
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { findFreePort, restartDelayMs } from '../../server/db/local-server.js';
import { eventually, isRunning, processGone, runChild, signIn, startChild, type ChildServer } from '../helpers/processes.js';

describe('the private MariaDB of the start command: supervised, backed up, restored', () => {
  const dataDir = mkdtempSync(join(tmpdir(), 'byrecast-supervise-'));
  const pidFile = join(dataDir, 'mariadb', 'mariadb.pid');
  let start: ChildServer | null = null;
  const backupFile = join(dataDir, 'backups', 'private.tar.gz');
  const commandEnv = () => {
    const { DATABASE_URL: _unset, ...env } = process.env;
    return { ...env, DATA_DIR: dataDir };
  };

  const startEnv = async () => ({
    ...commandEnv(),
    NODE_ENV: 'production',
    PORT: String(await findFreePort()),
    DB_PORT: String(await findFreePort()),
    DIST_DIR: process.env.BYRECAST_DIST ?? join(dataDir, 'dist'),
    BCRYPT_COST: '4',
    LOG_LEVEL: 'warn',
    JWT_SECRET: 'supervision-test-secret-of-at-least-32-characters',
  });
  const alive = isRunning;

  afterAll(async () => {
    await start?.kill('SIGTERM');
    // Should the start command have died without stopping its MariaDB, stop that one here.
    try {
      process.kill(Number(readFileSync(pidFile, 'utf8')), 'SIGKILL');
    } catch {
      // already gone
    }
    rmSync(dataDir, { recursive: true, force: true });
  }, 60_000);

  it('waits 0.5 s, then twice as long each time, at most 30 s', () => {
    expect([1, 2, 3, 4, 7, 8, 20].map(restartDelayMs)).toEqual([500, 1_000, 2_000, 4_000, 30_000, 30_000, 30_000]);
  });

  it('is started again when it dies, and the server recovers by itself', async () => {
    start = startChild('server/start.ts', await startEnv());
    const url = (await start.waitFor(/Byrecast is running at (\S+)/, 120_000))[1]!;
    const cookie = await signIn(url, 'owner@byrecast.test');
    const health = async () => (await fetch(`${url}/api/health`, { signal: AbortSignal.timeout(5_000) })).status;
    expect(await health()).toBe(200);

    const firstPid = Number(readFileSync(pidFile, 'utf8'));
    process.kill(firstPid, 'SIGKILL');
    await processGone(firstPid);
    expect(await health()).toBe(503);

    await start.waitFor(/MariaDB exited \(SIGKILL\); restarting in 0\.5 s \(attempt 1\)/, 10_000);
    await start.waitFor(/MariaDB restarted on 127\.0\.0\.1:\d+/, 60_000);
    expect(await eventually(async () => (await health()) === 200, 10_000)).toBe(true);
    expect(Number(readFileSync(pidFile, 'utf8'))).not.toBe(firstPid);
    // The same session and the demo farm are still there: same data directory.
    const me = (await (await fetch(`${url}/api/auth/me`, { headers: { cookie } })).json()) as { user: { email: string }; memberships: unknown[] };
    expect(me.user.email).toBe('owner@byrecast.test');
    expect(me.memberships.length).toBeGreaterThan(0);
    expect(start.child.exitCode).toBeNull();

    // `npm run backup` without DATABASE_URL finds this running private MariaDB by its socket.
    const backup = await runChild('server/cli/backup.ts', commandEnv(), ['--out', backupFile]);
    expect(backup.code, backup.output).toBe(0);
    expect(backup.output).toMatch(/database: database byrecast of the private MariaDB in .*\(running\), \d+ tables \(1 farms, [1-9]\d* scenarios/);
    // A restore under the running app is refused: it would serve half-restored data.
    const underApp = await runChild('server/cli/restore.ts', commandEnv(), [backupFile, '--yes', '--force']);
    expect(underApp.code).toBe(1);
    expect(underApp.output).toMatch(new RegExp(`The app \\(pid ${start.child.pid}\\) is running on .*stop it \\(Ctrl-C\\).*Nothing changed`));

    // Ctrl-C still stops both: no restart after a deliberate stop.
    const secondPid = Number(readFileSync(pidFile, 'utf8'));
    await start.kill('SIGTERM');
    expect(await eventually(async () => !alive(secondPid), 20_000)).toBe(true);
    expect(start.output().match(/restarting in/g)).toHaveLength(1);
  }, 180_000);

  it('restores into the private MariaDB while the app is stopped, starting and stopping it for the command', async () => {
    expect(existsSync(backupFile)).toBe(true);
    const restored = await runChild('server/cli/restore.ts', commandEnv(), [backupFile, '--yes', '--force']);
    expect(restored.code, restored.output).toBe(0);
    expect(restored.output).toMatch(/Restored into database byrecast of the private MariaDB in .* \(started for this command\): \d+ tables \(\d+ accounts, 1 farms/);
    // The server it started is stopped again: its pid file is gone with it.
    expect(existsSync(pidFile)).toBe(false);
  }, 120_000);

  it('after a start killed with SIGKILL, the next start stops the MariaDB it left behind and carries on', async () => {
    start = startChild('server/start.ts', await startEnv());
    await start.waitFor(/Byrecast is running at/, 120_000);
    const leftPid = Number(readFileSync(pidFile, 'utf8'));
    await start.kill('SIGKILL');
    // SIGKILL gave the start command no chance to stop its MariaDB.
    expect(alive(leftPid)).toBe(true);

    start = startChild('server/start.ts', await startEnv());
    await start.waitFor(new RegExp(`MariaDB \\(pid ${leftPid}\\) was left running by an earlier start`), 60_000);
    const url = (await start.waitFor(/Byrecast is running at (\S+)/, 120_000))[1]!;
    expect(alive(leftPid)).toBe(false);
    expect((await fetch(`${url}/api/health`)).status).toBe(200);
    await signIn(url, 'owner@byrecast.test');
    await start.kill('SIGTERM');
  }, 180_000);
});

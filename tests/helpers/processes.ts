/**
 * Helpers for fault tests that run the real server as a child process: start it with
 * `node --import tsx` (one process, so SIGKILL hits the server itself, not a wrapper), wait for
 * a line of its output, sign in over real HTTP, wait for a process to be gone.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { SESSION_COOKIE } from '../../server/auth/session.js';
import { processAlive } from '../../server/db/local-server.js';

export interface ChildServer {
  child: ChildProcess;
  /** Everything written to stdout and stderr so far. */
  output(): string;
  /** Resolves once `pattern` appears in the output (rejects if the process ends first or after `ms`). */
  waitFor(pattern: RegExp, ms?: number): Promise<RegExpMatchArray>;
  /** Sends `signal` and waits for the exit. */
  kill(signal?: NodeJS.Signals): Promise<void>;
}

export function startChild(script: string, env: NodeJS.ProcessEnv, args: string[] = []): ChildServer {
  const child = spawn(process.execPath, ['--import', 'tsx', script, ...args], { env, stdio: ['ignore', 'pipe', 'pipe'] });
  let text = '';
  const waiters = new Set<() => void>();
  const onData = (chunk: Buffer) => {
    text += chunk.toString('utf8');
    for (const wake of waiters) wake();
  };
  child.stdout!.on('data', onData);
  child.stderr!.on('data', onData);
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  return {
    child,
    output: () => text,
    waitFor(pattern, ms = 60_000) {
      return new Promise((resolve, reject) => {
        const timer = setTimeout(() => finish(new Error(`no ${pattern} within ${ms} ms; output:\n${text.slice(-3000)}`)), ms);
        const check = () => {
          const match = text.match(pattern);
          if (match) finish(null, match);
          else if (child.exitCode !== null || child.signalCode !== null) finish(new Error(`exited before ${pattern}; output:\n${text.slice(-3000)}`));
        };
        const finish = (error: Error | null, match?: RegExpMatchArray) => {
          clearTimeout(timer);
          waiters.delete(check);
          child.off('exit', check);
          if (error) reject(error);
          else resolve(match!);
        };
        waiters.add(check);
        child.on('exit', check);
        check();
      });
    },
    async kill(signal = 'SIGTERM') {
      if (child.exitCode === null && child.signalCode === null) child.kill(signal);
      await exited;
    },
  };
}

/** Runs a script to its end; resolves with its exit code and output. */
export function runChild(script: string, env: NodeJS.ProcessEnv, args: string[] = []): Promise<{ code: number | null; output: string }> {
  const running = startChild(script, env, args);
  return new Promise((resolve) => running.child.once('exit', (code) => resolve({ code, output: running.output() })));
}

/** The session cookie of a demo user, signed in over HTTP at `baseUrl`. */
export async function signIn(baseUrl: string, email: string, password = 'byrecast-demo'): Promise<string> {
  const res = await fetch(`${baseUrl}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email, password }),
  });
  if (res.status !== 200) throw new Error(`sign-in as ${email} answered ${res.status}`);
  const cookie = res.headers.getSetCookie().find((c) => c.startsWith(`${SESSION_COOKIE}=`));
  if (!cookie) throw new Error('no session cookie');
  return cookie.split(';')[0]!;
}

/** True for a running process; a zombie counts as gone (the rule the start command's supervisor uses). */
export const isRunning = processAlive;

/** Waits until process `pid` has ended (a killed child of another process may linger as a zombie; its port is closed by then). */
export async function processGone(pid: number, ms = 10_000): Promise<void> {
  const deadline = Date.now() + ms;
  while (isRunning(pid) && Date.now() < deadline) await new Promise((r) => setTimeout(r, 50));
}

/** Polls `probe` until it returns true or `ms` pass; returns whether it did. */
export async function eventually(probe: () => Promise<boolean>, ms = 30_000, every = 200): Promise<boolean> {
  const deadline = Date.now() + ms;
  while (Date.now() < deadline) {
    if (await probe().catch(() => false)) return true;
    await new Promise((r) => setTimeout(r, every));
  }
  return false;
}

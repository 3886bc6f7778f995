/**
 * The API under load, on loopback against a real server (its own process) on a throwaway
 * MariaDB: GET of a demo scenario with its results at 50 connections for 15 s (autocannon),
 * and the median time of a save (PUT of the whole document, sequential).
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { performance } from 'node:perf_hooks';
import autocannon from 'autocannon';
import mysql from 'mysql2/promise';
import type { Scenario } from '../../shared/schema/index.js';
import { median, type TableRow } from './harness';

// Targets of the load benchmark (project targets: a read must not queue under a busy morning's load).
const READ_P99_TARGET_MS = 50;
const SAVE_MEDIAN_TARGET_MS = 30;
const CONNECTIONS = 50;
const DURATION_S = 15;
const SAVES = 30;

function startServerProcess(databaseUrl: string): Promise<{ child: ChildProcess; url: string }> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'tests/bench/server-process.ts'], {
    env: { ...process.env, BENCH_DATABASE_URL: databaseUrl },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  return new Promise((resolve, reject) => {
    let out = '';
    child.stdout?.on('data', (chunk: Buffer) => {
      out += chunk.toString('utf8');
      const match = /listening (\S+)/.exec(out);
      if (match?.[1]) resolve({ child, url: match[1] });
    });
    child.once('exit', (code) => reject(new Error(`bench server exited with ${code}`)));
  });
}

/** CPU time (user + system, ms) the process `pid` has used so far, from /proc (Linux clock ticks of 10 ms). */
function cpuMsOf(pid: number): number {
  const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1]?.split(' ') ?? [];
  return (Number(fields[11]) + Number(fields[12])) * 10;
}

async function signIn(url: string, email: string): Promise<string> {
  const res = await fetch(`${url}/api/auth/sign-in`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password: 'byrecast-demo' }) });
  if (!res.ok) throw new Error(`sign-in ${res.status}`);
  return res.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
}

async function getJson<T>(url: string, cookie: string): Promise<T> {
  const res = await fetch(url, { headers: { cookie } });
  if (!res.ok) throw new Error(`GET ${url}: ${res.status}`);
  return (await res.json()) as T;
}

function load(url: string, cookie: string): Promise<autocannon.Result> {
  return new Promise((resolve, reject) => {
    autocannon(
      { url, connections: CONNECTIONS, duration: DURATION_S, headers: { cookie, 'accept-encoding': 'gzip, deflate, br' } },
      (error, result) => (error ? reject(error) : resolve(result)),
    );
  });
}

/** Runs the load and save benchmarks on a database created on `databaseServerUrl`; returns their table rows. */
export async function httpBench(databaseServerUrl: string): Promise<TableRow[]> {
  let child: ChildProcess | null = null;
  try {
    const admin = await mysql.createConnection(databaseServerUrl);
    await admin.query('CREATE DATABASE `bench` CHARACTER SET utf8mb4');
    await admin.end();
    const server = await startServerProcess(`${databaseServerUrl}/bench`);
    child = server.child;
    const cookie = await signIn(server.url, 'owner@byrecast.test');
    const [farm] = await getJson<{ id: number }[]>(`${server.url}/api/farms`, cookie);
    const list = await getJson<{ id: number; name: string }[]>(`${server.url}/api/farms/${farm!.id}/scenarios`, cookie);
    const five = list.find((s) => s.name.includes('five'))!;
    const path = `${server.url}/api/farms/${farm!.id}/scenarios/${five.id}`;
    const read = await fetch(path, { headers: { cookie, 'accept-encoding': 'gzip' } });
    const wireBytes = Number(read.headers.get('content-length') ?? Number.NaN);
    const body = await read.text();
    process.stdout.write(`scenario read: ${(body.length / 1024).toFixed(0)} KB of JSON, ${(wireBytes / 1024).toFixed(0)} KB ${read.headers.get('content-encoding') ?? 'identity'} on the wire\n`);

    // Warm the JIT and the pools before measuring.
    for (let i = 0; i < 50; i += 1) await fetch(path, { headers: { cookie } }).then((r) => r.arrayBuffer());
    const cpuBefore = cpuMsOf(child.pid as number);
    const result = await load(path, cookie);
    const serverCpuPerRead = (cpuMsOf(child.pid as number) - cpuBefore) / Math.max(1, result.requests.total);
    const errors = result.errors + result.timeouts + result.non2xx;

    const saveTimes: number[] = [];
    let current = JSON.parse(body) as { version: number; scenario: Scenario };
    for (let i = 0; i < SAVES; i += 1) {
      const scenario = { ...current.scenario, finance: { ...current.scenario.finance, interestRate: 0.05 + i / 10_000 } };
      const start = performance.now();
      const res = await fetch(path, { method: 'PUT', headers: { cookie, 'content-type': 'application/json', 'accept-encoding': 'gzip' }, body: JSON.stringify({ version: current.version, scenario }) });
      const saved = (await res.json()) as { version: number; scenario: Scenario };
      saveTimes.push(performance.now() - start);
      if (!res.ok) throw new Error(`PUT ${res.status}`);
      current = saved;
    }
    const saveMedian = median(saveTimes);
    return [
      {
        name: `GET scenario with results, ${CONNECTIONS} connections, ${DURATION_S} s`,
        value: `p99 ${result.latency.p99} ms`,
        cpu: `${Math.round(result.requests.average)} req/s, p50 ${result.latency.p50} ms, ${errors} errors; server CPU ${serverCpuPerRead.toFixed(2)} ms/read`,
        target: `p99 < ${READ_P99_TARGET_MS} ms, 0 errors`,
        pass: errors === 0 && result.latency.p99 < READ_P99_TARGET_MS,
      },
      {
        name: `save (PUT whole document), ${SAVES} in a row`,
        value: `${saveMedian.toFixed(1)} ms`,
        cpu: '(wall, client side)',
        target: `< ${SAVE_MEDIAN_TARGET_MS} ms`,
        pass: saveMedian < SAVE_MEDIAN_TARGET_MS,
      },
    ];
  } finally {
    if (child && child.exitCode === null) {
      const exited = new Promise((resolve) => child?.once('exit', resolve));
      child.kill('SIGTERM');
      await exited;
    }
  }
}

import { performance } from 'node:perf_hooks';

/** Timing of one benchmark: median, fastest and slowest wall time per run (ms), and median CPU time (ms). */
export interface BenchResult {
  readonly name: string;
  readonly runs: number;
  readonly medianMs: number;
  /** CPU time of this process per run: unlike wall time, not inflated by other work on a shared machine. */
  readonly medianCpuMs: number;
  readonly minMs: number;
  readonly maxMs: number;
}

/** Median of a non-empty list of numbers (mean of the two middle values for an even count). */
export function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = Math.floor(sorted.length / 2);
  const upper = sorted[middle] ?? Number.NaN;
  return sorted.length % 2 === 1 ? upper : ((sorted[middle - 1] ?? upper) + upper) / 2;
}

/**
 * Runs `fn` `warmUp` times untimed (so the JIT has compiled it), then `runs` times timed;
 * reports wall-clock milliseconds per run. The result of `fn` is kept so the work is not
 * optimised away.
 */
export function bench(name: string, fn: () => unknown, runs: number, warmUp = Math.min(runs, 5)): BenchResult {
  const sink: unknown[] = [];
  for (let i = 0; i < warmUp; i += 1) sink.push(fn());
  const times: number[] = [];
  const cpuTimes: number[] = [];
  for (let i = 0; i < runs; i += 1) {
    const cpuStart = process.cpuUsage();
    const start = performance.now();
    sink.push(fn());
    times.push(performance.now() - start);
    const cpu = process.cpuUsage(cpuStart);
    cpuTimes.push((cpu.user + cpu.system) / 1000);
    sink.length = 0;
  }
  return { name, runs, medianMs: median(times), medianCpuMs: median(cpuTimes), minMs: Math.min(...times), maxMs: Math.max(...times) };
}

/** One line of the results table: what was timed, its median wall and CPU time, the target and whether it met it. */
export interface TableRow {
  readonly name: string;
  readonly value: string;
  readonly cpu: string;
  readonly target: string;
  readonly pass: boolean;
}

/** Plain-text table with aligned columns, for the terminal. */
export function formatTable(rows: readonly TableRow[]): string {
  const header = ['benchmark', 'median wall', 'median CPU', 'target', 'result'];
  const body = rows.map((r) => [r.name, r.value, r.cpu, r.target, r.pass ? 'ok' : 'SLOW']);
  const widths = header.map((h, i) => Math.max(h.length, ...body.map((cells) => (cells[i] ?? '').length)));
  const line = (cells: readonly string[]): string => cells.map((c, i) => c.padEnd(widths[i] ?? 0)).join('  ');
  return [line(header), widths.map((w) => '-'.repeat(w)).join('  '), ...body.map(line)].join('\n');
}

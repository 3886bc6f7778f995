import { describe, expect, it } from 'vitest';
import { createRandom } from '../../../shared/engine/risk/random';

const draw = (seed: number, n: number, stream = 0): number[] => {
  const random = createRandom(seed, stream);
  return Array.from({ length: n }, () => random.next());
};

/**
 * Independent xoroshiro128+ on 64-bit BigInts, from the published algorithm (Blackman & Vigna,
 * "Scrambled linear pseudorandom number generators", 2018; the 2016 constants a=24, b=16, c=37 —
 * from memory). pure-rand runs it on 32-bit halves and returns the low 32 bits of s0 + s1.
 */
function referenceSequence(seed: number, n: number, stream = 0): number[] {
  const mask64 = (1n << 64n) - 1n;
  const rotl = (x: bigint, k: bigint): bigint => ((x << k) | (x >> (64n - k))) & mask64;
  const u32 = (x: number): bigint => BigInt(x >>> 0);
  // MurmurHash3 fmix32 (Appleby, MurmurHash3 reference source — from memory).
  let h = seed >>> 0;
  h = (h ^ (h >>> 16)) >>> 0;
  h = Number((BigInt(h) * 0x85ebca6bn) & 0xffffffffn);
  h = (h ^ (h >>> 13)) >>> 0;
  h = Number((BigInt(h) * 0xc2b2ae35n) & 0xffffffffn);
  h = (h ^ (h >>> 16)) >>> 0;
  // pure-rand's seeding: s0 = (0xFFFFFFFF, ~seed), s1 = (seed, 0) as (high, low) words.
  let s0 = (0xffffffffn << 32n) | u32(~h);
  let s1 = u32(h) << 32n;
  const nextRaw = (): bigint => {
    const out = (s0 + s1) & 0xffffffffn;
    const x = s1 ^ s0;
    s0 = rotl(s0, 24n) ^ x ^ ((x << 16n) & mask64);
    s1 = rotl(x, 37n);
    return out;
  };
  for (let i = 0; i < 20; i += 1) nextRaw();
  // The jump polynomial of xoroshiro128+ (Vigna's reference source, xoroshiro128plus.c — from
  // memory): equivalent to 2⁶⁴ calls of next().
  const JUMP = [0xdf900294d8f554a5n, 0x170865df4b3201fcn];
  for (let k = 0; k < stream; k += 1) {
    let t0 = 0n;
    let t1 = 0n;
    for (const word of JUMP) {
      for (let b = 0n; b < 64n; b += 1n) {
        if ((word >> b) & 1n) {
          t0 ^= s0;
          t1 ^= s1;
        }
        nextRaw();
      }
    }
    s0 = t0;
    s1 = t1;
  }
  // 53-bit float from two 32-bit outputs: 26 + 27 bits.
  return Array.from({ length: n }, () => {
    const high = Number(nextRaw() & ((1n << 26n) - 1n));
    const low = Number(nextRaw() & ((1n << 27n) - 1n));
    return high * 2 ** -26 + low * 2 ** -53;
  });
}

describe('createRandom', () => {
  it('gives the same sequence for the same seed', () => {
    expect(draw(20240601, 1000)).toEqual(draw(20240601, 1000));
  });

  it('gives different sequences for different seeds', () => {
    const a = draw(1, 100);
    const b = draw(2, 100);
    const equalPositions = a.filter((v, i) => v === b[i]).length;
    expect(equalPositions).toBe(0);
  });

  it('matches an independent 64-bit xoroshiro128+ built from the published algorithm', () => {
    for (const seed of [0, 1, 42, -7, 2 ** 31 - 1]) {
      expect(draw(seed, 200)).toEqual(referenceSequence(seed, 200));
    }
  });

  it('jumps stream k of a seed 2⁶⁴·k outputs ahead, as the published jump function does', () => {
    for (const seed of [1, 20261201]) {
      for (const stream of [1, 2, 7]) expect(draw(seed, 50, stream)).toEqual(referenceSequence(seed, 50, stream));
    }
  });

  it('gives each stream of one seed its own sequence', () => {
    const streams = [0, 1, 2, 3].map((stream) => draw(99, 200, stream));
    const values = new Set(streams.flat());
    // 800 draws of 53 bits: a repeat would be a coincidence of chance about 800² / 2⁵⁴.
    expect(values.size).toBe(800);
  });

  it('stays in [0, 1) with the uniform mean 1/2 and variance 1/12', () => {
    // Uniform(0,1): mean 1/2, variance 1/12 — standard result.
    const n = 200_000;
    const values = draw(7, n);
    expect(values.every((v) => v >= 0 && v < 1)).toBe(true);
    const m = values.reduce((s, v) => s + v, 0) / n;
    const variance = values.reduce((s, v) => s + (v - m) ** 2, 0) / (n - 1);
    // Five standard errors of the mean: sqrt(1/12 / n) ≈ 6.5e-4.
    expect(Math.abs(m - 0.5)).toBeLessThan(5 * Math.sqrt(1 / 12 / n));
    expect(Math.abs(variance - 1 / 12)).toBeLessThan(0.002);
  });

  it('does not tie the first number to the seed when seeds are neighbours', () => {
    // Seeds 1..2000 used one after another must still give first draws spread like Uniform(0,1):
    // mean 1/2 within five standard errors, and every tenth of [0,1) hit (standard result).
    const firsts = Array.from({ length: 2000 }, (_, i) => createRandom(i + 1).next());
    const m = firsts.reduce((s, v) => s + v, 0) / firsts.length;
    expect(Math.abs(m - 0.5)).toBeLessThan(5 * Math.sqrt(1 / 12 / firsts.length));
    const deciles = new Set(firsts.map((v) => Math.floor(v * 10)));
    expect(deciles.size).toBe(10);
  });
});

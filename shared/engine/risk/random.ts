import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';
import { uniformFloat64 } from 'pure-rand/distribution/uniformFloat64';

/** A seeded source of uniform numbers in [0, 1). */
export interface Random {
  /** Next uniform number in [0, 1), a multiple of 2⁻⁵³. */
  next(): number;
}

/**
 * xoroshiro128+ starts from the raw seed in two of its four state words, so neighbouring seeds
 * (1, 2, 3 …) give nearly equal first outputs. Scrambling the seed and discarding a short
 * warm-up run breaks that link; both steps use only 32-bit integer arithmetic (`Math.imul`,
 * shifts), so every JavaScript engine — browser, Web Worker, Node — gives the same numbers.
 */
const WARM_UP_OUTPUTS = 20;

/** MurmurHash3's 32-bit finaliser: a bijection on 32-bit integers with full avalanche. */
function scrambleSeed(seed: number): number {
  let h = seed | 0;
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  h ^= h >>> 16;
  return h | 0;
}

/**
 * Seeded uniform generator (xoroshiro128+ from `pure-rand`, 53-bit floats).
 * The seed is an integer; only its low 32 bits count. Same seed and stream → same sequence
 * everywhere. Stream k is the seed's sequence jumped k times by 2⁶⁴ outputs (xoroshiro128+'s
 * jump function), so the streams of one seed never overlap: a Monte Carlo block uses its own.
 */
export function createRandom(seed: number, stream = 0): Random {
  const generator = xoroshiro128plus(scrambleSeed(Math.trunc(seed)));
  for (let i = 0; i < WARM_UP_OUTPUTS; i += 1) generator.next();
  for (let k = 0; k < stream; k += 1) generator.jump();
  return { next: () => uniformFloat64(generator) };
}

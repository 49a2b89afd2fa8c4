// Seeded random numbers, identical on every machine: xoshiro128** (Blackman & Vigna,
// "Scrambled linear pseudorandom number generators", ACM TOMS 47, 2021) seeded through
// splitmix64 as its authors recommend. Every permutation gets its own stream keyed by
// (seed, purpose, permutation number), so any split of the permutations into chunks,
// threads or processes draws exactly the same numbers.

const MASK64 = (1n << 64n) - 1n;
const GOLDEN = 0x9e3779b97f4a7c15n;
const TWO_TO_MINUS_32 = 2 ** -32;

/** splitmix64's output function: a bijection on 64-bit words with good avalanche. */
function mix64(z: bigint): bigint {
  z = ((z ^ (z >> 30n)) * 0xbf58476d1ce4e5b9n) & MASK64;
  z = ((z ^ (z >> 27n)) * 0x94d049bb133111ebn) & MASK64;
  return z ^ (z >> 31n);
}

/** What a stream is for, so different uses of one seed never share numbers. */
export const STREAM_SITE_PERMUTATION = 1;
export const STREAM_SIGN_FLIP = 2;
export const STREAM_TEST = 3;

export function assertSeed(seed: number): void {
  if (!Number.isSafeInteger(seed)) throw new RangeError(`seed must be a safe integer, got ${seed}`);
}

/**
 * Start state (four 32-bit words) of the stream for (seed, purpose, index). mix64 is a
 * bijection, so for one seed and purpose distinct indices give distinct states.
 */
export function streamState(seed: number, purpose: number, index: number): Int32Array {
  assertSeed(seed);
  let x = mix64(BigInt.asUintN(64, BigInt(seed)) ^ ((BigInt(purpose) * GOLDEN) & MASK64));
  x = mix64(x ^ BigInt.asUintN(64, BigInt(index)));
  // Two splitmix64 steps from x fill the 128-bit state.
  const a = mix64((x + GOLDEN) & MASK64);
  const b = mix64((x + 2n * GOLDEN) & MASK64);
  const state = Int32Array.of(Number(a & 0xffffffffn), Number(a >> 32n), Number(b & 0xffffffffn), Number(b >> 32n));
  // The all-zero state is the one fixed point of the generator.
  if ((state[0]! | state[1]! | state[2]! | state[3]!) === 0) state[0] = 1;
  return state;
}

/**
 * xoshiro128**, as in its authors' reference C code. The permutation kernel
 * inlines the same steps for speed; tests check both draw identical numbers.
 */
export class Xoshiro128 {
  private s0: number;
  private s1: number;
  private s2: number;
  private s3: number;

  constructor(s0: number, s1: number, s2: number, s3: number) {
    // The all-zero state is the one fixed point of the generator.
    if ((s0 | s1 | s2 | s3) === 0) s0 = 1;
    this.s0 = s0 | 0;
    this.s1 = s1 | 0;
    this.s2 = s2 | 0;
    this.s3 = s3 | 0;
  }

  /** The stream for (seed, purpose, index): distinct indices give distinct start states. */
  static stream(seed: number, purpose: number, index: number): Xoshiro128 {
    const s = streamState(seed, purpose, index);
    return new Xoshiro128(s[0]!, s[1]!, s[2]!, s[3]!);
  }

  /** Next 32-bit output as an unsigned integer. */
  nextU32(): number {
    const s1 = this.s1;
    const result = Math.imul(rotl(Math.imul(s1, 5), 7), 9) >>> 0;
    const t = s1 << 9;
    this.s2 ^= this.s0;
    this.s3 ^= s1;
    this.s1 ^= this.s2;
    this.s0 ^= this.s3;
    this.s2 ^= t;
    this.s3 = rotl(this.s3, 11);
    return result;
  }

  /** Uniform double in [0, 1) with 32 bits of resolution. */
  nextFloat(): number {
    return this.nextU32() / 4294967296;
  }

  /**
   * Uniform integer in [0, m), without modulo bias: Lemire's multiply-and-reject
   * ("Fast random integer generation in an interval", ACM TOMACS 29, 2019). The 32 x 21-bit
   * product is exact in a double; larger ranges fall back to rejection by remainder.
   */
  below(m: number): number {
    if (m <= 2097152) {
      // Scaling by 2^-32 is exact, and avoids V8's slow ToUint32 on large doubles.
      let prod = this.nextU32() * m;
      let high = (prod * TWO_TO_MINUS_32) | 0;
      let low = prod - high * 4294967296;
      if (low < m) {
        const threshold = (4294967296 - m) % m;
        while (low < threshold) {
          prod = this.nextU32() * m;
          high = (prod * TWO_TO_MINUS_32) | 0;
          low = prod - high * 4294967296;
        }
      }
      return high;
    }
    const limit = 4294967296 - (4294967296 % m);
    let x = this.nextU32();
    while (x >= limit) x = this.nextU32();
    return x % m;
  }
}

function rotl(x: number, k: number): number {
  return (x << k) | (x >>> (32 - k));
}

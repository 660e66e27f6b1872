/**
 * Seeded random numbers for Monte Carlo envelopes: the same seed gives the same numbers in the browser
 * worker, on the server and in tests, so a coach sees the same envelope wherever it is computed.
 * Generator: xoshiro128** (Blackman & Vigna 2018), seeded by SplitMix32; normals by Box–Muller.
 */

import { requireInteger } from './validate';

function splitMix32(state: number): [number, number] {
  const next = (state + 0x9e3779b9) | 0;
  let z = next;
  z = Math.imul(z ^ (z >>> 16), 0x85ebca6b);
  z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35);
  return [next, (z ^ (z >>> 16)) >>> 0];
}

/** Deterministic pseudo-random stream (not for security). */
export class SeededRandom {
  private s0: number;
  private s1: number;
  private s2: number;
  private s3: number;
  private spare: number | null = null;

  /** `seed` is an integer in [0, 2^32); equal seeds give equal streams. */
  constructor(seed: number) {
    requireInteger('seed', seed, 0, 0xffffffff);
    let st = seed | 0;
    let v: number;
    [st, v] = splitMix32(st);
    this.s0 = v;
    [st, v] = splitMix32(st);
    this.s1 = v;
    [st, v] = splitMix32(st);
    this.s2 = v;
    [st, v] = splitMix32(st);
    this.s3 = v;
    if ((this.s0 | this.s1 | this.s2 | this.s3) === 0) this.s0 = 1;
  }

  /** Next 32-bit unsigned integer (xoshiro128**). */
  nextUint32(): number {
    const result = Math.imul(rotl(Math.imul(this.s1, 5), 7), 9) >>> 0;
    const t = this.s1 << 9;
    this.s2 ^= this.s0;
    this.s3 ^= this.s1;
    this.s1 ^= this.s2;
    this.s0 ^= this.s3;
    this.s2 ^= t;
    this.s3 = rotl(this.s3, 11);
    return result;
  }

  /** Uniform in the open interval (0, 1). */
  uniform(): number {
    return (this.nextUint32() + 0.5) / 4294967296;
  }

  /** Standard normal deviate (Box–Muller, both values used in turn). */
  normal(): number {
    if (this.spare !== null) {
      const s = this.spare;
      this.spare = null;
      return s;
    }
    const r = Math.sqrt(-2 * Math.log(this.uniform()));
    const theta = 2 * Math.PI * this.uniform();
    this.spare = r * Math.sin(theta);
    return r * Math.cos(theta);
  }
}

function rotl(x: number, k: number): number {
  return (x << k) | (x >>> (32 - k));
}

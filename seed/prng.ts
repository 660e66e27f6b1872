/**
 * A small seeded pseudo-random number generator for the demo scenario.
 *
 * The demo data must be identical on every machine and every run for the same load date, so
 * nothing in `seed/` may use `Math.random` or `crypto.randomUUID`. This module provides the
 * SFC32 generator (Chris Doty-Humphrey's "small fast counting" design, public domain), a string
 * hash that turns a label into a 128-bit seed, and the few distributions the scenario needs.
 *
 * Streams are seeded from labels ("player:<key>", "session:<squad>:<week>:<slot>") rather than
 * drawn from one long stream, so adding a player or a drill does not reshuffle everything else.
 */

/** Fixed scenario seed: changing it produces a different (but equally deterministic) academy. */
export const DEMO_SEED = 0x4b56_4131;

const UINT32 = 0x1_0000_0000;

/**
 * Hashes a string to four 32-bit words (four FNV-1a lanes with distinct offsets, then mixed),
 * enough state for SFC32 so that distinct labels give independent-looking streams.
 */
export function hashLabel(label: string, seed: number = DEMO_SEED): [number, number, number, number] {
  let h1 = (0x811c9dc5 ^ seed) >>> 0;
  let h2 = (0x01000193 ^ Math.imul(seed, 0x9e3779b1)) >>> 0;
  let h3 = (0x85ebca6b ^ seed) >>> 0;
  let h4 = (0xc2b2ae35 ^ Math.imul(seed, 0x27d4eb2f)) >>> 0;
  for (let i = 0; i < label.length; i++) {
    const c = label.charCodeAt(i);
    h1 = Math.imul(h1 ^ c, 0x01000193);
    h2 = Math.imul(h2 ^ c, 0x5bd1e995);
    h3 = Math.imul(h3 ^ c, 0x1b873593);
    h4 = Math.imul(h4 ^ c, 0xcc9e2d51);
  }
  // Final avalanche so that labels differing only in their last character still diverge fully.
  const mix = (h: number, k: number): number => {
    let x = Math.imul(h ^ (h >>> 16), 0x85ebca6b);
    x = Math.imul(x ^ (x >>> 13), k);
    return (x ^ (x >>> 16)) >>> 0;
  };
  return [mix(h1, 0xc2b2ae35), mix(h2 ^ h1, 0x27d4eb2f), mix(h3 ^ h2, 0x165667b1), mix(h4 ^ h3, 0xd3a2646c)];
}

/** A seeded random stream with the distributions the demo scenario draws from. */
export class Prng {
  private a: number;
  private b: number;
  private c: number;
  private d: number;

  /** Seeds SFC32 with four words and discards the first outputs (they correlate with the seed). */
  constructor(seedWords: readonly [number, number, number, number]) {
    [this.a, this.b, this.c, this.d] = seedWords.map((w) => w >>> 0) as [number, number, number, number];
    for (let i = 0; i < 15; i++) this.nextUint32();
  }

  /** A stream for one named part of the scenario, independent of every other label's stream. */
  static fromLabel(label: string): Prng {
    return new Prng(hashLabel(label));
  }

  /** Next raw 32-bit output (SFC32 step). */
  nextUint32(): number {
    const t = (((this.a + this.b) | 0) + this.d) | 0;
    this.d = (this.d + 1) | 0;
    this.a = this.b ^ (this.b >>> 9);
    this.b = (this.c + (this.c << 3)) | 0;
    this.c = (this.c << 21) | (this.c >>> 11);
    this.c = (this.c + t) | 0;
    return t >>> 0;
  }

  /** Uniform in [0, 1). */
  next(): number {
    return this.nextUint32() / UINT32;
  }

  /** Uniform in [min, max). */
  uniform(min: number, max: number): number {
    return min + (max - min) * this.next();
  }

  /** Uniform integer in [min, max], both ends included. */
  int(min: number, max: number): number {
    return min + Math.floor(this.next() * (max - min + 1));
  }

  /** True with probability `p`. */
  chance(p: number): boolean {
    return this.next() < p;
  }

  /** Normal deviate (Box–Muller; one draw per call keeps the stream easy to reason about). */
  normal(mean = 0, sd = 1): number {
    const u1 = 1 - this.next(); // (0, 1]: log(0) impossible
    const u2 = this.next();
    return mean + sd * Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
  }

  /** One element, uniformly. */
  pick<T>(items: readonly T[]): T {
    if (items.length === 0) throw new Error('pick() from an empty list');
    return items[Math.floor(this.next() * items.length)] as T;
  }

  /** One element, with the given relative weights (same length as `items`). */
  weighted<T>(items: readonly T[], weights: readonly number[]): T {
    const total = weights.reduce((s, w) => s + w, 0);
    let r = this.next() * total;
    for (let i = 0; i < items.length; i++) {
      r -= weights[i] ?? 0;
      if (r < 0) return items[i] as T;
    }
    return items[items.length - 1] as T;
  }

  /** A shuffled copy (Fisher–Yates). */
  shuffle<T>(items: readonly T[]): T[] {
    const out = items.slice();
    for (let i = out.length - 1; i > 0; i--) {
      const j = Math.floor(this.next() * (i + 1));
      const tmp = out[i] as T;
      out[i] = out[j] as T;
      out[j] = tmp;
    }
    return out;
  }

  /** A UUID v4-formatted id from the stream (random bits, version 4, RFC 4122 variant). */
  uuid(): string {
    const words = [this.nextUint32(), this.nextUint32(), this.nextUint32(), this.nextUint32()];
    words[1] = ((words[1] as number) & 0xffff0fff) | 0x00004000; // version nibble
    words[2] = ((words[2] as number) & 0x3fffffff) | 0x80000000; // variant bits 10xx
    const hex = words.map((w) => (w >>> 0).toString(16).padStart(8, '0')).join('');
    return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-${hex.slice(12, 16)}-${hex.slice(16, 20)}-${hex.slice(20)}`;
  }
}

/**
 * A stable UUID v4-formatted id for a named demo entity ("club", "user:admin", ...), so tests
 * and documentation can refer to the same ids whatever the load date.
 */
export function stableId(label: string): string {
  return Prng.fromLabel(`id:${label}`).uuid();
}

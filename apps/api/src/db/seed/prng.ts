/**
 * A small seeded pseudo-random number generator for the invented demo data, so that every
 * build of the demo city gives the same numbers (no Math.random anywhere in the seed).
 */

/** A source of numbers uniformly spread over [0, 1). */
export type Rng = () => number;

/** mulberry32: a 32-bit state generator, good enough for demo data and very small. */
export function mulberry32(seed: number): Rng {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** FNV-1a hash of a text, to give each site or station its own stable seed. */
function hashSeed(text: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h >>> 0;
}

/** A generator seeded from a text key. */
export function rngFor(key: string): Rng {
  return mulberry32(hashSeed(key));
}

/** Uniform number in [min, max). */
export function uniform(rng: Rng, min: number, max: number): number {
  return min + (max - min) * rng();
}

/** Standard normal deviate (Box–Muller). */
export function normal(rng: Rng): number {
  const u = Math.max(rng(), 1e-12);
  const v = rng();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
}

// Small seeded pseudo-random numbers so that every simulated history is reproducible.

/** mulberry32: a tiny 32-bit generator, good enough for simulation noise (common practice). */
export function createRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Mixes several integers into one 32-bit seed (so weather for hour h depends only on seed and h). */
export function hashSeed(...parts: number[]): number {
  let h = 0x811c9dc5;
  for (const part of parts) {
    h = Math.imul(h ^ (part | 0), 0x01000193);
    h = Math.imul(h ^ (h >>> 13), 0x5bd1e995);
    h ^= h >>> 15;
  }
  return h >>> 0;
}

/** A deterministic value in [0, 1) for a given tuple of integers. */
export function randomAt(...parts: number[]): number {
  return createRandom(hashSeed(...parts))();
}

/** Turns a text (a node slug) into a seed, so each node has its own noise stream. */
export function seedFromText(text: string): number {
  let h = 2166136261;
  for (let i = 0; i < text.length; i += 1) h = Math.imul(h ^ text.charCodeAt(i), 16777619);
  return h >>> 0;
}

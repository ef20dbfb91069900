/**
 * mulberry32: a small seeded pseudo-random generator (Tommy Ettinger's public-domain 32-bit generator) giving
 * numbers in [0, 1). The demo seed, the tests and the benchmarks use it so a run can be replayed from its seed;
 * the engine itself takes no randomness.
 */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * Reproducible white Gaussian noise for tests: mulberry32 (a small 32-bit
 * generator in common use) feeding the Box–Muller transform (G. E. P. Box,
 * M. E. Muller, Ann. Math. Statist. 29, 1958).
 */
export function seededGaussian(seed: number): () => number {
  let state = seed >>> 0;
  const uniform = (): number => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  let spare: number | null = null;
  return () => {
    if (spare !== null) {
      const v = spare;
      spare = null;
      return v;
    }
    let u1 = uniform();
    while (u1 === 0) u1 = uniform();
    const u2 = uniform();
    const r = Math.sqrt(-2 * Math.log(u1));
    spare = r * Math.sin(2 * Math.PI * u2);
    return r * Math.cos(2 * Math.PI * u2);
  };
}

export function gaussianRecord(length: number, seed: number): Float64Array {
  const next = seededGaussian(seed);
  const out = new Float64Array(length);
  for (let i = 0; i < length; i++) out[i] = next();
  return out;
}

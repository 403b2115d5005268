import FFT from 'fft.js';

/**
 * Discrete Fourier transform of a real segment, X[k] = Σ x[i]·e^{−j2πki/n}
 * for k = 0..n/2, by fft.js's radix-4 real transform (Cooley–Tukey). Output
 * is interleaved: out[2k] = Re X[k], out[2k+1] = Im X[k]; `out` must hold 2n
 * numbers because fft.js uses the upper half as scratch.
 */
export interface RealFft {
  readonly size: number;
  transform(segment: Float64Array, out: Float64Array): void;
}

// fft.js precomputes a twiddle table of 2n numbers per size; keep the few most
// recent sizes so repeated requests with one segment length build it once.
const CACHE_LIMIT = 4;
const cache = new Map<number, RealFft>();

/** One transform per size, shared between calls. `size` must be a power of two ≥ 2. */
export function realFftOfSize(size: number): RealFft {
  const hit = cache.get(size);
  if (hit) {
    cache.delete(size);
    cache.set(size, hit);
    return hit;
  }
  const engine = new FFT(size);
  const fft: RealFft = {
    size,
    transform(segment, out) {
      engine.realTransform(out, segment);
    },
  };
  cache.set(size, fft);
  if (cache.size > CACHE_LIMIT) cache.delete(cache.keys().next().value as number);
  return fft;
}

/**
 * Periodic Hann window w[i] = 0.5 − 0.5·cos(2πi/n), i = 0..n−1: the
 * "DFT-even" form recommended for spectral analysis by F. J. Harris, "On the
 * use of windows for harmonic analysis with the discrete Fourier transform",
 * Proc. IEEE 66(1), 1978 — the same as scipy.signal.get_window('hann', n)
 * (sym=False). Returns the window and Σw², the latter for density scaling.
 */
export function periodicHannWindow(n: number): { window: Float64Array; sumOfSquares: number } {
  const window = new Float64Array(n);
  let sumOfSquares = 0;
  for (let i = 0; i < n; i++) {
    const w = 0.5 - 0.5 * Math.cos((2 * Math.PI * i) / n);
    window[i] = w;
    sumOfSquares += w * w;
  }
  return { window, sumOfSquares };
}

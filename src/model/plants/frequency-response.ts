/**
 * Plant given as measured frequency-response data. Between the measured
 * frequencies it is interpolated linearly in log-frequency, in dB-magnitude
 * and unwrapped phase — the usual reading of a Bode plot between its points —
 * and it is not defined outside the measured band (the analysis stays inside).
 *
 * A second, cubic interpolant (four-point Lagrange in log ω) serves only to
 * estimate the interpolation error of the figures.
 */
import type { FrequencyModel } from '../frequency-model.js';
import { normaliseMeasuredResponse, type MeasuredPlantDescription, type MeasuredResponse } from './measured-data.js';

export type Interpolation = 'linear' | 'cubic';

export interface MeasuredModel extends FrequencyModel {
  data: MeasuredResponse;
  averages: number | null;
  /** The same data read with the other interpolant. */
  withInterpolation(kind: Interpolation): MeasuredModel;
}

const LN10_20 = Math.log(10) / 20;

/** Index i with x[i] ≤ v ≤ x[i+1], clamped to the ends. */
function bracket(x: Float64Array, v: number, hint: { i: number }): number {
  let i = hint.i;
  const n = x.length;
  if (i < 0 || i > n - 2) i = 0;
  if (v >= x[i] && v <= x[i + 1]) return i;
  // The grid walks the data in increasing order: the next interval is the usual answer (the same one the search below finds).
  if (i + 2 < n && v >= x[i + 1] && v < x[i + 2]) {
    hint.i = i + 1;
    return i + 1;
  }
  let lo = 0;
  let hi = n - 2;
  if (v <= x[0]) return 0;
  if (v >= x[n - 1]) return n - 2;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (x[mid] <= v) lo = mid;
    else hi = mid - 1;
  }
  hint.i = lo;
  return lo;
}

/** ln ω, dB and radians of the data: what both interpolants read (computed once, shared by them). */
interface Columns {
  logW: Float64Array;
  db: Float64Array;
  ph: Float64Array;
}

function interpolationColumns(data: MeasuredResponse): Columns {
  const n = data.omega.length;
  // One buffer, filled by plain loops: Float64Array.from with a mapping function is several times slower.
  const buffer = new ArrayBuffer(3 * 8 * n);
  const logW = new Float64Array(buffer, 0, n);
  const db = new Float64Array(buffer, 8 * n, n);
  const ph = new Float64Array(buffer, 16 * n, n);
  for (let i = 0; i < n; i++) {
    logW[i] = Math.log(data.omega[i]);
    db[i] = 20 * Math.log10(data.magnitude[i]);
    ph[i] = (data.phaseDeg[i] * Math.PI) / 180;
  }
  return { logW, db, ph };
}

function measuredFromData(
  data: MeasuredResponse,
  plant: MeasuredPlantDescription,
  kind: Interpolation,
  columns: Columns = interpolationColumns(data),
): MeasuredModel {
  const n = data.omega.length;
  const { logW, db, ph } = columns;
  const hint = { i: 0 };
  const interpolate = (x: number, out: { db: number; ph: number }) => {
    const i = bracket(logW, x, hint);
    if (kind === 'linear' || n < 4) {
      const t = (x - logW[i]) / (logW[i + 1] - logW[i]);
      out.db = db[i] + t * (db[i + 1] - db[i]);
      out.ph = ph[i] + t * (ph[i + 1] - ph[i]);
      return out;
    }
    // Four points around the bracket, shifted inwards at the ends.
    const j = Math.min(Math.max(i - 1, 0), n - 4);
    let d = 0;
    let p = 0;
    for (let a = j; a < j + 4; a++) {
      let w = 1;
      for (let b = j; b < j + 4; b++) if (b !== a) w *= (x - logW[b]) / (logW[a] - logW[b]);
      d += w * db[a];
      p += w * ph[a];
    }
    out.db = d;
    out.ph = p;
    return out;
  };
  const tmp = { db: 0, ph: 0 };
  const integrators = plant.integrators ?? 0;
  const model: MeasuredModel = {
    evaluate(omega, out) {
      interpolate(Math.log(omega), tmp);
      const m = Math.exp(tmp.db * LN10_20);
      out.re = m * Math.cos(tmp.ph);
      out.im = m * Math.sin(tmp.ph);
      return out;
    },
    rational: null,
    poles: null,
    zeros: null,
    delay: 0,
    phaseRate: 0,
    integrators,
    imaginaryAxisPoles: [],
    unstablePoles: plant.openLoopUnstablePoles ?? 0,
    unstablePolesAssumed: plant.openLoopUnstablePoles === undefined,
    relativeDegree: null,
    highFrequencyGain: NaN,
    lowFrequencyGain: NaN,
    characteristicFrequencies: [data.omega[0], data.omega[n - 1]],
    magnitudeBoundAbove: () => Infinity,
    deviationBoundAbove: () => Infinity,
    exact: false,
    sampledBand: { min: data.omega[0], max: data.omega[n - 1], frequencies: data.omega },
    referencePhaseDeg: (omega) => (interpolate(Math.log(omega), tmp).ph * 180) / Math.PI,
    data,
    averages: plant.averages ?? null,
    withInterpolation: (k) => measuredFromData(data, plant, k, columns),
  };
  return model;
}

export function frequencyResponseModel(plant: MeasuredPlantDescription, path: (string | number)[] = ['plant']): MeasuredModel {
  return measuredFromData(normaliseMeasuredResponse(plant, path), plant, 'linear');
}

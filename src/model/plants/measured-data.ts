/**
 * Normalises a measured frequency response — magnitude/phase or real/imag
 * arrays, or a CSV table — to increasing frequencies in rad/s, magnitudes in
 * absolute units, unwrapped phases in degrees and optional coherence.
 */
import { unwrapDegrees } from '../../numeric/unwrap.js';
import { ModelError } from '../model-error.js';

export interface MeasuredPlantDescription {
  kind: 'frequency-response';
  frequency?: number[];
  magnitude?: number[];
  phase?: number[];
  real?: number[];
  imag?: number[];
  csv?: string;
  frequencyUnit?: 'rad/s' | 'Hz';
  magnitudeUnit?: 'absolute' | 'dB';
  phaseUnit?: 'deg' | 'rad';
  coherence?: number[];
  averages?: number;
  openLoopUnstablePoles?: number;
  integrators?: number;
}

export interface MeasuredResponse {
  omega: Float64Array;
  magnitude: Float64Array;
  phaseDeg: Float64Array;
  coherence: Float64Array | null;
  /** Largest step between neighbouring unwrapped phases, degrees (near 180° the unwrapping is a guess). */
  largestPhaseStepDeg: number;
}

type Path = (string | number)[];

/** Columns of a CSV table with a header row; '#' lines and blank lines are skipped. */
export function parseCsvColumns(text: string, path: Path): Record<string, number[]> {
  const lines = text.split(/\r?\n/).map((l) => l.trim()).filter((l) => l && !l.startsWith('#'));
  if (lines.length < 3) throw new ModelError('csv_invalid', 'The CSV needs a header row and at least two data rows.', path);
  const split = (l: string) => l.split(/[,;\t]/).map((c) => c.trim());
  const header = split(lines[0]).map((h) => h.toLowerCase());
  const allowed = ['frequency', 'magnitude', 'phase', 'real', 'imag', 'coherence'];
  header.forEach((h) => {
    if (!allowed.includes(h)) throw new ModelError('csv_invalid', `Unknown CSV column "${h}"; use ${allowed.join(', ')}.`, path);
  });
  if (new Set(header).size !== header.length) throw new ModelError('csv_invalid', 'A CSV column is named twice.', path);
  const columns: Record<string, number[]> = Object.fromEntries(header.map((h) => [h, []]));
  for (let i = 1; i < lines.length; i++) {
    const cells = split(lines[i]);
    if (cells.length !== header.length) {
      throw new ModelError('csv_invalid', `CSV row ${i + 1} has ${cells.length} cells; the header has ${header.length}.`, path);
    }
    cells.forEach((c, k) => {
      const v = c === '' ? NaN : Number(c);
      if (!Number.isFinite(v)) throw new ModelError('csv_invalid', `CSV row ${i + 1}, column "${header[k]}": "${c.slice(0, 20)}" is not a finite number.`, path);
      columns[header[k]].push(v);
    });
  }
  return columns;
}

export function normaliseMeasuredResponse(plant: MeasuredPlantDescription, path: Path = ['plant']): MeasuredResponse {
  let { frequency, magnitude, phase, real, imag, coherence } = plant;
  if (plant.csv !== undefined) {
    if (frequency || magnitude || phase || real || imag || coherence) {
      throw new ModelError('measured_data_ambiguous', 'Give the data either as csv or as arrays, not both.', [...path, 'csv']);
    }
    const c = parseCsvColumns(plant.csv, [...path, 'csv']);
    ({ frequency, magnitude, phase, real, imag, coherence } = c);
  }
  const polar = magnitude !== undefined || phase !== undefined;
  const cartesian = real !== undefined || imag !== undefined;
  if (!frequency) throw new ModelError('measured_data_incomplete', 'Measured data needs a frequency column.', [...path, 'frequency']);
  if (polar === cartesian || (polar && (!magnitude || !phase)) || (cartesian && (!real || !imag))) {
    throw new ModelError('measured_data_incomplete', 'Give magnitude and phase, or real and imag (one pair, both of it).', path);
  }
  const n = frequency.length;
  const check = (arr: number[] | undefined, name: string) => {
    if (arr && arr.length !== n) throw new ModelError('measured_data_lengths', `${name} has ${arr.length} values; frequency has ${n}.`, [...path, name]);
  };
  check(magnitude, 'magnitude');
  check(phase, 'phase');
  check(real, 'real');
  check(imag, 'imag');
  check(coherence, 'coherence');
  if (n < 4) throw new ModelError('measured_data_too_short', 'Measured data needs at least 4 frequencies.', [...path, 'frequency']);
  const toRad = plant.frequencyUnit === 'Hz' ? 2 * Math.PI : 1;
  const omega = new Float64Array(n);
  for (let i = 0; i < n; i++) omega[i] = frequency[i] * toRad;
  for (let i = 0; i < n; i++) {
    if (!(omega[i] > 0)) throw new ModelError('measured_frequency_not_positive', `frequency[${i}] = ${frequency[i]} must be above 0.`, [...path, 'frequency', i]);
    if (i > 0 && omega[i] === omega[i - 1]) throw new ModelError('measured_frequency_duplicated', `frequency[${i}] repeats frequency[${i - 1}].`, [...path, 'frequency', i]);
    if (i > 0 && omega[i] < omega[i - 1]) throw new ModelError('measured_frequency_unsorted', `frequency[${i}] is below frequency[${i - 1}]; sort the data by frequency.`, [...path, 'frequency', i]);
  }
  const mag = new Float64Array(n);
  const wrapped = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    if (polar) {
      mag[i] = plant.magnitudeUnit === 'dB' ? Math.pow(10, magnitude![i] / 20) : magnitude![i];
      wrapped[i] = plant.phaseUnit === 'rad' ? (phase![i] * 180) / Math.PI : phase![i];
    } else {
      mag[i] = Math.hypot(real![i], imag![i]);
      wrapped[i] = (Math.atan2(imag![i], real![i]) * 180) / Math.PI;
    }
    if (!(mag[i] > 0)) throw new ModelError('measured_magnitude_not_positive', `The magnitude at index ${i} is not positive.`, [...path, polar ? 'magnitude' : 'real', i]);
  }
  const unwrapped = unwrapDegrees(wrapped);
  let largestPhaseStepDeg = 0;
  for (let i = 1; i < n; i++) largestPhaseStepDeg = Math.max(largestPhaseStepDeg, Math.abs(unwrapped[i] - unwrapped[i - 1]));
  let coh: Float64Array | null = null;
  if (coherence) {
    coh = new Float64Array(coherence);
    coh.forEach((g, i) => {
      if (!(g >= 0 && g <= 1)) throw new ModelError('coherence_out_of_range', `coherence[${i}] = ${g} is outside [0, 1].`, [...path, 'coherence', i]);
    });
  }
  // Unwrap, keeping the first point where the caller put it (their branch choice).
  return { omega, magnitude: mag, phaseDeg: unwrapped, coherence: coh, largestPhaseStepDeg };
}

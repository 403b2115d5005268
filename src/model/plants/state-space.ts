/**
 * Single-input single-output plant ẋ = Ax + Bu, y = Cx + Du, with the input
 * delayed by T. It is converted once to N(s)/D(s) with
 *   D(s) = det(sI − A),  N(s) = det(sI − A + BC) + (D − 1)·det(sI − A),
 * the SISO determinant identity C(sI−A)⁻¹B = det(sI−A+BC)/det(sI−A) − 1
 * (a rank-one update of the determinant). Both polynomials are recovered
 * from their values at n+1 points on a circle by the discrete Fourier
 * transform (polynomial interpolation at scaled roots of unity), which is
 * well conditioned when the circle's radius matches the size of A's spectrum.
 */
import { complexDeterminant } from '../../numeric/complex-determinant.js';
import { trimLeading } from '../../numeric/polynomial.js';
import { rationalModel } from '../rational-model.js';
import type { FrequencyModel } from '../frequency-model.js';
import type { StateSpacePlant } from '../plant-description.js';
import { ModelError } from '../model-error.js';

function checkShapes(p: StateSpacePlant, path: (string | number)[]): number {
  const n = p.a.length;
  if (n === 0) throw new ModelError('state_space_shape', 'A must have at least one row.', [...path, 'a']);
  p.a.forEach((row, i) => {
    if (row.length !== n) throw new ModelError('state_space_shape', `A must be square: row ${i} has ${row.length} entries, expected ${n}.`, [...path, 'a', i]);
  });
  if (p.b.length !== n || p.b.some((row) => row.length !== 1)) {
    throw new ModelError('state_space_shape', `B must be ${n}×1 (one input).`, [...path, 'b']);
  }
  if (p.c.length !== 1 || p.c[0].length !== n) {
    throw new ModelError('state_space_shape', `C must be 1×${n} (one output).`, [...path, 'c']);
  }
  if (p.d && (p.d.length !== 1 || p.d[0].length !== 1)) {
    throw new ModelError('state_space_shape', 'D must be 1×1.', [...path, 'd']);
  }
  return n;
}

export function stateSpaceModel(plant: StateSpacePlant, path: (string | number)[] = ['plant']): FrequencyModel {
  const n = checkShapes(plant, path);
  const a = plant.a;
  const bc = (i: number, j: number) => plant.b[i][0] * plant.c[0][j];
  const dGain = plant.d ? plant.d[0][0] : 0;
  // Radius of the interpolation circle: the infinity norm of A bounds its spectral radius.
  let radius = 0;
  for (const row of a) radius = Math.max(radius, row.reduce((s, x) => s + Math.abs(x), 0));
  radius = radius > 0 ? radius : 1;
  const points = n + 1;
  const detA = new Array<{ re: number; im: number }>(points);
  const detABC = new Array<{ re: number; im: number }>(points);
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  for (let k = 0; k < points; k++) {
    const theta = (2 * Math.PI * k) / points;
    const sr = radius * Math.cos(theta);
    const si = radius * Math.sin(theta);
    for (const withBC of [false, true]) {
      for (let i = 0; i < n; i++) {
        for (let j = 0; j < n; j++) {
          re[i * n + j] = (i === j ? sr : 0) - a[i][j] + (withBC ? bc(i, j) : 0);
          im[i * n + j] = i === j ? si : 0;
        }
      }
      const det = complexDeterminant(re, im, n);
      if (withBC) detABC[k] = det;
      else detA[k] = det;
    }
  }
  const coefficients = (values: { re: number; im: number }[]) => {
    // c_i·r^i = (1/M) Σ_k v_k e^{−j2πik/M}; return descending powers.
    const ascending = new Array<number>(points);
    for (let i = 0; i < points; i++) {
      let sum = 0;
      for (let k = 0; k < points; k++) {
        const theta = (-2 * Math.PI * i * k) / points;
        sum += values[k].re * Math.cos(theta) - values[k].im * Math.sin(theta);
      }
      ascending[i] = sum / points / Math.pow(radius, i);
    }
    return ascending.reverse();
  };
  const denominator = coefficients(detA);
  denominator[0] = 1; // det(sI − A) is monic by construction; remove interpolation round-off there
  const numeratorValues = detABC.map((v, k) => ({ re: v.re + (dGain - 1) * detA[k].re, im: v.im + (dGain - 1) * detA[k].im }));
  const numerator = coefficients(numeratorValues);
  // Coefficients at round-off level of the largest are zero (they set the relative degree).
  const scale = Math.max(...numerator.map(Math.abs), ...denominator.map(Math.abs));
  const cleaned = numerator.map((c) => (Math.abs(c) <= 1e-13 * scale ? 0 : c));
  for (let i = cleaned.length - 1; i >= 0; i--) {
    if (Math.abs(denominator[i]) <= 1e-13 * scale) denominator[i] = 0;
  }
  if (cleaned.every((c) => c === 0)) {
    throw new ModelError('zero_numerator', 'The transfer function C(sI − A)⁻¹B + D is identically zero.', path);
  }
  return rationalModel(trimLeading(cleaned), denominator, plant.delay ?? 0);
}

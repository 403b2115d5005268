/** Plant given as k·Π(s − z)/Π(s − p)·e^{−sT}; evaluated from its factors. */
import type { Complex } from '../../numeric/complex.js';
import { fromRoots } from '../../numeric/polynomial.js';
import { rationalModel } from '../rational-model.js';
import type { FrequencyModel } from '../frequency-model.js';
import type { Root, ZerosPolesPlant } from '../plant-description.js';
import { ModelError } from '../model-error.js';

const asComplex = (r: Root): Complex => (typeof r === 'number' ? { re: r, im: 0 } : { re: r.re, im: r.im });

/**
 * Real systems have complex roots in conjugate pairs. Each root with a
 * non-zero imaginary part must find a partner with the same real part and
 * the opposite imaginary part (to 1e-12 relative), used once.
 */
function requireConjugatePairs(roots: Complex[], path: (string | number)[]): void {
  const used = new Uint8Array(roots.length);
  roots.forEach((r, i) => {
    if (r.im === 0 || used[i]) return;
    used[i] = 1;
    const size = Math.hypot(r.re, r.im);
    const j = roots.findIndex(
      (q, k) => !used[k] && Math.abs(q.re - r.re) <= 1e-12 * size && Math.abs(q.im + r.im) <= 1e-12 * size,
    );
    if (j < 0) {
      throw new ModelError(
        'unpaired_complex_root',
        `The root ${r.re}${r.im < 0 ? '-' : '+'}${Math.abs(r.im)}j has no conjugate partner; a real plant needs both.`,
        [...path, i],
      );
    }
    used[j] = 1;
  });
}

export function zerosPolesModel(plant: ZerosPolesPlant, path: (string | number)[] = ['plant']): FrequencyModel {
  const zeros = plant.zeros.map(asComplex);
  const poles = plant.poles.map(asComplex);
  requireConjugatePairs(zeros, [...path, 'zeros']);
  requireConjugatePairs(poles, [...path, 'poles']);
  if (plant.gain === 0) {
    throw new ModelError('zero_numerator', 'The gain is zero: the plant has no gain to analyse.', [...path, 'gain']);
  }
  return rationalModel(fromRoots(zeros, plant.gain), fromRoots(poles), plant.delay ?? 0, {
    zeros,
    poles,
    factored: { gain: plant.gain, zeros, poles },
  });
}

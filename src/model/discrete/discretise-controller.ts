/**
 * A continuous controller C(s) = k·Π(s − z_i)/Π(s − p_j) turned into a
 * difference equation C(z) by substituting for s (Åström & Wittenmark,
 * Computer-Controlled Systems, 3rd ed., §8.2; Franklin, Powell & Workman,
 * Digital Control of Dynamic Systems, 3rd ed., §6.1):
 *
 *   forward-euler   s = (z − 1)/Ts
 *   backward-euler  s = (z − 1)/(Ts·z)
 *   tustin          s = (2/Ts)·(z − 1)/(z + 1)
 *   tustin-prewarp  s = (ω0/tan(ω0·Ts/2))·(z − 1)/(z + 1), exact at ω = ω0
 *
 * The substitution is done factor by factor, so every discrete root comes
 * from its continuous root in closed form (e.g. Tustin z = (1 + rTs/2)/(1 − rTs/2)),
 * with its offset z − 1 computed without cancellation. A controller with
 * more zeros than poles (an unfiltered derivative) gets poles at z = −1
 * (Tustin) or z = 0 (backward Euler); under forward Euler it stays non-causal
 * and is refused.
 *
 * @example a PI controller kp + ki/s by backward Euler: ((kp + ki·Ts)z − kp)/(z − 1)
 */
import type { Complex } from '../../numeric/complex.js';
import { div, mul } from '../../numeric/complex.js';
import { ModelError } from '../model-error.js';
import { discreteRationalModel, type DiscreteModel } from './discrete-model.js';

export type DiscretisationMethod = 'tustin' | 'tustin-prewarp' | 'backward-euler' | 'forward-euler';

export interface ContinuousFactors {
  /** k in k·Π(s − z_i)/Π(s − p_j). */
  gain: number;
  zeros: Complex[];
  poles: Complex[];
}

export interface DiscretisationSettings {
  samplePeriod: number;
  method: DiscretisationMethod;
  /** ω0 in rad/s, for tustin-prewarp; below π/Ts. */
  prewarpFrequency?: number;
}

/** The scale α in s = α·(z − 1)/(z + 1). */
export function bilinearScale(s: DiscretisationSettings): number {
  if (s.method === 'tustin-prewarp') {
    const w0 = s.prewarpFrequency ?? NaN;
    return w0 / Math.tan((w0 * s.samplePeriod) / 2);
  }
  return 2 / s.samplePeriod;
}

interface MappedRoot {
  /** z − 1 of the discrete root. */
  offset: Complex;
  /** The factor that (s − r) contributes besides (z − ẑ) and the method's common denominator. */
  scale: Complex;
}

/** Where one continuous root r goes, and the constant it leaves behind. */
function mapRoot(r: Complex, s: DiscretisationSettings): MappedRoot {
  const ts = s.samplePeriod;
  const rTs = { re: r.re * ts, im: r.im * ts };
  switch (s.method) {
    case 'forward-euler':
      // (s − r) = (z − (1 + rTs))/Ts
      return { offset: rTs, scale: { re: 1 / ts, im: 0 } };
    case 'backward-euler': {
      // (s − r) = ((1 − rTs)/Ts)·(z − 1/(1 − rTs))/z
      const oneMinus = { re: 1 - rTs.re, im: -rTs.im };
      return { offset: div(rTs, oneMinus), scale: { re: oneMinus.re / ts, im: oneMinus.im / ts } };
    }
    default: {
      // (s − r) = (α − r)·(z − (α + r)/(α − r))/(z + 1)
      const alpha = bilinearScale(s);
      const alphaMinus = { re: alpha - r.re, im: -r.im };
      if (Math.hypot(alphaMinus.re, alphaMinus.im) <= 1e-12 * alpha) {
        throw new ModelError(
          'discretisation_singular',
          `The controller has a root at s = ${alpha} (= the bilinear scale α), which Tustin's rule sends to z = ∞; choose another sample period or method.`,
          ['controller', 'implementation', 'method'],
        );
      }
      return { offset: div({ re: 2 * r.re, im: 2 * r.im }, alphaMinus), scale: alphaMinus };
    }
  }
}

/** The root the method's common denominator puts once per excess pole (or zero): z = −1, z = 0, or none. */
function methodRoot(method: DiscretisationMethod): Complex | null {
  if (method === 'forward-euler') return null;
  return method === 'backward-euler' ? { re: -1, im: 0 } : { re: -2, im: 0 };
}

export function discretiseController(c: ContinuousFactors, s: DiscretisationSettings): DiscreteModel {
  const excess = c.poles.length - c.zeros.length; // poles − zeros: each factor's common denominator is left over this often
  let gain: Complex = { re: c.gain, im: 0 };
  const zeros: Complex[] = [];
  const poles: Complex[] = [];
  for (const z of c.zeros) {
    const m = mapRoot(z, s);
    gain = mul(gain, m.scale);
    zeros.push(m.offset);
  }
  for (const p of c.poles) {
    const m = mapRoot(p, s);
    gain = div(gain, m.scale);
    poles.push(m.offset);
  }
  const extra = methodRoot(s.method);
  if (extra === null) {
    if (excess < 0) {
      throw new ModelError(
        'discrete_controller_non_causal',
        'Forward Euler keeps an unfiltered derivative non-causal (its output would need the next sample). Filter the derivative or use backward-euler or tustin.',
        ['controller', 'implementation', 'method'],
      );
    }
  } else {
    // (z + 1)^excess or z^excess in the numerator (poles there when excess < 0).
    for (let k = 0; k < Math.abs(excess); k++) (excess > 0 ? zeros : poles).push({ ...extra });
  }
  return discreteRationalModel(
    {
      samplePeriod: s.samplePeriod,
      numerator: { leading: gain.re, rootsMinusOne: zeros },
      denominator: { leading: 1, rootsMinusOne: poles },
    },
    ['controller'],
  );
}

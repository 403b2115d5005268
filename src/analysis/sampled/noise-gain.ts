/**
 * How much white noise at the controller's input (A/D quantisation) reaches
 * the actuator: the RMS gain of the discrete transfer function C·S = C/(1 + L)
 * from measurement to control signal,
 *
 *   ‖C·S‖₂ = √( (1/π)·∫₀^π |C·S(e^{jθ})|² dθ )  (= √Σ h_k², Parseval),
 *
 * so white noise of standard deviation σ gives an actuator signal of
 * standard deviation σ·‖C·S‖₂. Only for a stable closed loop: for an
 * unstable one the integral is finite but describes no signal (callers check). A uniform quantiser with step q adds noise
 * of variance q²/12 (common practice), i.e. σ = q/√12.
 *
 * The integrand is a smooth periodic function of θ, for which the midpoint
 * rule converges geometrically (L. N. Trefethen, J. A. C. Weideman, "The
 * exponentially convergent trapezoidal rule", SIAM Review 56(3), 2014); the
 * number of points is tripled (which keeps every old midpoint) until two
 * estimates agree to 1e-10. Midpoints
 * never touch θ = 0 or π, where poles of C on the circle make C·S 0/0.
 */
import type { FrequencyModel } from '../../model/frequency-model.js';

export interface NoiseGain {
  /** ‖C·S‖₂ */
  gain: number;
  /** False when the point budget ran out before two estimates agreed (a loop close to instability). */
  converged: boolean;
}

const FIRST_POINTS = 256;
const MAX_POINTS = 1 << 20;
const TOLERANCE = 1e-10;

export function noiseGain(controller: FrequencyModel, loop: FrequencyModel, samplePeriod: number): NoiseGain {
  const c = { re: 0, im: 0 };
  const l = { re: 0, im: 0 };
  const squared = (theta: number) => {
    const w = theta / samplePeriod;
    controller.evaluate(w, c);
    loop.evaluate(w, l);
    const fr = 1 + l.re;
    return (c.re * c.re + c.im * c.im) / (fr * fr + l.im * l.im);
  };
  // Midpoint sums over N points.
  let n = FIRST_POINTS;
  let sum = 0;
  for (let k = 0; k < n; k++) sum += squared(((k + 0.5) * Math.PI) / n);
  let estimate = sum / n;
  while (n < MAX_POINTS) {
    // Points of the 3N-point rule that are not in the N-point rule: trisection keeps the old midpoints.
    const m = 3 * n;
    let extra = 0;
    for (let k = 0; k < m; k++) {
      if (k % 3 === 1) continue;
      extra += squared(((k + 0.5) * Math.PI) / m);
    }
    sum += extra;
    n = m;
    const next = sum / n;
    if (Math.abs(next - estimate) <= TOLERANCE * next) return { gain: Math.sqrt(next), converged: true };
    estimate = next;
  }
  return { gain: Math.sqrt(estimate), converged: false };
}

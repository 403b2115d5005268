/**
 * What the poles and zeros of a rational function say about the Nyquist
 * contour: net poles at the origin (integrators), net poles elsewhere on the
 * imaginary axis (each needs an indentation), and poles in the open right
 * half-plane (P in Z = N + P).
 */
import type { Complex } from '../numeric/complex.js';

export interface RootStructure {
  integrators: number;
  imaginaryAxisPoles: { frequency: number; order: number }[];
  unstablePoles: number;
}

/** A root counts as on the imaginary axis when its real part is below this fraction of its modulus. */
const AXIS_TOLERANCE = 1e-9;

export const isOnImaginaryAxis = (r: Complex): boolean =>
  Math.abs(r.re) <= AXIS_TOLERANCE * Math.max(Math.hypot(r.re, r.im), 1e-300) || (r.re === 0);

export function rootStructure(poles: readonly Complex[], zeros: readonly Complex[]): RootStructure {
  const atOrigin = (r: Complex) => r.re === 0 && r.im === 0 || Math.hypot(r.re, r.im) < 1e-300;
  const integrators = poles.filter(atOrigin).length - zeros.filter(atOrigin).length;
  // Net order at each positive imaginary-axis location (zeros there cancel poles).
  const places: { frequency: number; order: number }[] = [];
  const note = (r: Complex, delta: number) => {
    if (atOrigin(r) || !isOnImaginaryAxis(r) || r.im <= 0) return;
    const f = r.im;
    const hit = places.find((p) => Math.abs(p.frequency - f) <= 1e-8 * f);
    if (hit) hit.order += delta;
    else places.push({ frequency: f, order: delta });
  };
  poles.forEach((p) => note(p, 1));
  zeros.forEach((z) => note(z, -1));
  return {
    integrators,
    imaginaryAxisPoles: places.filter((p) => p.order > 0).sort((a, b) => a.frequency - b.frequency),
    unstablePoles: poles.filter((p) => p.re > 0 && !isOnImaginaryAxis(p)).length,
  };
}

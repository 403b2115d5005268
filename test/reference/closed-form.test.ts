/**
 * The core analysis against closed-form results, through `analyze` (the
 * contract), for several parameter values each. Tolerances are the
 * contract's: margins, crossovers, peak values and bandwidths relative 1e-8,
 * PM 1e-6 degrees; peak frequencies relative 1e-5 (a maximum is flat).
 */
import { describe, expect, it } from 'vitest';
import { analyze } from '../../src/index.js';

const REL = 1e-8;
const PM_DEG = 1e-6;
const PEAK_FREQ_REL = 1e-5;
const DEG = 180 / Math.PI;

function expectRelative(actual: number | null | undefined, expected: number, source: string, tol = REL): void {
  expect(actual, source).toBeTypeOf('number');
  const err = Math.abs((actual as number) - expected) / Math.abs(expected);
  expect(err, `${source}: got ${actual}, expected ${expected}`).toBeLessThanOrEqual(tol);
}

function expectAbsolute(actual: number | null | undefined, expected: number, tol: number, source: string): void {
  expect(actual, source).toBeTypeOf('number');
  expect(Math.abs((actual as number) - expected), `${source}: got ${actual}, expected ${expected}`).toBeLessThanOrEqual(tol);
}

const transferFunction = (numerator: number[], denominator: number[], delay = 0) => ({ kind: 'transfer-function', numerator, denominator, delay });
const proportional = (kp: number) => ({ kind: 'pid', form: 'parallel', kp, ki: 0, kd: 0 });

describe('K/(s(s+1)(s+2)) (Ogata, Modern Control Engineering, 5th ed.)', () => {
  const OGATA = 'Ogata, Modern Control Engineering: phase crossover sqrt(2), GM = 6/K';
  it.each([0.5, 1, 2, 4, 5.5, 8])('K = %s', async (K) => {
    const r = await analyze({ plant: transferFunction([K], [1, 3, 2, 0]) });
    const gm = r.margins.gain;
    expect(gm, OGATA).not.toBeNull();
    expectRelative(gm?.frequency, Math.SQRT2, OGATA);
    expectRelative(gm?.ratio, 6 / K, OGATA);
    expectAbsolute(gm?.db, 20 * Math.log10(6 / K), 1e-7, OGATA);
    expect(r.margins.phaseCrossovers.length, `${OGATA}: one phase crossover`).toBe(1);
    // Routh-Hurwitz on s^3 + 3 s^2 + 2 s + K: stable iff 0 < K < 6 (Ogata)
    expect(r.stability.closedLoopStable, 'Routh-Hurwitz (Ogata): stable iff K < 6').toBe(K < 6);
    expect(r.stability.nyquist.closedLoopUnstablePoles, 'Routh-Hurwitz (Ogata): two sign changes for K > 6').toBe(K < 6 ? 0 : 2);
    expect(r.stability.integrators, 'one pole at s = 0').toBe(1);
  });
});

describe('k e^{-sT}/s (derivation: |L| = k/w, angle L = -pi/2 - wT)', () => {
  const DERIVED = 'derivation for k e^{-sT}/s';
  it.each([
    [0.5, 1],
    [0.8, 1],
    [1, 0.3],
    [2, 0.5],
    [0.2, 2],
    [2, 1],
  ])('k = %s, T = %s', async (k, T) => {
    const r = await analyze({ plant: transferFunction([k], [1, 0], T) });
    const m = r.margins;
    // gain crossover at w = k; PM = pi/2 - kT
    expect(m.gainCrossovers.length, `${DERIVED}: single gain crossover`).toBe(1);
    expectRelative(m.phase?.frequency, k, `${DERIVED}: crossover at w = k`);
    const pm = (Math.PI / 2 - k * T) * DEG;
    expectAbsolute(m.phase?.degrees, pm, PM_DEG, `${DERIVED}: PM = pi/2 - kT`);
    if (pm > 0) expectRelative(m.delay?.seconds, Math.PI / (2 * k) - T, `${DERIVED}: delay margin pi/(2k) - T`);
    else expect(m.delay, `${DERIVED}: no delay margin when PM <= 0`).toBeNull();
    // phase crossovers at wT = pi/2 + 2 pi n with |L| = k/w; the first is nearest instability
    expectRelative(m.gain?.frequency, Math.PI / (2 * T), `${DERIVED}: phase crossover at pi/(2T)`);
    expectRelative(m.gain?.ratio, Math.PI / (2 * k * T), `${DERIVED}: GM = pi/(2kT)`);
    const listed = m.phaseCrossovers.filter((x) => x.ratio < 1e3).sort((a, b) => a.frequency - b.frequency);
    const expected: number[] = [];
    for (let n = 0; (Math.PI / 2 + 2 * Math.PI * n) / T / k < 1e3; n++) expected.push((Math.PI / 2 + 2 * Math.PI * n) / T);
    expect(listed.length, `${DERIVED}: phase crossovers with GM < 60 dB`).toBe(expected.length);
    listed.forEach((x, i) => {
      expectRelative(x.frequency, expected[i], `${DERIVED}: phase crossover ${i} at (pi/2 + 2 pi n)/T`);
      expectRelative(x.ratio, expected[i] / k, `${DERIVED}: phase crossover ${i} ratio w/k`);
    });
    // closed loop stable iff the delay margin is positive, i.e. kT < pi/2 (derivation)
    expect(r.stability.closedLoopStable, `${DERIVED}: stable iff kT < pi/2`).toBe(k * T < Math.PI / 2);
    expect(r.stability.integrators).toBe(1);
  });
});

describe('servo loop wn^2/(s(s + 2 zeta wn)) (Ogata; T is the standard second-order system)', () => {
  const cases: [number, number][] = [];
  for (const zeta of [0.2, 0.35, 0.5, 0.6]) for (const wn of [0.5, 3]) cases.push([zeta, wn]);
  it.each(cases)('zeta = %s, wn = %s', async (zeta, wn) => {
    const r = await analyze({ plant: transferFunction([wn * wn], [1, 2 * zeta * wn, 0]) });
    const root = Math.sqrt(Math.sqrt(1 + 4 * zeta ** 4) - 2 * zeta ** 2);
    // crossover wc = wn sqrt(sqrt(1+4 zeta^4) - 2 zeta^2), PM = atan(2 zeta / that root) (Ogata)
    expectRelative(r.margins.phase?.frequency, wn * root, 'Ogata: wc = wn sqrt(sqrt(1+4z^4) - 2z^2)');
    const pm = Math.atan(2 * zeta / root);
    expectAbsolute(r.margins.phase?.degrees, pm * DEG, PM_DEG, 'Ogata: PM = atan(2 zeta / sqrt(sqrt(1+4 zeta^4) - 2 zeta^2))');
    expectRelative(r.margins.delay?.seconds, pm / (wn * root), 'contract: delay margin PM(rad)/wc');
    expectRelative(r.bandwidth.crossover, wn * root, 'contract: crossover bandwidth = lowest gain crossover');
    // phase stays above -180 degrees: no phase crossover, no gain margin
    expect(r.margins.gain, 'angle L = -90 - atan(w/(2 zeta wn)) > -180: no phase crossover').toBeNull();
    // resonant peak 1/(2 zeta sqrt(1-zeta^2)) at wn sqrt(1 - 2 zeta^2), zeta < 1/sqrt(2) (Ogata)
    const mt = 1 / (2 * zeta * Math.sqrt(1 - zeta * zeta));
    expectRelative(r.peaks.complementarySensitivity.value, mt, 'Ogata: Mr = 1/(2 zeta sqrt(1 - zeta^2))');
    expectRelative(r.peaks.complementarySensitivity.frequency, wn * Math.sqrt(1 - 2 * zeta * zeta), 'Ogata: wr = wn sqrt(1 - 2 zeta^2)', PEAK_FREQ_REL);
    // closed-loop bandwidth (3 dB below T(0) = 1) (Ogata)
    const wbt = wn * Math.sqrt(1 - 2 * zeta ** 2 + Math.sqrt(4 * zeta ** 4 - 4 * zeta ** 2 + 2));
    expectRelative(r.bandwidth.closedLoop, wbt, 'Ogata: wb = wn sqrt(1 - 2z^2 + sqrt(4z^4 - 4z^2 + 2))');
    // |S|^2 = 1/2 gives w^4 + (4 zeta^2 + 2) wn^2 w^2 - wn^4 = 0 (derivation)
    const a = 1 + 2 * zeta * zeta;
    expectRelative(r.bandwidth.sensitivity, wn * Math.sqrt(Math.sqrt(a * a + 1) - a), 'derivation: wB = wn sqrt(sqrt((1+2z^2)^2+1) - (1+2z^2))');
    expect(r.stability.closedLoopStable, 's^2 + 2 zeta wn s + wn^2 with zeta > 0 is stable').toBe(true);
  });
});

describe('P control of a type-0 plant: offset 1/(1 + K P(0)) (common practice, final-value theorem)', () => {
  const LOW = 1e-7; // |S(jw)| = |S(0)| (1 + O(w^2)): at this frequency the offset to better than 1e-12
  const OFFSET = 'common practice: steady-state error 1/(1 + K P(0)) for a unit step';

  // first-order plant P0/(tau s + 1): T = K P0/(tau s + 1 + K P0), everything in closed form (derivation)
  const P0 = 2;
  const TAU = 4;
  it.each([0.25, 1.5, 4, 10])('first-order plant 2/(4s+1), K = %s', async (K) => {
    const r = await analyze({
      plant: transferFunction([P0], [TAU, 1]),
      controller: proportional(K),
      frequency: { min: LOW, max: 10, points: 20 },
    });
    const l0 = K * P0;
    const resp = r.response;
    expect(resp, 'response requested').toBeDefined();
    expectRelative(resp?.frequency[0], LOW, 'requested response grid starts at frequency.min', 1e-12);
    expectAbsolute(resp?.sensitivity.magnitudeDb[0], 20 * Math.log10(1 / (1 + l0)), 1e-8, OFFSET);
    expectAbsolute(resp?.complementarySensitivity.magnitudeDb[0], 20 * Math.log10(l0 / (1 + l0)), 1e-8, 'common practice: T(0) = K P(0)/(1 + K P(0))');
    // closed-loop pole at -(1 + K P0)/tau: |T| falls to T(0)/sqrt(2) there (derivation)
    expectRelative(r.bandwidth.closedLoop, (1 + l0) / TAU, 'derivation: first-order closed loop, wBT = (1 + K P0)/tau');
    // |S|^2 = (1 + tau^2 w^2)/((1 + K P0)^2 + tau^2 w^2) = 1/2 (derivation)
    expectRelative(r.bandwidth.sensitivity, Math.sqrt((1 + l0) ** 2 - 2) / TAU, 'derivation: wB = sqrt((1 + K P0)^2 - 2)/tau');
    if (l0 > 1) {
      const wc = Math.sqrt(l0 * l0 - 1) / TAU;
      expectRelative(r.margins.phase?.frequency, wc, 'derivation: |L| = 1 at sqrt((K P0)^2 - 1)/tau');
      expectAbsolute(r.margins.phase?.degrees, 180 - Math.atan(TAU * wc) * DEG, PM_DEG, 'derivation: PM = 180 - atan(tau wc)');
    } else {
      expect(r.margins.phase, 'K P0 < 1: |L| < 1 everywhere, no gain crossover').toBeNull();
      expect(r.bandwidth.crossover).toBeNull();
    }
    expect(r.margins.gain, 'phase above -90 degrees: no phase crossover').toBeNull();
    expect(r.stability.closedLoopStable).toBe(true);
  });

  it.each([1, 5, 20])('second-order plant 1/((s+1)(0.2s+1)), K = %s', async (K) => {
    const r = await analyze({
      plant: transferFunction([1], [0.2, 1.2, 1]),
      controller: proportional(K),
      frequency: { min: LOW, max: 100, points: 30 },
    });
    const resp = r.response;
    expect(resp, 'response requested').toBeDefined();
    expectRelative(resp?.frequency[0], LOW, 'requested response grid starts at frequency.min', 1e-12);
    expectAbsolute(resp?.sensitivity.magnitudeDb[0], 20 * Math.log10(1 / (1 + K)), 1e-8, OFFSET);
    expectAbsolute(resp?.complementarySensitivity.magnitudeDb[0], 20 * Math.log10(K / (1 + K)), 1e-8, 'common practice: T(0) = K P(0)/(1 + K P(0))');
    // 0.2 s^2 + 1.2 s + 1 + K: stable for every K > -1 (second order, positive coefficients)
    expect(r.stability.closedLoopStable, 'second-order characteristic polynomial with positive coefficients').toBe(true);
    expect(r.margins.gain, 'phase above -180 degrees: no phase crossover').toBeNull();
  });
});

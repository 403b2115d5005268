/**
 * The benchmark's loops, all from the bottling plant (invented but plausible
 * demo data, as in src/demo/bottling-plant.ts). Each case is a request body
 * exactly as a caller would post it; the numpy peer (numpy_peer.py) reads the
 * same bodies, so both sides analyse the same loop on the same grid.
 */

/** Product of polynomials in descending powers. */
function multiplyAll(...factors) {
  return factors.reduce((a, b) => {
    const out = new Array(a.length + b.length - 1).fill(0);
    for (let i = 0; i < a.length; i++) for (let j = 0; j < b.length; j++) out[i + j] += a[i] * b[j];
    return out;
  }, [1]);
}

/** s²/ωn² + 2ζ·s/ωn + 1 */
const resonance = (wn, zeta) => [1 / (wn * wn), (2 * zeta) / wn, 1];

/**
 * Pasteuriser temperature loop: 1.8·e^{−14 s}/((95 s + 1)(22 s + 1)) under a
 * series PID K = 1.9, Ti = 95 s, Td = 22 s, N = 10; 400 response points.
 */
export const PASTEURISER = {
  plant: { kind: 'transfer-function', numerator: [1.8], denominator: multiplyAll([95, 1], [22, 1]), delay: 14 },
  controller: { kind: 'pid', form: 'series', gain: 1.9, integralTime: 95, derivativeTime: 22, derivativeFilter: { n: 10 } },
  frequency: { min: 1e-4, max: 1, points: 400 },
};

/**
 * Filler-pump speed loop with the drive in detail, a 10th-order rational
 * loop: motor/pump lag 0.35 s, hydraulic lag 0.08 s, current loop 5 ms,
 * speed filter 2 ms, the coupling's torsional mode (60 rad/s, ζ = 0.3) and
 * the pipe's pressure mode (150 rad/s, ζ = 0.1): eighth order, times a
 * parallel PID with its own derivative filter (two more poles).
 */
export const FILLER_PUMP_DRIVE = {
  plant: {
    kind: 'transfer-function',
    numerator: [0.92],
    denominator: multiplyAll([0.35, 1], [0.08, 1], [0.005, 1], [0.002, 1], resonance(60, 0.3), resonance(150, 0.1)),
  },
  controller: { kind: 'pid', form: 'parallel', kp: 2.2, ki: 6, kd: 0.02, derivativeFilter: { timeConstant: 0.01 } },
  frequency: { min: 0.01, max: 1000, points: 400 },
};

/**
 * A rig measurement of the filler pump: the frequency response of
 * 0.92·e^{−0.02 s}/((0.35 s + 1)(0.08 s + 1)(s²/60² + 2·0.3·s/60 + 1)) at
 * 2,000 log-spaced frequencies from 0.05 to 500 rad/s (magnitude absolute,
 * phase in degrees, unwrapped), under the demo's PI controller.
 */
export function measuredPumpPlant(points = 2000) {
  const frequency = [];
  const magnitude = [];
  const phase = [];
  const [a2, a1] = resonance(60, 0.3);
  for (let i = 0; i < points; i++) {
    const w = 0.05 * Math.pow(1e4, i / (points - 1));
    // 1/((j0.35w + 1)(j0.08w + 1)(1 − a2 w² + j a1 w)), by magnitudes and angles.
    const m = 0.92 / (Math.hypot(1, 0.35 * w) * Math.hypot(1, 0.08 * w) * Math.hypot(1 - a2 * w * w, a1 * w));
    const p = -(Math.atan(0.35 * w) + Math.atan(0.08 * w) + Math.atan2(a1 * w, 1 - a2 * w * w) + 0.02 * w);
    frequency.push(w);
    magnitude.push(m);
    phase.push((p * 180) / Math.PI);
  }
  return { kind: 'frequency-response', frequency, magnitude, phase };
}

export const MEASURED_PUMP = {
  plant: measuredPumpPlant(),
  controller: { kind: 'pid', form: 'standard', gain: 3.5, integralTime: 0.39 },
};

/** A small deterministic generator (32-bit LCG, Numerical Recipes constants), so every run posts the same records. */
function lcg(seed) {
  let state = seed >>> 0;
  return () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    return state / 4294967296;
  };
}

/**
 * Rig test of the filler pump at 1 kHz: a random ±1 % drive command held
 * for 5 ms at a time, and the speed through the discretised lags
 * (τ = 0.35 s and 0.08 s, gain 0.92) plus a little measurement noise.
 */
export function pumpRigRecords(samples = 1_000_000, sampleRate = 1000) {
  const input = new Float64Array(samples);
  const output = new Float64Array(samples);
  const random = lcg(20240601);
  const a1 = Math.exp(-1 / (0.35 * sampleRate));
  const a2 = Math.exp(-1 / (0.08 * sampleRate));
  let x1 = 0;
  let x2 = 0;
  let u = 0;
  for (let i = 0; i < samples; i++) {
    if (i % 5 === 0) u = random() < 0.5 ? -1 : 1;
    x1 = a1 * x1 + (1 - a1) * u;
    x2 = a2 * x2 + (1 - a2) * x1;
    input[i] = u;
    output[i] = 0.92 * x2 + 0.01 * (random() - 0.5);
  }
  return { input, output, sampleRate };
}

export function pumpRigEstimateBody(samples = 1_000_000) {
  const { input, output, sampleRate } = pumpRigRecords(samples);
  return { sampleRate, input: Array.from(input), output: Array.from(output) };
}

/** The analysis cases timed through analyze(body), each in both details. */
export const ANALYSIS_CASES = [
  { id: 'pasteuriser-400', title: '2nd order + delay, filtered PID, 400 points', body: PASTEURISER, ratioTarget: 0.5 },
  { id: 'pump-drive-10th-400', title: '10th-order rational loop, 400 points', body: FILLER_PUMP_DRIVE, ratioTarget: 0.5 },
  { id: 'measured-pump-2000', title: 'measured plant, 2,000 points, PI', body: MEASURED_PUMP, ratioTarget: null },
];

/**
 * A batch of loops for POST /v1/checks: the two demo loops with their plant
 * gains, lags and controller gains varied from loop to loop, so no two
 * requests are alike.
 */
export function checkBatch(count = 1000) {
  const loops = [];
  for (let i = 0; i < count; i++) {
    const f = 0.8 + 0.4 * ((i * 37) % 101) / 100;
    if (i % 2 === 0) {
      loops.push({
        name: `filler-pump-speed-${i}`,
        plant: { kind: 'transfer-function', numerator: [0.92 * f], denominator: multiplyAll([0.35 * f, 1], [0.08, 1]), delay: 0.02 },
        controller: { kind: 'pid', form: 'standard', gain: 3.5 / f, integralTime: 0.39 },
      });
    } else {
      loops.push({
        name: `pasteuriser-temperature-${i}`,
        plant: { kind: 'transfer-function', numerator: [1.8], denominator: multiplyAll([95 * f, 1], [22, 1]), delay: 14 },
        controller: { kind: 'pid', form: 'series', gain: 1.9 / f, integralTime: 95, derivativeTime: 22, derivativeFilter: { n: 10 } },
      });
    }
  }
  return { loops };
}

/** The case posted to POST /v1/analyses in the HTTP benchmark (400 response points). */
export const FULL_RESPONSE_CASE = PASTEURISER;

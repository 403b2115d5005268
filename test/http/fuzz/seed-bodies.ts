/**
 * Valid request bodies per route, the starting points of the fuzz run. A
 * route the table lists but this file does not know is fuzzed from every
 * seed (so a new route is never left out; add its own seeds here).
 */
import { FILLER_PUMP_SPEED_LOOP, PASTEURISER_TEMPERATURE_LOOP } from '../../../src/demo/bottling-plant.js';

const summary = <T extends object>(r: T) => ({ ...r, detail: 'summary' });
const filler = FILLER_PUMP_SPEED_LOOP.request;
const pasteuriser = PASTEURISER_TEMPERATURE_LOOP.request;

function record(n: number): { input: number[]; output: number[] } {
  const input: number[] = [];
  const output: number[] = [];
  let y = 0;
  for (let k = 0; k < n; k++) {
    const u = Math.sin(0.37 * k) + 0.5 * Math.sin(1.91 * k + 1);
    y = 0.9 * y + 0.1 * u; // a first-order lag sampled at 1 Hz
    input.push(Number(u.toFixed(4)));
    output.push(Number(y.toFixed(4)));
  }
  return { input, output };
}

const analyses = [
  summary(filler),
  summary(pasteuriser),
  summary({ plant: { kind: 'zeros-poles', zeros: [-2], poles: [-1, { re: -0.5, im: 1.2 }, { re: -0.5, im: -1.2 }], gain: 1.5, delay: 0.1 }, controller: filler.controller }),
  summary({ plant: { kind: 'state-space', a: [[0, 1], [-2, -3]], b: [[0], [1]], c: [[1, 0]] }, controller: { kind: 'pid', form: 'parallel', kp: 1, ki: 0.5 } }),
  summary({ plant: { kind: 'expression', expression: '0.92*exp(-0.02*s)/((0.35*s+1)*(0.08*s+1))' }, controller: filler.controller }),
  summary({ ...filler, frequency: { min: 0.01, max: 100, points: 50 }, criteria: {} }),
];

export const SEEDS: Record<string, unknown[]> = {
  '/v1/analyses': analyses,
  '/v1/checks': [{ loops: [{ name: 'filler pump', ...filler }, { name: 'pasteuriser', ...pasteuriser }] }],
  '/v1/comparisons': [{ plant: filler.plant, baseline: filler.controller, candidate: { ...filler.controller, gain: 2.8 } }],
  '/v1/estimates': [{ sampleRate: 1, ...record(256) }, { sampleRate: 10, ...record(512), segmentLength: 128, overlap: 0.5, detrend: 'linear' }],
  '/v1/plots/bode': [filler, pasteuriser],
  '/v1/plots/nyquist': [filler],
  '/v1/plots/step': [filler],
  '/v1/reports': [{ ...filler, report: { title: 'Filler pump review' } }],
};

export const ALL_SEEDS: unknown[] = Object.values(SEEDS).flat();

/** Configurations and bodies shared by the service-guard tests. */
import { execFileSync } from 'node:child_process';
import { defaultConfig, type Config } from '../../../src/config/load-config.js';

/** Every default, analyses inline, shedding off, with the given overrides. */
export function testConfig(overrides: Partial<Config> = {}): Config {
  return { ...defaultConfig(), LOOPGATE_ANALYSIS_WORKERS: 0, LOOPGATE_MAX_EVENT_LOOP_DELAY_MS: 0, LOOPGATE_MAX_EVENT_LOOP_UTILIZATION: 0, ...overrides };
}

/** Worker threads and child processes run the built files: build dist/ when src/ is newer. */
export function ensureBuilt(): void {
  execFileSync(process.execPath, ['scripts/build-if-needed.mjs'], { stdio: 'inherit' });
}

export const fillerPumpLoop = {
  plant: { kind: 'transfer-function', numerator: [2], denominator: [0.5, 1.5, 1] },
  controller: { kind: 'pid', form: 'standard', gain: 0.8, integralTime: 1.2 },
  detail: 'summary',
};

/**
 * A valid but slow analysis (1–2 s on one core of the 2-core CI machine):
 * a pasteuriser model written as a long product of √cosh factors over a 20,000-point
 * grid. Within the default compute budget, so only the time limit can stop it.
 */
export function slowPasteuriserAnalysis(): Record<string, unknown> {
  const factors = Array.from({ length: 150 }, (_, i) => `sqrt(cosh(0.00${(i % 9) + 1}*s))`);
  const tree = (parts: string[]): string => (parts.length === 1 ? parts[0] : `(${tree(parts.slice(0, parts.length >> 1))}*${tree(parts.slice(parts.length >> 1))})`);
  return {
    plant: { kind: 'expression', expression: `1/((s+1)^2)*${tree(factors)}` },
    controller: { kind: 'pid', form: 'standard', gain: 1, integralTime: 2 },
    detail: 'summary',
    frequency: { min: 1e-4, max: 1e4, points: 20_000 },
  };
}

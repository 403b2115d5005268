/**
 * Demo loops from loopgate's own scenario, a bottling plant. The numbers are
 * invented but plausible demo data, not measurements of any real plant; the
 * page at GET /, the README and the examples all take them from here.
 *
 * Filler-pump speed loop: the filler's feed pump is driven by an inverter
 * and motor. Speed (in % of rated) responds to the drive command (%) through
 * the mechanical lag of motor and pump (τm = 0.35 s) and the slower build-up
 * of hydraulic load torque (τh = 0.08 s), plus 20 ms of fieldbus and scan
 * delay: P(s) = 0.92·e^{−0.02 s}/((0.35 s + 1)(0.08 s + 1)). A PI controller
 * K = 3.5, Ti = 0.39 s holds the speed.
 *
 * Pasteuriser temperature loop: product outlet temperature (°C) responds to
 * the hot-water valve (%) through the heat exchanger's main lag (95 s), the
 * holding tube's secondary lag (22 s) and 14 s of transport dead time:
 * P(s) = 1.8·e^{−14 s}/((95 s + 1)(22 s + 1)). A series PID K = 1.9,
 * Ti = 95 s, Td = 22 s with a derivative filter N = 10 controls it.
 */
import type { AnalysisRequest } from '../contract/schemas/analysis-request.js';

export interface DemoLoop {
  id: string;
  title: string;
  description: string;
  /** Units of the plant's input and output, for the report's text. */
  units: { input: string; output: string };
  request: AnalysisRequest;
}

/** τm·τh and τm + τh of the pump: (0.35 s + 1)(0.08 s + 1) = 0.028 s² + 0.43 s + 1. */
const PUMP_DENOMINATOR = [0.028, 0.43, 1];
/** (95 s + 1)(22 s + 1) = 2090 s² + 117 s + 1. */
const PASTEURISER_DENOMINATOR = [2090, 117, 1];

export const FILLER_PUMP_SPEED_LOOP: DemoLoop = {
  id: 'filler-pump-speed',
  title: 'Filler-pump speed loop (PI)',
  description: 'Pump and motor speed, 0.92 %/% with lags of 0.35 s and 0.08 s and a 20 ms delay, under PI control (K = 3.5, Ti = 0.39 s).',
  units: { input: 'drive command, %', output: 'pump speed, % of rated' },
  request: {
    plant: { kind: 'transfer-function', numerator: [0.92], denominator: PUMP_DENOMINATOR, delay: 0.02 },
    controller: { kind: 'pid', form: 'standard', gain: 3.5, integralTime: 0.39 },
  },
};

export const PASTEURISER_TEMPERATURE_LOOP: DemoLoop = {
  id: 'pasteuriser-temperature',
  title: 'Pasteuriser temperature loop (PID with filter)',
  description: 'Outlet temperature, 1.8 °C/% with lags of 95 s and 22 s and 14 s of dead time, under series PID control (K = 1.9, Ti = 95 s, Td = 22 s, N = 10).',
  units: { input: 'hot-water valve, %', output: 'outlet temperature, °C' },
  request: {
    plant: { kind: 'transfer-function', numerator: [1.8], denominator: PASTEURISER_DENOMINATOR, delay: 14 },
    controller: { kind: 'pid', form: 'series', gain: 1.9, integralTime: 95, derivativeTime: 22, derivativeFilter: { n: 10 } },
  },
};

export const BOTTLING_PLANT_LOOPS: readonly DemoLoop[] = [FILLER_PUMP_SPEED_LOOP, PASTEURISER_TEMPERATURE_LOOP];

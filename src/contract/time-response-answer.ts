/**
 * The `timeResponse` part of an analysis: closed-loop step responses from
 * simulateClosedLoop for plants with a rational model (transfer function,
 * zeros and poles, state space), or a warning saying why there are none
 * (an expression in s has no realisation; measured frequency-response data
 * would need an inverse FFT of the closed-loop response, not built yet).
 */
import { NonFiniteMatrixError } from '../analysis/time-response/non-finite-matrix-error.js';
import { simulateClosedLoop, TimeResponseInputError } from '../analysis/time-response/index.js';
import type { Warning } from '../analysis/warnings.js';
import type { BuiltLoop } from './build-loop.js';
import { LoopgateError } from './errors.js';
import type { AnalysisRequest } from './schemas/analysis-request.js';
import type { TimeResponse } from './schemas/time-response.js';

export const TIME_RESPONSE_UNAVAILABLE = 'time_response_unavailable';

export type TimeResponsePart = { timeResponse?: TimeResponse; warnings?: Warning[] };

/** Why this plant kind has no simulation, or null when it has one. */
export function timeResponseUnavailableReason(request: Pick<AnalysisRequest, 'plant'>, built: BuiltLoop): string | null {
  if (request.plant.kind === 'frequency-response') {
    return 'Time responses of measured frequency-response data (by inverse FFT of the closed-loop response) are not available yet; the analysis above is frequency-domain only.';
  }
  if (!built.plant.rational) {
    return `A ${request.plant.kind} plant has no rational model to simulate; give it as a transfer function, zeros and poles, or a state-space model for time responses.`;
  }
  return null;
}

/** Simulates the loop; TimeResponseInputError becomes a 422 answer pointing at the field. */
export function simulateBuiltLoop(built: BuiltLoop, options: NonNullable<AnalysisRequest['timeResponse']>): TimeResponse {
  const rational = built.plant.rational!;
  const controller = built.controller?.rational ?? { numerator: [1], denominator: [1] };
  try {
    const r = simulateClosedLoop({
      plant: { numerator: rational.numerator, denominator: rational.denominator, delay: built.plant.delay },
      controller: { numerator: controller.numerator, denominator: controller.denominator },
      duration: options.duration,
      points: options.points,
    });
    const s = r.setpointStep;
    const d = r.loadDisturbance;
    return {
      stable: r.stable,
      duration: r.duration,
      method: r.method,
      notes: r.notes,
      setpoint: {
        time: r.time,
        output: s.output,
        control: s.control,
        finalValue: s.finalValue,
        overshootPercent: s.overshootPercent,
        peakTime: s.peakTime,
        riseTime: s.riseTime,
        settlingTime: s.settlingTime,
        steadyStateError: s.steadyStateError,
      },
      loadDisturbance: {
        time: r.time,
        output: d.output,
        control: d.control,
        finalValue: d.finalValue,
        peakDeviation: d.peakDeviation,
        peakDeviationTime: d.peakDeviationTime,
        iae: d.iae,
      },
    };
  } catch (err) {
    if (err instanceof TimeResponseInputError) {
      const field = err.path === 'duration' || err.path === 'points' ? ['timeResponse', err.path] : err.path.split('.');
      throw new LoopgateError('time_response_not_simulable', `The time response cannot be simulated: ${err.message}`, [{ path: field, message: err.message }]);
    }
    // Coefficients near the double range overflow the realisation (found by the fuzz suite): the caller's input, not our fault.
    if (err instanceof NonFiniteMatrixError) {
      throw new LoopgateError('time_response_not_simulable', 'The time response cannot be simulated: the loop\'s state-space realisation overflows (coefficients too large or too far apart).', [{ path: ['plant'], message: err.message }]);
    }
    throw err;
  }
}

/** What analyzeRequest adds when the request asks for time responses. */
export function timeResponsePart(request: AnalysisRequest, built: BuiltLoop, warnings: readonly Warning[]): TimeResponsePart {
  if (!request.timeResponse) return {};
  const reason = timeResponseUnavailableReason(request, built);
  if (reason) {
    return { warnings: [...warnings, { code: TIME_RESPONSE_UNAVAILABLE, message: reason, value: null, limit: null, source: 'common practice' }] };
  }
  return { timeResponse: simulateBuiltLoop(built, request.timeResponse) };
}

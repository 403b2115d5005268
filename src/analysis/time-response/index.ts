export { simulateClosedLoop } from './simulate-closed-loop.js';
export { TimeResponseInputError, type TimeResponseErrorCode } from './time-response-input-error.js';
export type {
  ClosedLoopSimulationInput,
  ClosedLoopTimeResponses,
  LoadDisturbanceResponse,
  RationalTransferFunction,
  SetpointStepResponse,
} from './types.js';

/** What the pool and its workers say to each other. */
import type { LoopTask } from './check-loop.js';
import type { LoopOutcome } from './loop-outcome.js';

export interface ChunkRequest {
  id: number;
  tasks: LoopTask[];
}

export interface ChunkReply {
  id: number;
  outcomes: LoopOutcome[];
}

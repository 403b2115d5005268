/**
 * Worker-thread entry: checks the loops it is sent and posts the outcomes
 * back. Loaded from dist/ by worker-pool.ts.
 */
import { parentPort } from 'node:worker_threads';
import { runLoopTask } from './loop-outcome.js';
import type { ChunkReply, ChunkRequest } from './worker-messages.js';

if (!parentPort) throw new Error('check-worker.js must run as a worker thread');
const port = parentPort;

port.on('message', (request: ChunkRequest) => {
  const reply: ChunkReply = { id: request.id, outcomes: request.tasks.map(runLoopTask) };
  port.postMessage(reply);
});

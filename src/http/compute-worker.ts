/**
 * Worker-thread entry for compute-pool.ts: runs one named task at a time and
 * posts its result, its LoopgateError (code, message, issues) or, for
 * anything else, the fault text (which becomes a 500). Loaded from dist/.
 */
import { parentPort } from 'node:worker_threads';
import { LoopgateError } from '../contract/errors.js';
import { COMPUTE_TASKS, type ComputeReply, type ComputeRequest } from './compute-tasks.js';

if (!parentPort) throw new Error('compute-worker.js must run as a worker thread');
const port = parentPort;

port.on('message', (request: ComputeRequest) => {
  let reply: ComputeReply;
  try {
    reply = { id: request.id, ok: true, result: COMPUTE_TASKS[request.task](request.body, request.options) };
  } catch (err) {
    reply =
      err instanceof LoopgateError
        ? { id: request.id, ok: false, error: err.toJSON() }
        : { id: request.id, ok: false, fault: err instanceof Error ? (err.stack ?? err.message) : String(err) };
  }
  port.postMessage(reply);
});

// Modules are loaded: from now on a task's deadline measures its computation only.
port.postMessage({ ready: true });

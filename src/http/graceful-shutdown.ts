/**
 * Graceful shutdown on SIGTERM and SIGINT: stop taking work (readiness turns
 * 503, new /v1 requests on open connections get 503 shutting_down), stop
 * accepting connections, let the requests already accepted finish, close
 * the worker pools, exit 0. If that takes longer than the grace period the
 * process exits with 1 anyway, so a stuck request cannot keep it alive.
 */
import type { FastifyInstance } from 'fastify';

export function installGracefulShutdown(app: FastifyInstance, graceMs: number, exit: (code: number) => void = (c) => process.exit(c)): void {
  let stopping = false;
  const stop = (signal: NodeJS.Signals) => {
    if (stopping) {
      app.log.warn({ signal }, 'already shutting down');
      return;
    }
    stopping = true;
    app.log.info({ signal, graceMs }, 'shutting down: finishing accepted requests');
    app.beginDrain();
    const deadline = setTimeout(() => {
      app.log.error({ graceMs }, 'requests still running after the grace period; exiting anyway');
      exit(1);
    }, graceMs);
    deadline.unref();
    app.close().then(
      () => {
        clearTimeout(deadline);
        app.log.info('shut down cleanly');
        exit(0);
      },
      (err: unknown) => {
        app.log.error({ err }, 'error while shutting down');
        exit(1);
      },
    );
  };
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
}

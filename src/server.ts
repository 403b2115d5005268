/** Entry point: serve on HOST (default 127.0.0.1) and PORT (default 8080). */
import { buildApp } from './http/app.js';

const host = process.env.HOST ?? '127.0.0.1';
const port = Number(process.env.PORT ?? 8080);

const app = await buildApp({ logger: { level: process.env.LOG_LEVEL ?? 'info' } });
await app.listen({ host, port });

for (const signal of ['SIGTERM', 'SIGINT'] as const) {
  process.once(signal, () => {
    app.log.info({ signal }, 'shutting down');
    app.close().then(
      () => process.exit(0),
      () => process.exit(1),
    );
  });
}

/**
 * Entry point: read and check the configuration (src/config; a bad value
 * stops the start with exit code 2 and the variable named), build the app,
 * start the analysis workers, listen on HOST:PORT, shut down gracefully on
 * SIGTERM/SIGINT (src/http/graceful-shutdown.ts).
 */
import { ConfigError, loadConfig, type Config } from './config/load-config.js';
import { buildApp } from './http/app.js';
import { installGracefulShutdown } from './http/graceful-shutdown.js';

let config: Config;
try {
  config = loadConfig(process.env);
} catch (err) {
  if (!(err instanceof ConfigError)) throw err;
  process.stderr.write(`${err.message}\n`);
  process.exit(2);
}

const app = await buildApp({ config, logger: { level: config.LOG_LEVEL } });
installGracefulShutdown(app, config.LOOPGATE_SHUTDOWN_GRACE_MS);
try {
  await app.computePool.warm();
  await app.listen({ host: config.HOST, port: config.PORT });
} catch (err) {
  app.log.fatal({ err }, 'could not start');
  process.exit(1);
}

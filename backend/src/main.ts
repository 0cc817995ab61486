import { loadConfig } from './config';
import { logger, setLogLevel } from './platform/logger';
import { ConfigurationProblem, EXIT, installProcessGuards } from './platform/process-guards';
import { startServer } from './server';

/**
 * Entry point: `npm run serve:api` in development, `node dist/server/main.js` in production, always under a
 * supervisor (`npm start` runs ops/supervise; production uses the systemd unit in ops/systemd). The exit code
 * tells the supervisor whether a restart can help (see EXIT).
 */
installProcessGuards();
let config;
try {
  config = loadConfig();
} catch (err) {
  logger.error((err as Error).message);
  process.exit(EXIT.config);
}
setLogLevel(config.logLevel);

try {
  const server = await startServer(config);
  logger.info(`Rillmark API listening on ${server.url} (${config.env})`);
  const shutdown = (signal: string) => {
    logger.info(`${signal}: shutting down`);
    server.stop().then(
      () => process.exit(0),
      () => process.exit(1),
    );
  };
  process.on('SIGINT', () => shutdown('SIGINT'));
  process.on('SIGTERM', () => shutdown('SIGTERM'));
} catch (err) {
  logger.error((err as Error).message);
  process.exit(err instanceof ConfigurationProblem ? EXIT.config : EXIT.databaseUnreachable);
}

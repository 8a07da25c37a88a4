import type { AddressInfo } from 'node:net';
import { loadConfig } from './config';
import { logger, logLevelFrom } from './logger';
import { startServer } from './start-server';

logger.level = logLevelFrom(process.env, false);
const config = loadConfig();
const graceMs = Number(process.env.SHUTDOWN_GRACE_MS ?? 20_000);
if (!Number.isFinite(graceMs) || graceMs < 0) throw new Error(`SHUTDOWN_GRACE_MS must be a number of milliseconds, got "${process.env.SHUTDOWN_GRACE_MS}"`);
const { close, server } = await startServer(config);
const { port } = server.address() as AddressInfo;
// host and database name only: the address may carry a password
const pgAddress = config.databaseUrl ? new URL(config.databaseUrl) : undefined;
const database = pgAddress ? `, PostgreSQL at ${pgAddress.host}${pgAddress.pathname}` : '';
logger.info({ port }, `listening on http://localhost:${port} (data in ${config.dataDir}${database}${config.smtpUrl ? '' : ', mail to the local fake'})`);

let closing = false;
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.on(signal, () => {
    if (closing) return;
    closing = true;
    logger.info(`${signal}: finishing requests in flight (up to ${graceMs} ms), then stopping`);
    // the drain has its own deadline; this one only catches a close that hangs after it
    const force = setTimeout(() => {
      logger.fatal('shutdown hung; exiting');
      process.exit(1);
    }, graceMs + 10_000);
    force.unref();
    close(graceMs).then(
      () => {
        logger.info('stopped');
        process.exit(0);
      },
      (err) => {
        logger.fatal({ err }, 'shutdown failed');
        process.exit(1);
      },
    );
  });
}

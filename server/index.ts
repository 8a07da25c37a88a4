import { loadConfig } from './config';
import { startServer } from './start-server';

const config = loadConfig();
const { close } = await startServer(config);
console.log(`[falsetrace] listening on http://localhost:${config.port} (data in ${config.dataDir}${config.smtpUrl ? '' : ', mail to the local fake'})`);

let closing = false;
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.on(signal, () => {
    if (closing) return;
    closing = true;
    const force = setTimeout(() => process.exit(1), 5000);
    force.unref();
    close().then(
      () => process.exit(0),
      (err) => {
        console.error(err);
        process.exit(1);
      },
    );
  });
}

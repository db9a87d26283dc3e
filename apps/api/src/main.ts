import { createApp } from './app';
import { createDepsFromEnv } from './create-deps';

const deps = createDepsFromEnv();
const port = Number(process.env['API_PORT'] ?? 3333);
const server = createApp(deps).listen(port, '127.0.0.1', () => {
  deps.logger.info(`api listening on http://127.0.0.1:${port}`);
});

async function shutdown(signal: string) {
  deps.logger.info({ signal }, 'api stopping');
  server.close();
  await deps.close();
  process.exit(0);
}
process.once('SIGTERM', () => void shutdown('SIGTERM'));
process.once('SIGINT', () => void shutdown('SIGINT'));

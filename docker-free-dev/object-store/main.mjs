// @ts-check
// Runs the object-store fake from environment variables:
//   S3_PORT (3410), S3_BUCKETS (comma list, latchwork), S3_LOG (1 = log every request),
//   LW_DATA_DIR (<repo>/.local/data; objects go to its object-store/ subfolder).
import { fileURLToPath } from 'node:url';
import { start } from './server.mjs';

const env = process.env;

try {
  const store = await start({
    port: Number(env['S3_PORT'] || 3410),
    buckets: (env['S3_BUCKETS'] || 'latchwork')
      .split(',')
      .map((s) => s.trim())
      .filter(Boolean),
    log: env['S3_LOG'] === '1',
    dataDir: env['LW_DATA_DIR'] || fileURLToPath(new URL('../../.local/data', import.meta.url)),
  });
  console.log(`object-store listening on ${store.url}`);
  let closing = false;
  const stop = async () => {
    if (closing) return;
    closing = true;
    try {
      await store.close();
      process.exit(0);
    } catch (error) {
      console.error('object-store: error while closing', error);
      process.exit(1);
    }
  };
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
} catch (error) {
  console.error('object-store: could not start:', error);
  process.exit(1);
}

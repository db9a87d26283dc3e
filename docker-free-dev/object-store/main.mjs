// @ts-check
// Runs the object-store fake from environment variables:
//   S3_PORT (3410), S3_BUCKETS (comma list, latchwork), S3_LOG (1 = log every request),
//   LW_DATA_DIR (<repo>/.local/data; objects go to its object-store/ subfolder).
import { defaultDataDir, runFake } from '../lib/run-fake.mjs';
import { start } from './server.mjs';

const env = process.env;

await runFake('object-store', () =>
  start({
    port: Number(env['S3_PORT'] || 3410),
    buckets: (env['S3_BUCKETS'] || 'latchwork')
      .split(',')
      .map((s) => s.trim())
      .filter(Boolean),
    log: env['S3_LOG'] === '1',
    dataDir: defaultDataDir(),
  }),
);

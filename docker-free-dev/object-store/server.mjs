// @ts-check
// The object-store fake: s3rver (the S3 REST API on the file system) behind a tiny front that
// also answers GET /health. Objects live in <dataDir>/object-store, so they survive restarts.
//
// NOTE: s3rver does NOT check request signatures (any access key and secret are accepted, and
// presigned URLs never expire here). Never test signature or expiry logic against this fake.
import { mkdir } from 'node:fs/promises';
import http from 'node:http';
import { join } from 'node:path';
import S3rver from 's3rver';

/** Credentials the API and tests use by convention; s3rver ignores them. */
export const ACCESS_KEY = 'S3RVER';
export const SECRET_KEY = 'S3RVER';

/**
 * @typedef {object} ObjectStoreOptions
 * @property {number} [port] 0 picks a free port (tests); default 3410
 * @property {string} [host] default 127.0.0.1
 * @property {string[]} [buckets] created at start if missing; default ['latchwork']
 * @property {string} dataDir root data folder (LW_DATA_DIR)
 * @property {boolean} [log] log every request (s3rver's logger); default false
 */

/**
 * @param {ObjectStoreOptions} options
 * @returns {Promise<{ url: string, port: number, buckets: string[], close(): Promise<void> }>}
 */
export async function start(options) {
  const {
    port = 3410,
    host = '127.0.0.1',
    buckets = ['latchwork'],
    dataDir,
    log = false,
  } = options;
  if (!dataDir) throw new Error('object-store: dataDir is required');
  const directory = join(dataDir, 'object-store');
  await mkdir(directory, { recursive: true });

  const s3 = new S3rver({
    directory,
    silent: !log,
    configureBuckets: buckets.map((name) => ({ name, configs: [] })),
  });
  // s3rver.run() would create its own server; we create ours so /health can sit in front.
  await s3.configureBuckets();
  const s3Handler = s3.callback();

  const server = http.createServer((req, res) => {
    if (req.url === '/health' && (req.method === 'GET' || req.method === 'HEAD')) {
      res.writeHead(200, { 'content-type': 'application/json' });
      res.end(req.method === 'GET' ? JSON.stringify({ status: 'ok', buckets }) : undefined);
      return;
    }
    s3Handler(req, res);
  });
  await new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => {
      server.off('error', reject);
      resolve(undefined);
    });
  });
  const actualPort = /** @type {import('node:net').AddressInfo} */ (server.address()).port;

  return {
    url: `http://${host}:${actualPort}`,
    port: actualPort,
    buckets,
    async close() {
      await new Promise((resolve) => {
        server.close(() => resolve(undefined));
        server.closeAllConnections();
      });
      s3.logger.close();
    },
  };
}

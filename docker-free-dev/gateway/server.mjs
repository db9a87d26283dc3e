// The front door at APP_PORT: serves the built web app and passes /api to the API copies.
// With several API copies (API_URLS, comma-separated) it spreads requests round-robin, as a
// load balancer would in production; the API and worker keep no state between requests.
import express from 'express';
import helmet from 'helmet';
import { createProxyMiddleware } from 'http-proxy-middleware';
import path from 'node:path';
import { existsSync } from 'node:fs';

/**
 * @param {{ port: number, webRoot: string, apiUrls: string[], fileOrigins?: string[] }} options
 * `fileOrigins`: where the API's presigned file links point (the object store), so that
 * thumbnails and photos may be shown in the page.
 */
export function start({ port, webRoot, apiUrls, fileOrigins = [] }) {
  if (!existsSync(path.join(webRoot, 'index.html')))
    throw new Error(`No built web app in ${webRoot}; run the build first`);
  const app = express();
  app.disable('x-powered-by');
  let next = 0;
  app.use(
    '/api',
    createProxyMiddleware({
      target: apiUrls[0],
      router: () => apiUrls[next++ % apiUrls.length],
      changeOrigin: false,
      xfwd: true,
      pathRewrite: (p) => `/api${p}`,
    }),
  );
  app.use(
    helmet({
      // TLS, HSTS and https upgrades are the production load balancer's; this is plain-http loopback.
      strictTransportSecurity: false,
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          // Angular Material sets inline style attributes; scripts stay same-origin only.
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:', ...fileOrigins],
          fontSrc: ["'self'"],
          connectSrc: ["'self'"],
          formAction: ["'self'", 'http://127.0.0.1:*'],
          upgradeInsecureRequests: null,
        },
      },
    }),
  );
  // Hashed bundles never change; index.html must always be fetched fresh.
  app.use(express.static(webRoot, { index: false, immutable: true, maxAge: '365d' }));
  app.get('/{*path}', (_req, res) =>
    res.set('Cache-Control', 'no-cache').sendFile(path.join(webRoot, 'index.html')),
  );
  return new Promise((resolve) => {
    const server = app.listen(port, '127.0.0.1', () => resolve(server));
  });
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const port = Number(process.env.APP_PORT ?? 4200);
  const apiUrls = (process.env.API_URLS ?? process.env.API_URL ?? 'http://127.0.0.1:3333').split(
    ',',
  );
  const webRoot = path.resolve(process.env.WEB_ROOT ?? 'dist/apps/web/browser');
  const fileOrigins = process.env.S3_ENDPOINT
    ? [`http://${process.env.S3_ENDPOINT}:${process.env.S3_PORT ?? 9000}`]
    : [];
  const server = await start({ port, webRoot, apiUrls, fileOrigins });
  console.log(`gateway listening on http://127.0.0.1:${port} → ${apiUrls.join(', ')}`);
  const stop = () => server.close(() => process.exit(0));
  process.once('SIGTERM', stop);
  process.once('SIGINT', stop);
}

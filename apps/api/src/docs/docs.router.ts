import express, { Router } from 'express';
import { createRequire } from 'node:module';
import path from 'node:path';

const require = createRequire(__filename);

/** The pages this router serves (besides swagger-ui's static files), for the route walker. */
export const DOCS_ROUTES = [
  { method: 'get', path: '/', permission: 'public' },
  { method: 'get', path: '/start.js', permission: 'public' },
] as const;

/**
 * The browsable API reference: swagger-ui-dist served from node_modules (no CDN), started
 * by a script file of ours rather than an inline script so the CSP can stay strict.
 */
export function docsRouter(openApiUrl: string): Router {
  const assets = path.dirname(require.resolve('swagger-ui-dist/package.json'));
  const router = Router();
  router.get('/', (req, res, next) => {
    if (!req.originalUrl.endsWith('/')) return res.redirect(301, `${req.originalUrl}/`);
    next();
  });
  router.get('/', (_req, res) => {
    res.type('html').send(`<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>Latchwork API reference</title>
<meta name="viewport" content="width=device-width, initial-scale=1">
<link rel="stylesheet" href="swagger-ui.css"></head>
<body><div id="api-reference"></div>
<script src="swagger-ui-bundle.js"></script><script src="start.js"></script></body></html>`);
  });
  router.get('/start.js', (_req, res) => {
    res
      .type('js')
      .send(
        `window.ui = SwaggerUIBundle({ url: ${JSON.stringify(openApiUrl)}, dom_id: '#api-reference', deepLinking: true });`,
      );
  });
  router.use(express.static(assets, { index: false, maxAge: '1d' }));
  return router;
}

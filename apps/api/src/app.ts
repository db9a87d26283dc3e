import express from 'express';
import helmet from 'helmet';
import {
  buildOpenApiDocument,
  endpoint,
  errorHandler,
  notFoundHandler,
  requestLogger,
  routerFor,
  type EndpointDef,
} from '@latchwork/shared-server-kit';
import {
  actorMiddleware,
  auditEndpoints,
  authEndpoints,
  csrfProtection,
  guardEndpoint,
  meEndpoints,
  memberEndpoints,
  providerEventEndpoints,
  sessionMiddleware,
  settingsEndpoints,
  type IdentityDeps,
} from '@latchwork/identity-server';
import { takeoffEndpoints } from '@latchwork/takeoff-server';
import { jobsEndpoints } from '@latchwork/jobs-server';
import { stockEndpoints } from '@latchwork/stock-server';
import type { ApiDeps } from './deps';
import { healthEndpoints } from './health/health.endpoints';
import { DOCS_ROUTES, docsRouter } from './docs/docs.router';

export const API_PREFIX = '/api/v1';

/** Every operation of the API, in the order they are matched. */
export function apiEndpoints(deps: ApiDeps): EndpointDef[] {
  const identity: IdentityDeps = {
    db: deps.db,
    mailQueue: deps.mailQueue,
    oidc: deps.oidc,
    idpAdmin: deps.idpAdmin,
    appUrl: deps.config.appUrl,
  };
  const endpoints: EndpointDef[] = [
    ...healthEndpoints(deps),
    ...authEndpoints(identity),
    ...providerEventEndpoints({
      ...identity,
      providerEventSecret: deps.config.providerEventSecret,
    }),
    ...meEndpoints(identity),
    ...memberEndpoints(identity),
    ...settingsEndpoints(identity),
    ...auditEndpoints(identity),
    ...takeoffEndpoints({ db: deps.db }),
    ...jobsEndpoints({
      db: deps.db,
      mailQueue: deps.mailQueue,
      objectStore: deps.objectStore,
      appUrl: deps.config.appUrl,
    }),
    ...stockEndpoints({ db: deps.db, mailQueue: deps.mailQueue, appUrl: deps.config.appUrl }),
  ];
  const document = () =>
    buildOpenApiDocument(endpoints, {
      title: 'Latchwork API',
      version: deps.config.version,
      serverUrl: API_PREFIX,
    });
  endpoints.push(
    endpoint({
      method: 'get',
      path: '/openapi.json',
      summary: 'This API described as OpenAPI 3.1',
      tags: ['system'],
      permission: 'public',
      handle: () => document(),
    }),
  );
  return endpoints;
}

/**
 * Who may call each route, keyed `METHOD /api/v1/path` as Express sees it: the declared
 * endpoints and the API reference pages. The route walker test checks every route of the
 * router stack against this.
 */
export function routeAccess(deps: ApiDeps): Map<string, string> {
  const access = new Map<string, string>();
  for (const e of apiEndpoints(deps))
    access.set(`${e.method.toUpperCase()} ${API_PREFIX}${e.path}`, e.permission);
  for (const d of DOCS_ROUTES)
    access.set(`${d.method.toUpperCase()} ${API_PREFIX}/docs${d.path}`, d.permission);
  return access;
}

/** Builds the Express app without listening, so tests can drive it with supertest. */
export function createApp(deps: ApiDeps): express.Express {
  const app = express();
  app.disable('x-powered-by');
  // The gateway in front of the API is on loopback; trust it for the client's address only.
  app.set('trust proxy', 'loopback');
  // HSTS and https upgrades belong to the TLS-terminating load balancer in production; on
  // plain-http loopback they would break the app.
  app.use(
    helmet({
      strictTransportSecurity: false,
      contentSecurityPolicy: { directives: { upgradeInsecureRequests: null } },
    }),
  );
  app.use(requestLogger(deps.logger));
  // The raw body is kept for signed webhooks, whose signature covers the exact bytes.
  app.use(
    API_PREFIX,
    express.json({
      limit: '1mb',
      verify: (req, _res, buf) => ((req as { rawBody?: Buffer }).rawBody = buf),
    }),
  );
  app.use(API_PREFIX, sessionMiddleware(deps.sessionPool, deps.config.sessionSecret));
  app.use(API_PREFIX, csrfProtection);
  app.use(API_PREFIX, actorMiddleware(deps.db));
  app.use(API_PREFIX, routerFor(apiEndpoints(deps), { guard: guardEndpoint }));
  app.use(`${API_PREFIX}/docs`, docsRouter(`${API_PREFIX}/openapi.json`));
  app.use(notFoundHandler);
  app.use(errorHandler);
  return app;
}

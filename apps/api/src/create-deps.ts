import { Client as MinioClient } from 'minio';
import Stripe from 'stripe';
import { createDb } from '@latchwork/shared-db';
import {
  createMailerFromEnv,
  createMailQueue,
  createRedisConnection,
} from '@latchwork/shared-queues';
import { createLogger, requiredEnv } from '@latchwork/shared-server-kit';
import pg from 'pg';
import { httpIdentityProviderAdmin, OidcClient } from '@latchwork/identity-server';
import type { ApiDeps } from './deps';

/** Connects to every dependency from environment variables (see docker-free-dev/lib/config.mjs). */
export function createDepsFromEnv(): ApiDeps & { close(): Promise<void> } {
  const logger = createLogger('api');
  const db = createDb({
    connectionString: requiredEnv('DATABASE_URL'),
    applicationName: 'latchwork-api',
  });
  const redis = createRedisConnection(requiredEnv('REDIS_URL'));
  const objectStore = {
    client: new MinioClient({
      endPoint: requiredEnv('S3_ENDPOINT'),
      port: Number(requiredEnv('S3_PORT')),
      useSSL: process.env['S3_USE_SSL'] === 'true',
      accessKey: requiredEnv('S3_ACCESS_KEY'),
      secretKey: requiredEnv('S3_SECRET_KEY'),
      region: 'us-east-1',
    }),
    bucket: requiredEnv('S3_BUCKET'),
  };
  const mailer = createMailerFromEnv();
  const payments = new Stripe(requiredEnv('PAYMENTS_SECRET_KEY'), {
    host: requiredEnv('PAYMENTS_HOST'),
    port: Number(requiredEnv('PAYMENTS_PORT')),
    protocol: (process.env['PAYMENTS_PROTOCOL'] as 'http' | 'https' | undefined) ?? 'http',
    maxNetworkRetries: 1,
  });
  const mailQueue = createMailQueue(createRedisConnection(requiredEnv('REDIS_URL')));
  const sessionPool = new pg.Pool({
    connectionString: requiredEnv('DATABASE_URL'),
    max: 4,
    application_name: 'latchwork-api-sessions',
  });
  const appUrl = requiredEnv('APP_URL');
  const oidc = new OidcClient({
    issuer: requiredEnv('IDP_ISSUER'),
    clientId: requiredEnv('IDP_CLIENT_ID'),
    clientSecret: requiredEnv('IDP_CLIENT_SECRET'),
    callbackUrl: `${appUrl}/api/v1/auth/callback`,
  });
  return {
    db,
    redis,
    objectStore,
    mailer,
    payments,
    mailQueue,
    logger,
    sessionPool,
    oidc,
    idpAdmin: httpIdentityProviderAdmin(requiredEnv('IDP_ISSUER'), requiredEnv('IDP_ADMIN_TOKEN')),
    config: {
      appUrl,
      version: process.env['LW_VERSION'] ?? '0.1.0',
      sessionSecret: requiredEnv('SESSION_SECRET'),
      providerEventSecret: requiredEnv('IDP_EVENT_SECRET'),
    },
    async close() {
      await mailQueue.close();
      await sessionPool.end();
      await db.destroy();
      redis.disconnect();
      mailer.close();
    },
  };
}

import { Client as MinioClient } from 'minio';
import nodemailer from 'nodemailer';
import Stripe from 'stripe';
import { createDb } from '@latchwork/shared-db';
import { createMailQueue, createRedisConnection } from '@latchwork/shared-queues';
import { createLogger } from '@latchwork/shared-server-kit';
import pg from 'pg';
import { httpIdentityProviderAdmin, OidcClient } from '@latchwork/identity-server';
import type { ApiDeps } from './deps';

function required(name: string): string {
  const value = process.env[name];
  if (!value) throw new Error(`Environment variable ${name} is not set`);
  return value;
}

/** Connects to every dependency from environment variables (see docker-free-dev/lib/config.mjs). */
export function createDepsFromEnv(): ApiDeps & { close(): Promise<void> } {
  const logger = createLogger('api');
  const db = createDb({
    connectionString: required('DATABASE_URL'),
    applicationName: 'latchwork-api',
  });
  const redis = createRedisConnection(required('REDIS_URL'));
  const objectStore = {
    client: new MinioClient({
      endPoint: required('S3_ENDPOINT'),
      port: Number(required('S3_PORT')),
      useSSL: process.env['S3_USE_SSL'] === 'true',
      accessKey: required('S3_ACCESS_KEY'),
      secretKey: required('S3_SECRET_KEY'),
      region: 'us-east-1',
    }),
    bucket: required('S3_BUCKET'),
  };
  const mailer = nodemailer.createTransport({
    host: required('SMTP_HOST'),
    port: Number(required('SMTP_PORT')),
    secure: false,
    ignoreTLS: process.env['SMTP_TLS'] !== 'true',
  });
  const payments = new Stripe(required('PAYMENTS_SECRET_KEY'), {
    host: required('PAYMENTS_HOST'),
    port: Number(required('PAYMENTS_PORT')),
    protocol: (process.env['PAYMENTS_PROTOCOL'] as 'http' | 'https' | undefined) ?? 'http',
    maxNetworkRetries: 1,
  });
  const mailQueue = createMailQueue(createRedisConnection(required('REDIS_URL')));
  const sessionPool = new pg.Pool({
    connectionString: required('DATABASE_URL'),
    max: 4,
    application_name: 'latchwork-api-sessions',
  });
  const appUrl = required('APP_URL');
  const oidc = new OidcClient({
    issuer: required('IDP_ISSUER'),
    clientId: required('IDP_CLIENT_ID'),
    clientSecret: required('IDP_CLIENT_SECRET'),
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
    idpAdmin: httpIdentityProviderAdmin(required('IDP_ISSUER'), required('IDP_ADMIN_TOKEN')),
    config: {
      appUrl,
      version: process.env['LW_VERSION'] ?? '0.1.0',
      sessionSecret: required('SESSION_SECRET'),
      providerEventSecret: required('IDP_EVENT_SECRET'),
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

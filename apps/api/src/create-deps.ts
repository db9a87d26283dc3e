import { Client as MinioClient } from 'minio';
import nodemailer from 'nodemailer';
import Stripe from 'stripe';
import { createDb } from '@latchwork/shared-db';
import { createMailQueue, createRedisConnection } from '@latchwork/shared-queues';
import { createLogger } from '@latchwork/shared-server-kit';
import type { ApiDeps } from './deps';

function required(name: string): string {
  const value = process.env[name];
  if (!value) throw new Error(`Environment variable ${name} is not set`);
  return value;
}

/** Connects to every dependency from environment variables (see docker-free-dev/lib/config.mjs). */
export function createDepsFromEnv(): ApiDeps & { close(): Promise<void> } {
  const logger = createLogger('api');
  const db = createDb({ connectionString: required('DATABASE_URL'), applicationName: 'latchwork-api' });
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
  const mailer = nodemailer.createTransport({ host: required('SMTP_HOST'), port: Number(required('SMTP_PORT')), secure: false, ignoreTLS: process.env['SMTP_TLS'] !== 'true' });
  const payments = new Stripe(required('PAYMENTS_SECRET_KEY'), {
    host: required('PAYMENTS_HOST'),
    port: Number(required('PAYMENTS_PORT')),
    protocol: (process.env['PAYMENTS_PROTOCOL'] as 'http' | 'https' | undefined) ?? 'http',
    maxNetworkRetries: 1,
  });
  const mailQueue = createMailQueue(createRedisConnection(required('REDIS_URL')));
  return {
    db, redis, objectStore, mailer, payments, mailQueue, logger,
    config: { appUrl: required('APP_URL'), version: process.env['LW_VERSION'] ?? '0.1.0' },
    async close() {
      await mailQueue.close();
      await db.destroy();
      redis.disconnect();
      mailer.close();
    },
  };
}

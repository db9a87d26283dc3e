import type { Kysely } from 'kysely';
import type { Redis } from 'ioredis';
import type { Client as MinioClient } from 'minio';
import type { Transporter } from 'nodemailer';
import type Stripe from 'stripe';
import type { Logger } from 'pino';
import type { Queue } from 'bullmq';
import type { Database } from '@latchwork/shared-db';
import type { MailJob } from '@latchwork/shared-queues';
import type { Pool } from 'pg';
import type { IdentityProviderAdmin, OidcClient } from '@latchwork/identity-server';

/** Everything the API talks to, passed in so that tests can build the app around real or fake parts. */
export interface ApiDeps {
  db: Kysely<Database>;
  redis: Redis;
  objectStore: { client: MinioClient; bucket: string };
  mailer: Transporter;
  payments: Stripe;
  mailQueue: Queue<MailJob>;
  logger: Logger;
  /** A small pool of its own for the session store (connect-pg-simple speaks pg directly). */
  sessionPool: Pool;
  oidc: OidcClient;
  idpAdmin: IdentityProviderAdmin;
  config: { appUrl: string; version: string; sessionSecret: string; providerEventSecret: string };
}

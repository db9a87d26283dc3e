import type { Kysely } from 'kysely';
import type { Queue } from 'bullmq';
import type { Database } from '@latchwork/shared-db';
import type { MailJob } from '@latchwork/shared-queues';
import type { IdentityProviderAdmin } from './idp-admin';
import type { OidcClient } from './oidc-client';

/** What the identity endpoints need from the app. */
export interface IdentityDeps {
  db: Kysely<Database>;
  mailQueue: Queue<MailJob>;
  oidc: OidcClient;
  idpAdmin: IdentityProviderAdmin;
  /** The app's public base URL, e.g. http://127.0.0.1:4200. */
  appUrl: string;
}

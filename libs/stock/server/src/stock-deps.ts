import type { Kysely } from 'kysely';
import type { Queue } from 'bullmq';
import type { Database } from '@latchwork/shared-db';
import type { MailJob } from '@latchwork/shared-queues';

/** What the catalogue, stock and purchasing endpoints need from the API. */
export interface StockDeps {
  db: Kysely<Database>;
  mailQueue: Queue<MailJob>;
  appUrl: string;
}

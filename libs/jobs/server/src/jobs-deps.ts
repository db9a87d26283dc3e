import type { Kysely } from 'kysely';
import type { Queue } from 'bullmq';
import type { Client as MinioClient } from 'minio';
import type { Database } from '@latchwork/shared-db';
import type { MailJob } from '@latchwork/shared-queues';

/** What the customers, jobs, survey and files endpoints need from the API. */
export interface JobsDeps {
  db: Kysely<Database>;
  mailQueue: Queue<MailJob>;
  objectStore: { client: MinioClient; bucket: string };
  /** The app's public address, for links in e-mails. */
  appUrl: string;
}

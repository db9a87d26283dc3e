import { Queue, type ConnectionOptions, type JobsOptions } from 'bullmq';
import { z } from 'zod';
import type { Kysely } from 'kysely';
import { withTenant, type Database, type TenantScope } from '@latchwork/shared-db';
import { MAIL_TEMPLATES, type MailTemplateName } from './mail-templates';

export const MAIL_QUEUE = 'mail';

/**
 * A file sent with the e-mail (a purchase order's PDF). Carried in the job as base64: the
 * documents are a few kilobytes, and the worker then needs nothing but the job to send.
 */
export const mailAttachmentSchema = z.object({
  filename: z.string().min(1).max(200),
  contentType: z.string().min(1).max(100),
  contentBase64: z.base64().max(2_000_000),
});
export type MailAttachment = z.infer<typeof mailAttachmentSchema>;

export const mailJobSchema = z.object({
  tenantId: z.uuid(),
  emailLogId: z.uuid(),
  to: z.email(),
  template: z.enum(Object.keys(MAIL_TEMPLATES) as [MailTemplateName, ...MailTemplateName[]]),
  params: z.record(z.string(), z.string()),
  attachments: z.array(mailAttachmentSchema).max(5).optional(),
});
export type MailJob = z.infer<typeof mailJobSchema>;

/** Retries with exponential backoff: 2 s, 4 s, 8 s, 16 s, 32 s (about a minute in all). */
export const MAIL_JOB_OPTIONS: JobsOptions = {
  attempts: 6,
  backoff: { type: 'exponential', delay: 2000 },
  removeOnComplete: { age: 7 * 24 * 3600 },
  removeOnFail: false,
};

/**
 * `prefix` namespaces the queue's Redis keys (BullMQ's default is `bull`); tests use their
 * own so that a running worker does not take their jobs.
 */
export function createMailQueue(connection: ConnectionOptions, prefix?: string): Queue<MailJob> {
  return new Queue<MailJob>(MAIL_QUEUE, {
    connection,
    prefix,
    defaultJobOptions: MAIL_JOB_OPTIONS,
  });
}

/**
 * Records the e-mail as queued in the tenant's email log, then hands it to the worker.
 * The log row comes first so that nothing is sent that the log does not know about.
 */
export async function enqueueMail(
  db: Kysely<Database>,
  queue: Queue<MailJob>,
  scope: TenantScope,
  message: {
    to: string;
    template: MailTemplateName;
    params: Record<string, string>;
    attachments?: MailAttachment[];
  },
): Promise<string> {
  const subject = MAIL_TEMPLATES[message.template](message.params).subject;
  const row = await withTenant(db, scope, (tx) =>
    tx
      .insertInto('emailLog')
      .values({
        tenantId: scope.tenantId,
        toAddress: message.to,
        subject,
        template: message.template,
        status: 'queued',
      })
      .returning('id')
      .executeTakeFirstOrThrow(),
  );
  const job: MailJob = mailJobSchema.parse({
    tenantId: scope.tenantId,
    emailLogId: row.id,
    ...message,
  });
  await queue.add(message.template, job, { jobId: row.id });
  return row.id;
}

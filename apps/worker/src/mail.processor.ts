import type { Job } from 'bullmq';
import type { Kysely } from 'kysely';
import type { Transporter } from 'nodemailer';
import { withTenant, type Database } from '@latchwork/shared-db';
import { MAIL_TEMPLATES, mailJobSchema, type MailJob } from '@latchwork/shared-queues';

export interface MailProcessorDeps {
  db: Kysely<Database>;
  mailer: Transporter;
  from: string;
}

/**
 * Renders and sends one e-mail, then records the outcome in the tenant's email log. A
 * failure is recorded and rethrown so BullMQ retries with backoff; the last failure stays
 * in the log as `failed` with its error.
 */
export function mailProcessor(deps: MailProcessorDeps) {
  return async (job: Job<MailJob>): Promise<{ messageId: string }> => {
    const data = mailJobSchema.parse(job.data);
    const scope = { tenantId: data.tenantId };
    const attempts = job.attemptsMade + 1;
    try {
      const rendered = MAIL_TEMPLATES[data.template](data.params);
      const attachments = data.attachments?.map((a) => ({
        filename: a.filename,
        contentType: a.contentType,
        content: Buffer.from(a.contentBase64, 'base64'),
      }));
      const info = await deps.mailer.sendMail({
        from: deps.from,
        to: data.to,
        ...rendered,
        ...(attachments ? { attachments } : {}),
      });
      await withTenant(deps.db, scope, (tx) =>
        tx
          .updateTable('emailLog')
          .set({
            status: 'sent',
            messageId: info.messageId,
            attempts,
            sentAt: new Date(),
            error: null,
          })
          .where('tenantId', '=', scope.tenantId)
          .where('id', '=', data.emailLogId)
          .execute(),
      );
      return { messageId: info.messageId };
    } catch (err) {
      const finalAttempt = attempts >= (job.opts.attempts ?? 1);
      await withTenant(deps.db, scope, (tx) =>
        tx
          .updateTable('emailLog')
          .set({
            status: finalAttempt ? 'failed' : 'queued',
            attempts,
            error: (err as Error).message,
          })
          .where('tenantId', '=', scope.tenantId)
          .where('id', '=', data.emailLogId)
          .execute(),
      );
      throw err;
    }
  };
}

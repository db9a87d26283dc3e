import { sql, type Kysely } from 'kysely';
import type { Queue } from 'bullmq';
import { withTenant, type Database, type TenantScope, type Tx } from '@latchwork/shared-db';
import { enqueueMail, type MailJob } from '@latchwork/shared-queues';
import { parseMentions } from '@latchwork/jobs-domain';
import { assertJobVisible, recordJobEvent, type JobViewer } from './job-events';
import { listTeam } from './job.repository';

export interface NoteDeps {
  db: Kysely<Database>;
  mailQueue: Queue<MailJob>;
  appUrl: string;
}

/** The start of a note for an e-mail: whole words, at most about 300 characters. */
function excerpt(text: string): string {
  const flat = text.replace(/\s+/g, ' ').trim();
  if (flat.length <= 300) return flat;
  return `${flat.slice(0, 300).replace(/\s+\S*$/, '')}…`;
}

/**
 * Adds a note to a job and tells each member it @-mentions by e-mail through the worker's
 * mail queue, with a link to the job. The note and its timeline line are committed first; a
 * mail is queued after, and each one queued gets its own timeline line ("E-mailed Dee
 * Okafor"), so the timeline never claims an e-mail the queue did not take. The author is not
 * e-mailed about their own note.
 */
export async function addNote(
  deps: NoteDeps,
  scope: TenantScope,
  author: JobViewer & { name: string },
  jobId: string,
  body: string,
) {
  const saved = await withTenant(deps.db, scope, async (tx) => {
    await assertJobVisible(tx, scope, author, jobId);
    const team = await listTeam(tx, scope);
    const { members } = parseMentions(body, team);
    const note = await tx
      .insertInto('jobNote')
      .values({
        tenantId: scope.tenantId,
        jobId,
        authorUserId: author.userId,
        body,
        mentions: members.map((m) => m.id),
      })
      .returning(['id', 'createdAt'])
      .executeTakeFirstOrThrow();
    const names = members.map((m) => m.name);
    await recordJobEvent(tx, scope, {
      jobId,
      kind: 'note',
      summary: names.length
        ? `${author.name} added a note mentioning ${names.join(', ')}`
        : `${author.name} added a note`,
      detail: { noteId: note.id },
      actorUserId: author.userId,
    });
    const job = await tx
      .selectFrom('job')
      .select(['reference', 'title'])
      .where('tenantId', '=', scope.tenantId)
      .where('id', '=', jobId)
      .executeTakeFirstOrThrow();
    const firm = await tx
      .selectFrom('tenant')
      .select('name')
      .where('id', '=', scope.tenantId)
      .executeTakeFirstOrThrow();
    const told = team.filter((t) => t.id !== author.userId && members.some((m) => m.id === t.id));
    return { note, job, firm: firm.name, told };
  });

  const emailed: { userId: string; name: string; emailLogId: string }[] = [];
  for (const person of saved.told) {
    const emailLogId = await enqueueMail(deps.db, deps.mailQueue, scope, {
      to: person.email,
      template: 'mention',
      params: {
        firm: saved.firm,
        author: author.name,
        job: `${saved.job.reference} ${saved.job.title}`,
        excerpt: excerpt(body),
        url: `${deps.appUrl}/jobs/${jobId}`,
      },
    });
    await withTenant(deps.db, scope, (tx) =>
      recordJobEvent(tx, scope, {
        jobId,
        kind: 'email-queued',
        summary: `E-mailed ${person.name} about the mention`,
        detail: { to: person.email, template: 'mention', emailLogId, noteId: saved.note.id },
        actorUserId: author.userId,
      }),
    );
    emailed.push({ userId: person.id, name: person.name, emailLogId });
  }
  return {
    id: saved.note.id,
    createdAt: saved.note.createdAt,
    mentions: saved.told.map((t) => ({ id: t.id, name: t.name })),
    emailed,
  };
}

/**
 * One page of a job's timeline, newest first. `before` is the id of the last event of the
 * previous page (keyset paging: a new event cannot shift a page under the reader). Note
 * events carry the note's text.
 */
export async function timeline(
  tx: Tx,
  scope: TenantScope,
  viewer: JobViewer,
  jobId: string,
  page: { before?: string; limit: number },
) {
  await assertJobVisible(tx, scope, viewer, jobId);
  let q = tx
    .selectFrom('jobEvent as e')
    .leftJoin('appUser as u', 'u.id', 'e.actorUserId')
    .leftJoin('jobNote as n', (join) =>
      join
        .onRef('n.tenantId', '=', 'e.tenantId')
        .onRef('n.jobId', '=', 'e.jobId')
        .on(sql`n.id::text`, '=', sql`e.detail ->> 'noteId'`)
        .on('e.kind', '=', 'note'),
    )
    .select([
      'e.id',
      'e.kind',
      'e.summary',
      'e.detail',
      'e.createdAt',
      'e.actorUserId',
      'u.name as actorName',
      'n.body as noteBody',
    ])
    .where('e.tenantId', '=', scope.tenantId)
    .where('e.jobId', '=', jobId);
  if (page.before)
    q = q.where(
      sql<boolean>`(e.created_at, e.id) < (select b.created_at, b.id from job_event b
        where b.tenant_id = ${scope.tenantId} and b.id = ${page.before})`,
    );
  const rows = await q
    .orderBy('e.createdAt', 'desc')
    .orderBy('e.id', 'desc')
    .limit(page.limit + 1)
    .execute();
  const items = rows.slice(0, page.limit);
  return {
    items,
    nextBefore: rows.length > page.limit ? (items.at(-1)?.id ?? null) : null,
  };
}

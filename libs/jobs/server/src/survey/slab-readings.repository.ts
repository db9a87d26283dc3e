import type { TenantScope, Tx } from '@latchwork/shared-db';
import { NotFoundError, ValidationError } from '@latchwork/shared-server-kit';
import {
  evaluateReading,
  readingProblems,
  type ReadingKind,
  type ReadingMethod,
  type SlabLimits,
  type SlabReading,
} from '@latchwork/jobs-domain';
import type { z } from 'zod';
import type { readingBody } from './survey.schemas';

export type ReadingInput = z.output<typeof readingBody>;

/** The reading in the domain's shape, for `evaluateReading` and `surveyWarnings`. */
export function asSlabReading(row: {
  id?: string;
  kind: string;
  method: string;
  value: number;
  unit?: string | null;
  location: string;
}): SlabReading {
  return {
    id: row.id,
    kind: row.kind as ReadingKind,
    method: row.method as ReadingMethod,
    value: row.value,
    ...(row.unit ? { unit: row.unit as SlabReading['unit'] } : {}),
    ...(row.location ? { location: row.location } : {}),
  };
}

/** Which field a problem sentence of `readingProblems` is about, for the form to mark. */
function problemField(message: string): string {
  if (message.includes('measured by')) return 'method';
  if (message.includes('take a unit')) return 'unit';
  return 'value';
}

const READING_COLUMNS = [
  'id',
  'kind',
  'method',
  'value',
  'unit',
  'location',
  'takenAt',
  'status',
  'message',
  'source',
  'recordedBy',
  'createdAt',
] as const;

/** The job's readings in the order they were taken. */
export function listReadings(tx: Tx, scope: TenantScope, jobId: string) {
  return tx
    .selectFrom('slabReading')
    .select(READING_COLUMNS)
    .where('tenantId', '=', scope.tenantId)
    .where('jobId', '=', jobId)
    .orderBy('takenAt')
    .orderBy('createdAt')
    .execute();
}

/**
 * Judges the reading against the firm's limits and stores it with that verdict (the record of
 * what the surveyor was told on the day). Problems (a method that does not fit the kind, an
 * implausible value) are a 400 naming the field.
 */
export async function recordReading(
  tx: Tx,
  scope: TenantScope,
  jobId: string,
  input: ReadingInput,
  limits: SlabLimits,
  userId: string,
) {
  const reading = asSlabReading(input);
  const problems = readingProblems(reading);
  if (problems.length)
    throw new ValidationError(
      problems[0] ?? '',
      problems.map((message) => ({ path: problemField(message), message })),
    );
  const verdict = evaluateReading(reading, limits);
  return tx
    .insertInto('slabReading')
    .values({
      tenantId: scope.tenantId,
      jobId,
      kind: input.kind as ReadingKind,
      method: input.method,
      value: input.value,
      unit: input.unit ?? null,
      location: input.location,
      takenAt: input.takenAt,
      status: verdict.status,
      message: verdict.message,
      source: verdict.source,
      recordedBy: userId,
    })
    .returning(READING_COLUMNS)
    .executeTakeFirstOrThrow();
}

/** Removes a reading taken by mistake (the timeline keeps that it was recorded). */
export async function deleteReading(tx: Tx, scope: TenantScope, jobId: string, readingId: string) {
  const gone = await tx
    .deleteFrom('slabReading')
    .where('tenantId', '=', scope.tenantId)
    .where('jobId', '=', jobId)
    .where('id', '=', readingId)
    .returning(['id', 'kind', 'value', 'location'])
    .executeTakeFirst();
  if (!gone) throw new NotFoundError('The reading');
  return gone;
}

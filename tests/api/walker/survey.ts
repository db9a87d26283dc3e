import type { Kysely } from 'kysely';
import { withTenant, type Database } from '@latchwork/shared-db';
import type { WalkerFixture } from './fixture';
import { newCustomer } from './jobs';
import { createJob } from '../../../libs/jobs/server/src/jobs/job.repository';

const unique = () => `${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 8)}`;

/** A customer, a site and a job at Enquiry in the firm, opened as the API opens one. */
export async function createTestJob(
  db: Kysely<Database>,
  tenantId: string,
  userId: string,
  title = `Survey test job ${unique()}`,
): Promise<{ jobId: string; customerId: string; siteId: string }> {
  const { customerId, siteId } = await newCustomer(db, tenantId);
  const scope = { tenantId };
  const job = await withTenant(db, scope, (tx) =>
    createJob(tx, scope, userId, { title, customerId, siteId, source: 'survey tests' }),
  );
  return { jobId: job.id, customerId, siteId };
}

/** A 3 × 2 m floor at 500 mm: the smallest body the takeoff version route computes. */
export const SMALL_FLOOR = {
  outline: [
    [0, 0],
    [3000, 0],
    [3000, 2000],
    [0, 2000],
  ],
  tile: { pitchMm: 500 },
};

/**
 * The survey routes aim at one job of firm A with one area (with a saved version) and one
 * reading. The reading's delete is the only destructive route; it runs after the others.
 */
export const surveyWalk: WalkerFixture = {
  prepare: async ({ db, tenantA, ownerA }) => {
    const { jobId } = await createTestJob(db, tenantA, ownerA, `Walker survey job ${unique()}`);
    return withTenant(db, { tenantId: tenantA }, async (tx) => {
      const area = await tx
        .insertInto('surveyArea')
        .values({ tenantId: tenantA, jobId, name: 'Walker bay', createdBy: ownerA })
        .returning('id')
        .executeTakeFirstOrThrow();
      // A stored version to read; its figures do not matter to the walk.
      await tx
        .insertInto('takeoffVersion')
        .values({
          tenantId: tenantA,
          areaId: area.id,
          version: 1,
          input: JSON.stringify(SMALL_FLOOR),
          rates: '{}',
          summary: '{}',
          createdBy: ownerA,
        })
        .execute();
      const reading = await tx
        .insertInto('slabReading')
        .values({
          tenantId: tenantA,
          jobId,
          kind: 'air_temperature',
          method: 'thermometer',
          value: 18,
          takenAt: new Date(),
          status: 'pass',
          message: 'Air temperature 18 °C (thermometer) is within the 15 °C limit.',
          source: 'common practice for interlocking PVC tiles',
        })
        .returning('id')
        .executeTakeFirstOrThrow();
      return {
        // Sub-resources must belong to the job in the path, so the walk aims every :jobId
        // route at this job (a plain firm-A job at Enquiry; see the report on sharing it).
        jobId,
        areaId: area.id,
        takeoffVersion: '1',
        readingId: reading.id,
      };
    });
  },
  bodies: {
    'PUT /api/v1/jobs/:jobId/survey': () => ({
      substrate: 'concrete',
      surveyedAt: new Date().toISOString(),
      surveyorUserId: null,
      notes: 'Walked by the route walker.',
    }),
    'POST /api/v1/jobs/:jobId/survey/areas': () => ({ name: `Walker area ${unique()}` }),
    'PATCH /api/v1/jobs/:jobId/survey/areas/:areaId': () => ({ name: 'Walker bay' }),
    'POST /api/v1/jobs/:jobId/survey/areas/:areaId/versions': () => SMALL_FLOOR,
    'POST /api/v1/jobs/:jobId/survey/readings': () => ({
      kind: 'relative_humidity',
      method: 'hood_hygrometer',
      value: 68,
      location: 'by the door',
      takenAt: new Date().toISOString(),
    }),
    'DELETE /api/v1/jobs/:jobId/survey/readings/:readingId': () => ({}),
    // No overrides: the firm keeps the sourced defaults.
    'PUT /api/v1/survey/limits': () => ({}),
  },
};

import { randomUUID } from 'node:crypto';
import { withTenant } from '@latchwork/shared-db';
import type { WalkerFixture } from './fixture';
import { createTestJob } from './survey';

/**
 * The file routes aim at one PDF filed on a job of firm A. Its row is made straight in the
 * database (the walker sends JSON, not multipart; the upload route must answer it with 400),
 * and the object behind it is never fetched: a link is only signed, not followed.
 */
export const filesWalk: WalkerFixture = {
  prepare: async ({ db, tenantA, ownerA }) => {
    const { jobId } = await createTestJob(db, tenantA, ownerA, 'Walker files job');
    return withTenant(db, { tenantId: tenantA }, async (tx) => {
      const file = await tx
        .insertInto('file')
        .values({
          tenantId: tenantA,
          objectKey: `tenants/${tenantA}/files/${randomUUID()}`,
          fileName: 'walker plan.pdf',
          contentType: 'application/pdf',
          sizeBytes: 1024,
          uploadedBy: ownerA,
        })
        .returning('id')
        .executeTakeFirstOrThrow();
      await tx
        .insertInto('fileLink')
        .values({ tenantId: tenantA, fileId: file.id, ownerKind: 'job', jobId })
        .execute();
      return { fileId: file.id };
    });
  },
  bodies: {
    // JSON on purpose: the walk checks a non-multipart upload is a 400, never a 5xx.
    'POST /api/v1/files': () => ({ ownerKind: 'job', ownerId: randomUUID() }),
    'DELETE /api/v1/files/:fileId': () => ({}),
  },
};

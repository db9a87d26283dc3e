import { z } from 'zod';
import { withTenant, recordAudit, type TenantScope, type Tx } from '@latchwork/shared-db';
import {
  actorOf,
  endpoint,
  scopeOf,
  ValidationError,
  type EndpointDef,
} from '@latchwork/shared-server-kit';
import type { Request } from 'express';
import type { JobsDeps } from '../jobs-deps';
import { recordJobEvent } from '../jobs/job-events';
import { assertOwnerVisible, OWNER_KINDS, type FileOwner } from './file-owners';
import { MAX_FILE_BYTES, readUpload } from './file-upload';
import { storeUploads } from './file-intake';
import { LINK_TTL_SECONDS, presignedLink, removeObjects } from './file-storage';
import { deleteFileRows, findVisibleFile, insertFile, listFiles } from './file.repository';

const tags = ['files'];
const ownerQuery = z.object({ ownerKind: z.enum(OWNER_KINDS), ownerId: z.string().min(1).max(64) });
const fileParams = z.object({ fileId: z.uuid() });
const linkQuery = z.object({ variant: z.enum(['original', 'thumbnail']).default('original') });

/** File writes in the audit log. */
function auditFile(
  tx: Tx,
  scope: TenantScope,
  req: Request,
  action: 'file-uploaded' | 'file-deleted',
  detail: Record<string, unknown>,
) {
  return recordAudit(tx, scope, {
    userId: actorOf(req).userId,
    action,
    subject: String(detail['fileName'] ?? ''),
    detail,
    ipAddress: req.ip,
  });
}

const megabytes = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(1)} MB`;

/** Photos, plans and documents of jobs, sites and customers, in the object store. */
export function fileEndpoints(deps: JobsDeps): EndpointDef[] {
  return [
    endpoint({
      method: 'post',
      path: '/files',
      summary: `Upload files (multipart: "files", "ownerKind", "ownerId"; ≤ ${MAX_FILE_BYTES / 1024 / 1024} MB each; images, PDF, CSV)`,
      tags,
      permission: 'jobs:write',
      status: 201,
      async handle({ req, res }) {
        const scope = scopeOf(req);
        const actor = actorOf(req);
        const { files, fields } = await readUpload(req, res);
        const parsed = ownerQuery.safeParse(fields);
        if (!parsed.success) {
          const message =
            'Say what the files belong to: ownerKind (job, site or customer) and ownerId.';
          throw new ValidationError(message, [{ path: 'ownerKind', message }]);
        }
        const owner: FileOwner = { kind: parsed.data.ownerKind, id: parsed.data.ownerId };
        // Check the owner before storing anything, so a bad id leaves no orphan objects.
        await withTenant(deps.db, scope, (tx) => assertOwnerVisible(tx, scope, actor, owner));
        const stored = await storeUploads(deps.objectStore, scope, files);
        try {
          return await withTenant(deps.db, scope, async (tx) => {
            await assertOwnerVisible(tx, scope, actor, owner);
            const saved = [];
            for (const file of stored) {
              const row = await insertFile(tx, scope, owner, file, actor.userId);
              saved.push(row);
              const detail = {
                fileId: row.id,
                fileName: row.fileName,
                ownerKind: owner.kind,
                ownerId: owner.id,
              };
              await auditFile(tx, scope, req, 'file-uploaded', detail);
              if (owner.kind === 'job')
                await recordJobEvent(tx, scope, {
                  jobId: owner.id,
                  kind: 'file-uploaded',
                  summary: `File uploaded: ${row.fileName} (${megabytes(row.sizeBytes)})`,
                  detail,
                  actorUserId: actor.userId,
                });
            }
            return saved;
          });
        } catch (err) {
          await removeObjects(
            deps.objectStore,
            stored.flatMap((f) => [f.objectKey, ...(f.thumbnail ? [f.thumbnail.objectKey] : [])]),
          );
          throw err;
        }
      },
    }),
    endpoint({
      method: 'get',
      path: '/files',
      summary: 'The files of a job, site or customer, newest first',
      tags,
      permission: 'jobs:read',
      query: ownerQuery,
      handle: ({ query, req }) => {
        const scope = scopeOf(req);
        const owner: FileOwner = { kind: query.ownerKind, id: query.ownerId };
        return withTenant(deps.db, scope, async (tx) => {
          await assertOwnerVisible(tx, scope, actorOf(req), owner);
          return listFiles(tx, scope, owner);
        });
      },
    }),
    endpoint({
      method: 'get',
      path: '/files/:fileId/link',
      summary: `A download link for the file or its thumbnail, valid ${LINK_TTL_SECONDS / 60} minutes`,
      tags,
      permission: 'jobs:read',
      params: fileParams,
      query: linkQuery,
      handle: async ({ params, query, req }) => {
        const scope = scopeOf(req);
        const file = await withTenant(deps.db, scope, (tx) =>
          findVisibleFile(tx, scope, actorOf(req), params.fileId),
        );
        const thumbnail = query.variant === 'thumbnail';
        if (thumbnail && !file.thumbnailKey) {
          const message = 'This file has no thumbnail.';
          throw new ValidationError(message, [{ path: 'variant', message }]);
        }
        const expiresAt = new Date(Date.now() + LINK_TTL_SECONDS * 1000);
        const url = thumbnail
          ? await presignedLink(
              deps.objectStore,
              file.thumbnailKey ?? '',
              file.fileName,
              'image/webp',
            )
          : await presignedLink(deps.objectStore, file.objectKey, file.fileName, file.contentType);
        return { url, expiresAt };
      },
    }),
    endpoint({
      method: 'delete',
      path: '/files/:fileId',
      summary: 'Delete a file and its thumbnail',
      tags,
      permission: 'jobs:write',
      params: fileParams,
      handle: async ({ params, req }) => {
        const scope = scopeOf(req);
        const actor = actorOf(req);
        const file = await withTenant(deps.db, scope, async (tx) => {
          const found = await findVisibleFile(tx, scope, actor, params.fileId);
          await deleteFileRows(tx, scope, found.id);
          const detail = { fileId: found.id, fileName: found.fileName };
          await auditFile(tx, scope, req, 'file-deleted', detail);
          for (const owner of found.owners.filter((o) => o.kind === 'job'))
            await recordJobEvent(tx, scope, {
              jobId: owner.id,
              kind: 'file-deleted',
              summary: `File deleted: ${found.fileName}`,
              detail,
              actorUserId: actor.userId,
            });
          return found;
        });
        // After the commit: a failed removal leaves an unreachable object, never a dead link.
        const left = await removeObjects(deps.objectStore, [
          file.objectKey,
          ...(file.thumbnailKey ? [file.thumbnailKey] : []),
        ]);
        if (left.length) req.log?.warn({ keys: left }, 'file objects left in the store');
        return { id: file.id };
      },
    }),
  ];
}

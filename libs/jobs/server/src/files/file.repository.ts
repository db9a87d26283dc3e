import type { TenantScope, Tx } from '@latchwork/shared-db';
import { NotFoundError, type Actor } from '@latchwork/shared-server-kit';
import type { FileKind } from './file-content';
import { linkColumns, ownerOfLink, ownerVisible, type FileOwner } from './file-owners';

export interface NewStoredFile {
  objectKey: string;
  fileName: string;
  contentType: string;
  sizeBytes: number;
  kind: FileKind;
  thumbnail: { objectKey: string; width: number; height: number; sizeBytes: number } | null;
}

/** Records a stored file, its thumbnail and its link to the owner. */
export async function insertFile(
  tx: Tx,
  scope: TenantScope,
  owner: FileOwner,
  file: NewStoredFile,
  userId: string,
) {
  const row = await tx
    .insertInto('file')
    .values({
      tenantId: scope.tenantId,
      objectKey: file.objectKey,
      fileName: file.fileName,
      contentType: file.contentType,
      sizeBytes: file.sizeBytes,
      uploadedBy: userId,
    })
    .returning(['id', 'createdAt'])
    .executeTakeFirstOrThrow();
  await tx
    .insertInto('fileLink')
    .values({ tenantId: scope.tenantId, fileId: row.id, ...linkColumns(owner) })
    .execute();
  if (file.thumbnail)
    await tx
      .insertInto('fileThumbnail')
      .values({
        tenantId: scope.tenantId,
        fileId: row.id,
        objectKey: file.thumbnail.objectKey,
        contentType: 'image/webp',
        width: file.thumbnail.width,
        height: file.thumbnail.height,
        sizeBytes: file.thumbnail.sizeBytes,
      })
      .execute();
  return {
    id: row.id,
    fileName: file.fileName,
    contentType: file.contentType,
    sizeBytes: file.sizeBytes,
    hasThumbnail: file.thumbnail !== null,
    uploadedBy: userId,
    createdAt: row.createdAt,
  };
}

/** The owner's files, newest first, with whether each has a thumbnail. */
export async function listFiles(tx: Tx, scope: TenantScope, owner: FileOwner) {
  const column =
    owner.kind === 'job' ? 'l.jobId' : owner.kind === 'site' ? 'l.siteId' : 'l.customerId';
  const rows = await tx
    .selectFrom('fileLink as l')
    .innerJoin('file as f', (j) =>
      j.onRef('f.tenantId', '=', 'l.tenantId').onRef('f.id', '=', 'l.fileId'),
    )
    .leftJoin('fileThumbnail as t', (j) =>
      j.onRef('t.tenantId', '=', 'f.tenantId').onRef('t.fileId', '=', 'f.id'),
    )
    .leftJoin('appUser as u', 'u.id', 'f.uploadedBy')
    .select([
      'f.id',
      'f.fileName',
      'f.contentType',
      'f.sizeBytes',
      'f.uploadedBy',
      'u.name as uploadedByName',
      'f.createdAt',
      't.fileId as thumbnailOf',
    ])
    .where('l.tenantId', '=', scope.tenantId)
    .where('l.ownerKind', '=', owner.kind)
    .where(column, '=', owner.id)
    .orderBy('f.createdAt', 'desc')
    .orderBy('f.id')
    .execute();
  return rows.map(({ thumbnailOf, sizeBytes, ...r }) => ({
    ...r,
    sizeBytes: Number(sizeBytes),
    hasThumbnail: thumbnailOf !== null,
  }));
}

/**
 * The file with its links and thumbnail, if the actor may see at least one of its owners;
 * otherwise (and for another firm's file) NotFoundError.
 */
export async function findVisibleFile(tx: Tx, scope: TenantScope, actor: Actor, fileId: string) {
  const file = await tx
    .selectFrom('file as f')
    .leftJoin('fileThumbnail as t', (j) =>
      j.onRef('t.tenantId', '=', 'f.tenantId').onRef('t.fileId', '=', 'f.id'),
    )
    .select(['f.id', 'f.objectKey', 'f.fileName', 'f.contentType', 't.objectKey as thumbnailKey'])
    .where('f.tenantId', '=', scope.tenantId)
    .where('f.id', '=', fileId)
    .executeTakeFirst();
  if (!file) throw new NotFoundError('The file');
  const links = await tx
    .selectFrom('fileLink')
    .select(['ownerKind', 'jobId', 'siteId', 'customerId'])
    .where('tenantId', '=', scope.tenantId)
    .where('fileId', '=', fileId)
    .execute();
  const owners = links.map(ownerOfLink);
  for (const owner of owners)
    if (await ownerVisible(tx, scope, actor, owner)) return { ...file, owners };
  throw new NotFoundError('The file');
}

/** Deletes the file's rows (links and thumbnail go with it); the caller removes the objects. */
export async function deleteFileRows(tx: Tx, scope: TenantScope, fileId: string) {
  await tx
    .deleteFrom('file')
    .where('tenantId', '=', scope.tenantId)
    .where('id', '=', fileId)
    .execute();
}

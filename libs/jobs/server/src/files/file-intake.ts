import type { TenantScope } from '@latchwork/shared-db';
import { judgeContent } from './file-content';
import { UploadRefused, type UploadedPart } from './file-upload';
import {
  makeThumbnail,
  newObjectKey,
  putObject,
  removeObjects,
  type ObjectStore,
} from './file-storage';
import type { NewStoredFile } from './file.repository';

/**
 * Checks every file's content first (one refusal refuses the request, naming the file), then
 * stores each file and, for images, a WebP thumbnail as a second object. Returns what was
 * stored; on a failure part-way the objects already put are removed.
 */
export async function storeUploads(
  store: ObjectStore,
  scope: TenantScope,
  parts: UploadedPart[],
): Promise<NewStoredFile[]> {
  const judged = [];
  for (const part of parts) {
    const verdict = await judgeContent(part.bytes, part.fileName);
    if (!verdict.ok)
      throw new UploadRefused(
        415,
        `"${part.fileName}" is ${verdict.detected}: only photos (JPEG, PNG, WebP, HEIC), PDF and CSV files can be uploaded.`,
        part.fileName,
      );
    judged.push({ part, verdict });
  }
  const stored: NewStoredFile[] = [];
  const keys: string[] = [];
  try {
    for (const { part, verdict } of judged) {
      const objectKey = newObjectKey(scope.tenantId);
      await putObject(store, objectKey, part.bytes, verdict.contentType);
      keys.push(objectKey);
      const thumb = verdict.kind === 'image' ? await makeThumbnail(part.bytes) : null;
      let thumbnail: NewStoredFile['thumbnail'] = null;
      if (thumb) {
        const thumbKey = `${objectKey}-thumbnail`;
        await putObject(store, thumbKey, thumb.bytes, 'image/webp');
        keys.push(thumbKey);
        thumbnail = {
          objectKey: thumbKey,
          width: thumb.width,
          height: thumb.height,
          sizeBytes: thumb.bytes.length,
        };
      }
      stored.push({
        objectKey,
        fileName: part.fileName,
        contentType: verdict.contentType,
        sizeBytes: part.bytes.length,
        kind: verdict.kind,
        thumbnail,
      });
    }
  } catch (err) {
    await removeObjects(store, keys);
    throw err;
  }
  return stored;
}

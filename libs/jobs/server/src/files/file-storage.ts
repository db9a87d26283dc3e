import { randomUUID } from 'node:crypto';
import sharp from 'sharp';
import type { Client as MinioClient } from 'minio';

export interface ObjectStore {
  client: MinioClient;
  bucket: string;
}

/** Longest side of a thumbnail, px: sharp enough for a list row on a high-density screen. */
export const THUMBNAIL_PX = 320;
/** How long a download link works: long enough to open it, short enough not to be shared. */
export const LINK_TTL_SECONDS = 5 * 60;

/** Every object of a firm lives under its own prefix, so no key can name another firm's file. */
export function newObjectKey(tenantId: string): string {
  return `tenants/${tenantId}/files/${randomUUID()}`;
}

export interface Thumbnail {
  bytes: Buffer;
  width: number;
  height: number;
}

/**
 * A WebP thumbnail of an image, turned upright by its EXIF orientation (phone photos).
 * Null when sharp cannot decode the format (HEIC's codec is not in sharp's build): the list
 * then shows an icon.
 */
export async function makeThumbnail(image: Buffer): Promise<Thumbnail | null> {
  try {
    const { data, info } = await sharp(image)
      .rotate()
      .resize(THUMBNAIL_PX, THUMBNAIL_PX, { fit: 'inside', withoutEnlargement: true })
      .webp({ quality: 75 })
      .toBuffer({ resolveWithObject: true });
    return { bytes: data, width: info.width, height: info.height };
  } catch {
    return null;
  }
}

export async function putObject(
  store: ObjectStore,
  key: string,
  bytes: Buffer,
  contentType: string,
): Promise<void> {
  await store.client.putObject(store.bucket, key, bytes, bytes.length, {
    'Content-Type': contentType,
  });
}

/** Removes objects, ignoring any already gone; returns the keys it could not remove. */
export async function removeObjects(store: ObjectStore, keys: string[]): Promise<string[]> {
  const failed: string[] = [];
  for (const key of keys) {
    try {
      await store.client.removeObject(store.bucket, key);
    } catch {
      failed.push(key);
    }
  }
  return failed;
}

/** RFC 6266 / RFC 5987 header value, so names with accents or quotes survive the download. */
function contentDisposition(fileName: string, inline: boolean): string {
  const ascii = fileName.replace(/[^\x20-\x7e]|["\\]/g, '_');
  return `${inline ? 'inline' : 'attachment'}; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(fileName)}`;
}

/** A presigned GET for one object, valid LINK_TTL_SECONDS; images and PDFs open in the tab. */
export function presignedLink(
  store: ObjectStore,
  key: string,
  fileName: string,
  contentType: string,
): Promise<string> {
  const inline = contentType.startsWith('image/') || contentType === 'application/pdf';
  return store.client.presignedGetObject(store.bucket, key, LINK_TTL_SECONDS, {
    'response-content-disposition': contentDisposition(fileName, inline),
    'response-content-type': contentType,
  });
}

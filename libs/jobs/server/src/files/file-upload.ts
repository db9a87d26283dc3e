import type { Request, Response } from 'express';
import multer from 'multer';
import { AppError, ValidationError } from '@latchwork/shared-server-kit';

/** Largest file accepted: 20 MB (MiB, as file managers count them). */
export const MAX_FILE_BYTES = 20 * 1024 * 1024;
/** Files per request; the page sends one per request so each has its own progress bar. */
export const MAX_FILES_PER_REQUEST = 10;

/** An upload refused for one named file: too big (413) or not a kind we keep (415). */
export class UploadRefused extends AppError {
  constructor(
    readonly status: 413 | 415,
    message: string,
    readonly fileName: string,
  ) {
    super(status === 413 ? 'payload_too_large' : 'unsupported_media_type', message, { fileName });
  }
}

export interface UploadedPart {
  fileName: string;
  bytes: Buffer;
}

// Memory storage: every file is checked whole (type from content, thumbnail) before anything
// is stored, and the size cap bounds what a request can hold.
const parser = multer({
  storage: multer.memoryStorage(),
  defParamCharset: 'utf8',
  limits: { fileSize: MAX_FILE_BYTES, files: MAX_FILES_PER_REQUEST, fields: 10, parts: 20 },
}).array('files', MAX_FILES_PER_REQUEST);

/** A file name fit to store and show: no folders, no control characters, at most 200 chars. */
export function cleanFileName(name: string): string {
  // eslint-disable-next-line no-control-regex
  const base = (name.split(/[\\/]/).pop() ?? '').replace(/[\u0000-\u001f\u007f]/g, '').trim();
  return (base || 'file').slice(0, 200);
}

/**
 * Reads a multipart request (field `files`, several allowed, plus text fields). A request
 * that is not multipart is a 400 telling the caller how to send files; a file over the cap
 * is a 413 naming it and the limit.
 */
export async function readUpload(
  req: Request,
  res: Response,
): Promise<{ files: UploadedPart[]; fields: Record<string, unknown> }> {
  if (!req.is('multipart/form-data')) {
    const message = 'Send files as multipart/form-data in the field "files".';
    throw new ValidationError(message, [{ path: 'files', message }]);
  }
  await new Promise<void>((resolve, reject) => {
    parser(req, res, (err: unknown) => (err ? reject(asAppError(err)) : resolve()));
  });
  const files = ((req.files as Express.Multer.File[] | undefined) ?? []).map((f) => ({
    fileName: cleanFileName(f.originalname),
    bytes: f.buffer,
  }));
  if (!files.length) {
    const message = 'Choose at least one file.';
    throw new ValidationError(message, [{ path: 'files', message }]);
  }
  return { files, fields: (req.body ?? {}) as Record<string, unknown> };
}

function asAppError(err: unknown): unknown {
  if (!(err instanceof multer.MulterError)) return err;
  if (err.code === 'LIMIT_FILE_SIZE') {
    // multer 2 names the file; its type definitions do not list the property yet.
    const name = cleanFileName((err as { filename?: string }).filename ?? 'file');
    return new UploadRefused(413, `"${name}" is larger than the 20 MB limit for one file.`, name);
  }
  const message =
    err.code === 'LIMIT_FILE_COUNT'
      ? `Send at most ${MAX_FILES_PER_REQUEST} files at once.`
      : `The upload could not be read: ${err.message}.`;
  return new ValidationError(message, [{ path: err.field ?? 'files', message }]);
}

import { fileTypeFromBuffer } from 'file-type';

/** The kinds of file Latchwork keeps: site photos, plans and documents, spreadsheets. */
export type FileKind = 'image' | 'pdf' | 'csv';

/** Image types we accept; HEIC is what phones take photos in. */
const IMAGE_TYPES = new Set(['image/jpeg', 'image/png', 'image/webp', 'image/heic', 'image/heif']);

export type ContentVerdict =
  | { ok: true; kind: FileKind; contentType: string }
  | { ok: false; detected: string };

/** True when the bytes are UTF-8 text without NUL bytes (what a CSV export is). */
function isPlainUtf8Text(bytes: Uint8Array): boolean {
  if (bytes.includes(0)) return false;
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(bytes);
    return true;
  } catch {
    return false;
  }
}

/**
 * What the file really is, judged from its bytes, never from its name or the browser's claim:
 * images and PDFs by their magic numbers (file-type); CSV has none, so a file named .csv is
 * accepted only when it is valid UTF-8 text with no NUL byte. `detected` names what was found
 * instead ("application/zip", "application/x-msdownload", "unknown binary", "text").
 */
export async function judgeContent(bytes: Uint8Array, fileName: string): Promise<ContentVerdict> {
  const found = await fileTypeFromBuffer(bytes);
  if (found && IMAGE_TYPES.has(found.mime))
    return { ok: true, kind: 'image', contentType: found.mime };
  if (found?.mime === 'application/pdf') return { ok: true, kind: 'pdf', contentType: found.mime };
  if (found) return { ok: false, detected: found.mime };
  const text = isPlainUtf8Text(bytes);
  if (text && /\.csv$/i.test(fileName)) return { ok: true, kind: 'csv', contentType: 'text/csv' };
  return {
    ok: false,
    detected: text ? 'plain text (only .csv files are accepted)' : 'unknown binary',
  };
}

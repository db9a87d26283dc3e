/**
 * The checks the panel makes before sending a file, so a person learns at once that a file is
 * too big or of a kind we do not keep. The API checks again from the content, which decides.
 */

/** 20 MB per file, as the API counts it (MiB). */
export const MAX_FILE_BYTES = 20 * 1024 * 1024;

/** What the picker offers; the API accepts these and judges the bytes. */
export const ACCEPTED_TYPES =
  '.jpg,.jpeg,.png,.webp,.heic,.heif,.pdf,.csv,image/jpeg,image/png,image/webp,image/heic,image/heif,application/pdf,text/csv';

const ACCEPTED_EXTENSIONS = /\.(jpe?g|png|webp|heic|heif|pdf|csv)$/i;

/** Sizes as people read them: "812 KB", "20.5 MB". */
export function sizeText(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${Math.round(bytes / 1024)} KB`;
  return `${(bytes / 1024 / 1024).toFixed(1)} MB`;
}

/** Why the file cannot be uploaded, in words; null when it may be sent. */
export function fileProblem(file: { name: string; size: number }): string | null {
  if (!ACCEPTED_EXTENSIONS.test(file.name))
    return `"${file.name}" is not a photo (JPEG, PNG, WebP, HEIC), PDF or CSV file.`;
  if (file.size > MAX_FILE_BYTES)
    return `"${file.name}" is larger than the 20 MB limit for one file.`;
  if (file.size === 0) return `"${file.name}" is empty.`;
  return null;
}

export type FileIcon = 'image' | 'picture_as_pdf' | 'table_view' | 'draft';

/** The icon for a stored file that has no thumbnail. */
export function fileIcon(contentType: string): FileIcon {
  if (contentType.startsWith('image/')) return 'image';
  if (contentType === 'application/pdf') return 'picture_as_pdf';
  if (contentType === 'text/csv') return 'table_view';
  return 'draft';
}

import { HttpClient, HttpContext, type HttpEvent } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { type Observable, firstValueFrom } from 'rxjs';
import { SHOW_ERROR_SNACKBAR } from '../shell/api-error-interceptor';

/** What a file can belong to. */
export type FileOwnerKind = 'job' | 'site' | 'customer';

/** One file as `GET /api/v1/files` lists it. */
export interface StoredFile {
  readonly id: string;
  readonly fileName: string;
  readonly contentType: string;
  readonly sizeBytes: number;
  readonly hasThumbnail: boolean;
  readonly uploadedByName?: string | null;
  /** ISO date-time. */
  readonly createdAt: string;
}

/**
 * The files endpoints. Uploads and deletes go without the global snackbar: the panel shows a
 * refusal (too big, wrong type) on the file's own row.
 */
@Injectable({ providedIn: 'root' })
export class FileApi {
  private readonly http = inject(HttpClient);
  private readonly quiet = new HttpContext().set(SHOW_ERROR_SNACKBAR, false);

  list(ownerKind: FileOwnerKind, ownerId: string): Promise<StoredFile[]> {
    return firstValueFrom(
      this.http.get<StoredFile[]>('/api/v1/files', { params: { ownerKind, ownerId } }),
    );
  }

  /** Uploads one file, reporting progress events (one request per file: one bar per file). */
  upload(
    ownerKind: FileOwnerKind,
    ownerId: string,
    file: File,
  ): Observable<HttpEvent<StoredFile[]>> {
    const body = new FormData();
    body.append('ownerKind', ownerKind);
    body.append('ownerId', ownerId);
    body.append('files', file, file.name);
    return this.http.post<StoredFile[]>('/api/v1/files', body, {
      reportProgress: true,
      observe: 'events',
      context: this.quiet,
    });
  }

  /** A short-lived link to the file or its thumbnail. */
  async link(fileId: string, variant: 'original' | 'thumbnail' = 'original'): Promise<string> {
    const res = await firstValueFrom(
      this.http.get<{ url: string }>(`/api/v1/files/${encodeURIComponent(fileId)}/link`, {
        params: { variant },
        context: this.quiet,
      }),
    );
    return res.url;
  }

  remove(fileId: string): Promise<unknown> {
    return firstValueFrom(
      this.http.delete(`/api/v1/files/${encodeURIComponent(fileId)}`, { context: this.quiet }),
    );
  }
}

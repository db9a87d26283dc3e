import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';

export type CountStatus = 'counting' | 'submitted' | 'posted' | 'cancelled';

/** A count in the list. */
export interface CountSummary {
  readonly id: string;
  readonly locationId: string;
  readonly locationName: string;
  readonly status: CountStatus;
  readonly scope: 'all' | 'chosen';
  readonly note: string;
  readonly startedAt: string;
  readonly postedAt: string | null;
  readonly netValueMinor: number | null;
  readonly grossValueMinor: number | null;
  readonly lineCount: number;
  readonly countedCount: number;
}

/** A line of the sheet; the figures after `countedAt` arrive only once the count is submitted. */
export interface CountLine {
  readonly id: string;
  readonly position: number;
  readonly productId: string;
  readonly sku: string;
  readonly productName: string;
  readonly batchCode: string | null;
  readonly expiresOn: string | null;
  readonly packSize: number;
  readonly decimals: number;
  readonly units: { unitOne: string; unitOther: string; packOne: string; packOther: string };
  readonly counted: number | null;
  readonly countedPacks: string | null;
  readonly countedAt: string | null;
  readonly expectedAtStart?: number;
  readonly movementsDuring?: number;
  readonly expected?: number;
  readonly variance?: number;
  readonly unitCostMinor?: number;
  readonly varianceValueMinor?: number;
  readonly expectedAtStartPacks?: string;
  readonly movementsDuringPacks?: string;
  readonly expectedPacks?: string;
  readonly variancePacks?: string;
  readonly reason?: string | null;
  readonly reasonNote?: string;
}

export interface Count extends Omit<CountSummary, 'lineCount' | 'countedCount'> {
  readonly approvedBy: string | null;
  readonly lines: readonly CountLine[];
  readonly variance: {
    netValueMinor: number;
    grossValueMinor: number;
    thresholdMinor: number;
    needsApproval: boolean;
  } | null;
}

export interface VarianceGroup {
  readonly key: string;
  readonly label: string;
  readonly counts: number;
  readonly lines: number;
  readonly linesWithVariance: number;
  readonly netQuantity: number | null;
  readonly netValueMinor: number;
  readonly grossValueMinor: number;
}

/** Why a line differs, in the words the review page shows. */
export const COUNT_REASONS: readonly { id: string; label: string }[] = [
  { id: 'miscount', label: 'Miscounted before' },
  { id: 'damaged', label: 'Damaged, thrown away' },
  { id: 'lost', label: 'Lost or missing' },
  { id: 'unrecorded_issue', label: 'Used on a job, not booked' },
  { id: 'unrecorded_receipt', label: 'Delivered, not booked' },
  { id: 'wrong_location', label: 'Booked to another place' },
  { id: 'other', label: 'Other (say in the note)' },
];

/** The stock counts API. */
@Injectable({ providedIn: 'root' })
export class CountsApi {
  private readonly http = inject(HttpClient);
  private readonly base = '/api/v1/stock/counts';

  list(status?: CountStatus): Observable<CountSummary[]> {
    const params = status ? new HttpParams().set('status', status) : undefined;
    return this.http.get<CountSummary[]>(this.base, { params });
  }
  start(body: { locationId: string; productIds: string[]; note: string }): Observable<Count> {
    return this.http.post<Count>(this.base, body);
  }
  get(id: string): Observable<Count> {
    return this.http.get<Count>(`${this.base}/${id}`);
  }
  enter(id: string, lines: { lineId: string; packs: number; units: number }[]): Observable<Count> {
    return this.http.put<Count>(`${this.base}/${id}/entries`, { lines });
  }
  reasons(
    id: string,
    lines: { lineId: string; reason: string; note: string }[],
  ): Observable<Count> {
    return this.http.put<Count>(`${this.base}/${id}/reasons`, { lines });
  }
  step(id: string, step: 'submit' | 'approve' | 'post' | 'cancel'): Observable<Count> {
    return this.http.post<Count>(`${this.base}/${id}/${step}`, {});
  }
  report(groupBy: 'product' | 'location' | 'month'): Observable<VarianceGroup[]> {
    return this.http.get<VarianceGroup[]>(`${this.base}/variance-report`, {
      params: new HttpParams().set('groupBy', groupBy),
    });
  }
}

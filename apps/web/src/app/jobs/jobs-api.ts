import { HttpClient, HttpContext, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { Stage } from '@latchwork/jobs-domain';
import { SHOW_ERROR_SNACKBAR } from '../shell/api-error-interceptor';
import { filterParams, type JobFilters, type TableQuery } from './job-filters';

/** A job as a board card and a table row show it. Money is integer minor units. */
export interface JobRow {
  readonly id: string;
  readonly reference: string;
  readonly title: string;
  readonly stage: Stage;
  readonly valueEstimateMinor: number | null;
  readonly ownerUserId: string | null;
  readonly ownerName: string | null;
  readonly customerId: string;
  readonly customerName: string;
  readonly siteId: string | null;
  readonly siteName: string | null;
  readonly enquiryOn: string;
  readonly stageChangedAt: string;
  readonly installStartOn: string | null;
  /** Set for a job on hold: the only stage it may go back to. */
  readonly heldFrom: Stage | null;
}

export interface BoardColumn {
  readonly stage: Stage;
  readonly label: string;
  readonly count: number;
  readonly valueMinor: number;
  readonly unvalued: number;
  readonly cards: JobRow[];
  readonly more: boolean;
}

export interface Totals {
  readonly count: number;
  readonly valueMinor: number;
  readonly unvalued: number;
}

export interface Board {
  readonly columns: BoardColumn[];
  readonly openPipeline: Totals;
  readonly all: Totals;
}

/** `GET /api/v1/jobs/:jobId`: the job page's header. */
export interface JobHeader {
  readonly id: string;
  readonly reference: string;
  readonly title: string;
  readonly stage: Stage;
  readonly heldFrom: Stage | null;
  readonly nextStages: Stage[];
  readonly stageChangedAt: string;
  readonly lostReason: string | null;
  readonly valueEstimateMinor: number | null;
  readonly source: string;
  readonly customer: { id: string; name: string };
  readonly site: {
    id: string;
    name: string;
    addressLines: string[];
    postcode: string | null;
  } | null;
  readonly owner: { id: string; name: string } | null;
  readonly enquiryOn: string;
  readonly surveyAt: string | null;
  readonly quoteDueOn: string | null;
  readonly installStartOn: string | null;
  readonly installEndOn: string | null;
}

/** What the New job form sends. */
export interface JobInput {
  readonly title: string;
  readonly customerId: string;
  readonly siteId: string | null;
  readonly valueEstimateMinor: number | null;
  readonly source: string;
  readonly ownerUserId: string | null;
  readonly enquiryOn?: string;
  readonly surveyAt: string | null;
  readonly quoteDueOn: string | null;
  readonly installStartOn: string | null;
  readonly installEndOn: string | null;
}

export interface TimelineEvent {
  readonly id: string;
  readonly kind: string;
  readonly summary: string;
  readonly createdAt: string;
  readonly actorName: string | null;
  readonly noteBody: string | null;
}

export interface StageMove {
  readonly id: string;
  readonly from: Stage | null;
  readonly to: Stage;
  readonly reason: string | null;
  readonly movedAt: string;
  readonly movedBy: { id: string; name: string } | null;
}

export interface TeamMember {
  readonly id: string;
  readonly name: string;
  readonly email: string;
  readonly role: string;
}

export interface CustomerOption {
  readonly id: string;
  readonly name: string;
  readonly postcode?: string | null;
}

export interface SiteOption {
  readonly id: string;
  readonly name: string;
  readonly addressLines: string[];
  readonly postcode: string | null;
}

/**
 * The job endpoints. Moves, notes and forms go without the global error snackbar: the board
 * snaps a card back with the refusal, forms show it beside the fields.
 */
@Injectable({ providedIn: 'root' })
export class JobsApi {
  private readonly http = inject(HttpClient);
  private readonly quiet = { context: new HttpContext().set(SHOW_ERROR_SNACKBAR, false) };

  board(filters: JobFilters): Observable<Board> {
    return this.http.get<Board>('/api/v1/jobs/board', { params: filterParams(filters) });
  }

  /** More cards of one board column, after the first `offset`. */
  column(
    filters: JobFilters,
    stage: Stage,
    offset: number,
  ): Observable<{ cards: JobRow[]; more: boolean }> {
    const params = filterParams(filters).set('column', stage).set('offset', offset);
    return this.http.get<{ cards: JobRow[]; more: boolean }>('/api/v1/jobs/board', { params });
  }

  list(query: TableQuery): Observable<{ items: JobRow[]; total: number }> {
    return this.http.get<{ items: JobRow[]; total: number }>('/api/v1/jobs', {
      params: this.tableParams(query),
    });
  }

  /** The CSV export's address for the same filters and sort (a plain download link). */
  exportHref(query: TableQuery): string {
    const params = this.tableParams(query).delete('page').delete('pageSize');
    return `/api/v1/jobs/export.csv?${params.toString()}`;
  }

  get(jobId: string): Observable<JobHeader> {
    return this.http.get<JobHeader>(`/api/v1/jobs/${encodeURIComponent(jobId)}`);
  }

  create(input: JobInput): Observable<JobHeader> {
    return this.http.post<JobHeader>('/api/v1/jobs', input, this.quiet);
  }

  move(jobId: string, to: Stage, reason?: string | null): Observable<JobHeader> {
    return this.http.post<JobHeader>(
      `/api/v1/jobs/${encodeURIComponent(jobId)}/moves`,
      { to, reason: reason || null },
      this.quiet,
    );
  }

  history(jobId: string): Observable<StageMove[]> {
    return this.http.get<StageMove[]>(`/api/v1/jobs/${encodeURIComponent(jobId)}/stage-history`);
  }

  timeline(
    jobId: string,
    before?: string,
  ): Observable<{ items: TimelineEvent[]; nextBefore: string | null }> {
    let params = new HttpParams().set('limit', 30);
    if (before) params = params.set('before', before);
    return this.http.get<{ items: TimelineEvent[]; nextBefore: string | null }>(
      `/api/v1/jobs/${encodeURIComponent(jobId)}/timeline`,
      { params },
    );
  }

  addNote(jobId: string, body: string): Observable<{ id: string; emailed: { name: string }[] }> {
    return this.http.post<{ id: string; emailed: { name: string }[] }>(
      `/api/v1/jobs/${encodeURIComponent(jobId)}/notes`,
      { body },
      this.quiet,
    );
  }

  team(): Observable<TeamMember[]> {
    return this.http.get<TeamMember[]>('/api/v1/jobs/team');
  }

  /** Customers by name, for the job form (the customers feature's list endpoint). */
  customers(q: string): Observable<{ items: CustomerOption[]; total: number }> {
    const params = new HttpParams().set('q', q).set('pageSize', 20);
    return this.http.get<{ items: CustomerOption[]; total: number }>('/api/v1/customers', {
      params,
    });
  }

  sites(customerId: string): Observable<SiteOption[]> {
    return this.http.get<SiteOption[]>(`/api/v1/customers/${encodeURIComponent(customerId)}/sites`);
  }

  private tableParams(query: TableQuery): HttpParams {
    return filterParams(query)
      .set('sort', query.sort)
      .set('dir', query.dir)
      .set('page', query.page)
      .set('pageSize', query.pageSize);
  }
}

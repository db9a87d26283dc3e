import { HttpClient, HttpContext, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import { SHOW_ERROR_SNACKBAR } from '../shell/api-error-interceptor';

export type CustomerKind = 'business' | 'homeowner';
export type CustomerSort = 'name' | 'createdAt' | 'postcode';

/** One row of `GET /api/v1/customers`. */
export interface CustomerRow {
  readonly id: string;
  readonly kind: CustomerKind;
  readonly name: string;
  readonly email: string | null;
  readonly phone: string | null;
  readonly postcode: string | null;
  readonly externalRef: string | null;
  readonly siteCount: number;
  readonly openJobCount: number;
}

export interface CustomerQuery {
  readonly q: string;
  readonly sort: CustomerSort;
  readonly dir: 'asc' | 'desc';
  readonly page: number;
  readonly pageSize: number;
}

export interface Contact {
  readonly id?: string;
  readonly name: string;
  readonly role: string;
  readonly email: string | null;
  readonly phone: string | null;
}

/** A site in full, as the customer page and the site form use it. */
export interface Site {
  readonly id: string;
  readonly customerId: string;
  readonly name: string;
  readonly externalRef: string | null;
  readonly addressLines: readonly string[];
  readonly postcode: string | null;
  readonly accessNotes: string;
  readonly parking: string;
  readonly floorType: string;
  readonly openingHours: string;
}
export type SiteInput = Omit<Site, 'id' | 'customerId'>;

export interface JobSummary {
  readonly id: string;
  readonly reference: string;
  readonly title: string;
  readonly stage: string;
  /** Integer minor units of the firm's currency. */
  readonly valueEstimateMinor: number | null;
  readonly stageChangedAt: string;
}

/** What a person edits of a customer. Money is integer minor units (pence for GBP). */
export interface CustomerInput {
  readonly kind: CustomerKind;
  readonly name: string;
  readonly externalRef: string | null;
  readonly email: string | null;
  readonly phone: string | null;
  readonly billingAddressLines: readonly string[];
  readonly postcode: string | null;
  readonly paymentTermsDays: number | null;
  readonly creditLimitMinor: number | null;
  readonly notes: string;
  readonly contacts: readonly Contact[];
}

/** `GET /api/v1/customers/:customerId`. */
export interface CustomerDetail extends CustomerInput {
  readonly id: string;
  readonly createdAt: string;
  readonly sites: readonly Site[];
  readonly jobs: readonly JobSummary[];
  /** Filled by the invoicing work; null until then. */
  readonly balance: null;
  readonly currency: string;
  readonly minorDigits: number;
}

export type ImportKind = 'customers' | 'sites';
export type RowAction = 'create' | 'update' | 'unchanged' | 'error';
export interface ImportCounts {
  readonly create: number;
  readonly update: number;
  readonly unchanged: number;
  readonly error: number;
}
export interface RowError {
  readonly row: number;
  readonly column: string;
  readonly message: string;
}
/** `POST /api/v1/customers/import/preview`: what the import would do; nothing is written. */
export interface ImportPreview {
  readonly kind: ImportKind;
  readonly rows: readonly { row: number; action: RowAction; label: string }[];
  readonly errors: readonly RowError[];
  readonly counts: ImportCounts;
  readonly unknownColumns: readonly string[];
}

/**
 * The customer, site and import endpoints. Writes go without the global error snackbar: the
 * forms show a refusal beside the fields it is about.
 */
@Injectable({ providedIn: 'root' })
export class CustomersApi {
  private readonly http = inject(HttpClient);
  private readonly quiet = { context: new HttpContext().set(SHOW_ERROR_SNACKBAR, false) };

  list(query: CustomerQuery): Observable<{ items: CustomerRow[]; total: number }> {
    let params = new HttpParams()
      .set('sort', query.sort)
      .set('dir', query.dir)
      .set('page', query.page)
      .set('pageSize', query.pageSize);
    if (query.q) params = params.set('q', query.q);
    return this.http.get<{ items: CustomerRow[]; total: number }>('/api/v1/customers', {
      params,
    });
  }

  get(id: string): Observable<CustomerDetail> {
    return this.http.get<CustomerDetail>(`/api/v1/customers/${encodeURIComponent(id)}`);
  }

  create(input: CustomerInput): Observable<CustomerDetail> {
    return this.http.post<CustomerDetail>('/api/v1/customers', input, this.quiet);
  }

  update(id: string, input: Partial<CustomerInput>): Observable<CustomerDetail> {
    return this.http.patch<CustomerDetail>(
      `/api/v1/customers/${encodeURIComponent(id)}`,
      input,
      this.quiet,
    );
  }

  remove(id: string): Observable<unknown> {
    return this.http.delete(`/api/v1/customers/${encodeURIComponent(id)}`, this.quiet);
  }

  addSite(customerId: string, input: SiteInput): Observable<Site> {
    return this.http.post<Site>(
      `/api/v1/customers/${encodeURIComponent(customerId)}/sites`,
      input,
      this.quiet,
    );
  }

  updateSite(siteId: string, input: SiteInput): Observable<Site> {
    return this.http.patch<Site>(`/api/v1/sites/${encodeURIComponent(siteId)}`, input, this.quiet);
  }

  removeSite(siteId: string): Observable<unknown> {
    return this.http.delete(`/api/v1/sites/${encodeURIComponent(siteId)}`, this.quiet);
  }

  previewImport(kind: ImportKind, csv: string): Observable<ImportPreview> {
    return this.http.post<ImportPreview>(
      '/api/v1/customers/import/preview',
      { kind, csv },
      this.quiet,
    );
  }

  commitImport(kind: ImportKind, csv: string): Observable<{ counts: ImportCounts }> {
    return this.http.post<{ counts: ImportCounts }>(
      '/api/v1/customers/import/commit',
      { kind, csv },
      this.quiet,
    );
  }
}

import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';

/** Money is integer minor units and quantities integer steps of the stock unit, as the API sends them. */
export interface Product {
  readonly id: string;
  readonly sku: string;
  readonly name: string;
  readonly kind: string;
  readonly attributes: Readonly<Record<string, string | number>>;
  readonly unitOne: string;
  readonly unitOther: string;
  readonly decimals: number;
  readonly packOne: string;
  readonly packOther: string;
  readonly packSize: number;
  readonly kitComponents: readonly { productId: string; quantity: number }[];
  readonly costMinor: number;
  readonly priceMinor: number;
  readonly taxRateBp: number;
  readonly preferredSupplierId: string | null;
  readonly preferredSupplierName: string | null;
  readonly serviceLevelBp: number | null;
  readonly leadTimeDays: number | null;
  readonly minOrderQuantity: number | null;
  readonly roundToPacks: boolean;
  readonly shelfLifeDays: number | null;
  readonly active: boolean;
  readonly onHand: number;
  readonly reserved: number;
  readonly available: number;
  readonly valueMinor: number;
  readonly averageUnitCostMinor: number | null;
}
export type ProductInput = Omit<
  Product,
  | 'id'
  | 'onHand'
  | 'reserved'
  | 'available'
  | 'valueMinor'
  | 'averageUnitCostMinor'
  | 'preferredSupplierName'
>;

export interface Supplier {
  readonly id: string;
  readonly name: string;
  readonly email: string | null;
  readonly phone: string | null;
  readonly leadTimeDays: number;
  readonly active: boolean;
  readonly contacts: readonly { name: string; role?: string; email?: string; phone?: string }[];
}

export interface StockLocation {
  readonly id: string;
  readonly name: string;
  readonly kind: 'warehouse' | 'van' | 'site';
  readonly jobId: string | null;
  readonly active: boolean;
  readonly lines: number;
}

export interface Batch {
  readonly id: string;
  readonly productId: string;
  readonly code: string;
  readonly receivedOn: string;
  readonly expiresOn: string | null;
  readonly sku: string;
  readonly productName: string;
  readonly onHand: number;
  /** On hand in packs: "3 boxes + 5 tiles". */
  readonly onHandPacks: string;
}

export interface Balance {
  readonly productId: string;
  readonly batchId: string | null;
  readonly locationId: string;
  readonly sku: string;
  readonly productName: string;
  readonly kind: string;
  readonly batchCode: string | null;
  readonly expiresOn: string | null;
  readonly locationName: string;
  readonly quantity: number;
  readonly packs: string;
}

export type MovementKind =
  | 'receipt'
  | 'transfer'
  | 'issue'
  | 'return'
  | 'adjustment'
  | 'count_correction'
  | 'write_off';

export interface Movement {
  readonly id: string;
  readonly seq: number;
  readonly kind: MovementKind;
  readonly productId: string;
  readonly batchCode: string | null;
  readonly fromLocationName: string | null;
  readonly toLocationName: string | null;
  readonly quantity: number;
  readonly packs: string;
  readonly unitCostMinor: number;
  readonly valueMinor: number;
  readonly jobId: string | null;
  readonly jobReference: string | null;
  readonly writeOffReason: string | null;
  readonly reversesMovementId: string | null;
  readonly overrideReason: string | null;
  readonly note: string;
  readonly userName: string | null;
  readonly at: string;
  readonly runningQuantity: number | null;
}

export interface MovementInput {
  readonly kind: MovementKind;
  readonly productId: string;
  readonly batchId?: string | null;
  readonly newBatch?: { code: string; receivedOn: string; expiresOn?: string | null };
  readonly fromLocationId?: string | null;
  readonly toLocationId?: string | null;
  readonly quantity: number;
  readonly unitCostMinor?: number;
  readonly jobId?: string | null;
  readonly writeOffReason?: 'damaged' | 'expired' | 'lost' | null;
  readonly note?: string;
  readonly overrideExpiredReason?: string | null;
}

export interface Reservation {
  readonly id: string;
  readonly productId: string;
  readonly sku: string;
  readonly productName: string;
  readonly batchCode: string | null;
  readonly expiresOn: string | null;
  readonly quantity: number;
  readonly issuedQuantity: number;
  readonly remaining: number;
  readonly packs: string;
  readonly status: string;
}

export interface ReservationOffer {
  readonly warning: null | 'mixed-batches' | 'short';
  readonly shortBy: number;
  readonly available: number;
  readonly picks: readonly { code: string; quantity: number; expiry: string | null }[];
}

export interface PickingItem {
  readonly reservation: Reservation;
  readonly lines: readonly {
    code: string;
    quantity: number;
    packs: string;
    expiry: string | null;
    locationName: string;
  }[];
  readonly short: number;
  readonly skippedExpired: readonly string[];
}

export interface MaterialLine {
  readonly kind: string;
  readonly colour: string | null;
  readonly estimated: number | null;
  readonly reserved: number;
  readonly issued: number;
  readonly returned: number;
  readonly used: number;
  /** The same figures in packs ("2 boxes + 10 tiles") where the line's products share one. */
  readonly packs: Readonly<
    Record<'reserved' | 'issued' | 'returned' | 'used', string> & { estimated: string | null }
  >;
}

export interface JobMaterials {
  readonly job: { id: string; reference: string; title: string };
  readonly estimateSource: 'takeoff' | 'none';
  readonly lines: readonly MaterialLine[];
  readonly products: readonly {
    productId: string;
    sku: string;
    name: string;
    issued: number;
    returned: number;
    used: number;
    usedPacks: string;
    costMinor: number;
  }[];
  readonly totalCostMinor: number;
}

export interface ValueReport {
  readonly totalValueMinor: number;
  readonly byLocation: readonly { locationId: string; locationName: string; valueMinor: number }[];
  readonly byKind: readonly { kind: string; valueMinor: number }[];
}

export interface ExpiringBatch {
  readonly batchId: string;
  readonly code: string;
  readonly expiresOn: string;
  readonly sku: string;
  readonly productName: string;
  readonly locationName: string;
  readonly quantity: number;
  readonly daysLeft: number;
  readonly expired: boolean;
  readonly valueMinor: number;
}

export interface ImportPreview {
  readonly summary: { create: number; update: number; error: number };
  readonly rows: readonly { row: number; sku: string | null; action: string }[];
  readonly problems: readonly { row: number; column: string; message: string }[];
}

const params = (q: Record<string, string | number | null | undefined>) => {
  let p = new HttpParams();
  for (const [k, v] of Object.entries(q))
    if (v !== null && v !== undefined && v !== '') p = p.set(k, v);
  return p;
};

/** The stock API, one method per call the stock pages make. */
@Injectable({ providedIn: 'root' })
export class StockApi {
  private readonly http = inject(HttpClient);
  private readonly base = '/api/v1/stock';

  products(q: { q?: string; kind?: string; active?: string; offset?: number }) {
    return this.http.get<{ items: Product[]; total: number }>(`${this.base}/products`, {
      params: params({ ...q, limit: 100 }),
    });
  }
  product(id: string): Observable<Product> {
    return this.http.get<Product>(`${this.base}/products/${id}`);
  }
  saveProduct(body: ProductInput, id?: string): Observable<Product> {
    return id
      ? this.http.put<Product>(`${this.base}/products/${id}`, body)
      : this.http.post<Product>(`${this.base}/products`, body);
  }
  previewImport(csv: string) {
    return this.http.post<ImportPreview>(`${this.base}/products/import/preview`, { csv });
  }
  confirmImport(csv: string) {
    return this.http.post<{ summary: ImportPreview['summary'] }>(`${this.base}/products/import`, {
      csv,
    });
  }
  suppliers(): Observable<Supplier[]> {
    return this.http.get<Supplier[]>(`${this.base}/suppliers`);
  }
  saveSupplier(body: object): Observable<Supplier> {
    return this.http.post<Supplier>(`${this.base}/suppliers`, body);
  }
  locations(): Observable<StockLocation[]> {
    return this.http.get<StockLocation[]>(`${this.base}/locations`);
  }
  addLocation(body: { name: string; kind: string }): Observable<StockLocation> {
    return this.http.post<StockLocation>(`${this.base}/locations`, body);
  }
  batches(q: { productId?: string; expiringWithinDays?: number }): Observable<Batch[]> {
    return this.http.get<Batch[]>(`${this.base}/batches`, { params: params(q) });
  }
  addBatch(body: object): Observable<Batch> {
    return this.http.post<Batch>(`${this.base}/batches`, body);
  }
  balances(q: { productId?: string; locationId?: string; kind?: string }): Observable<Balance[]> {
    return this.http.get<Balance[]>(`${this.base}/balances`, { params: params(q) });
  }
  movements(q: { productId?: string; jobId?: string; beforeSeq?: number }): Observable<Movement[]> {
    return this.http.get<Movement[]>(`${this.base}/movements`, { params: params(q) });
  }
  book(body: MovementInput): Observable<Movement> {
    return this.http.post<Movement>(`${this.base}/movements`, body);
  }
  reverse(id: string, note: string): Observable<Movement> {
    return this.http.post<Movement>(`${this.base}/movements/${id}/reverse`, { note });
  }
  reservations(jobId: string): Observable<Reservation[]> {
    return this.http.get<Reservation[]>(`${this.base}/reservations`, { params: params({ jobId }) });
  }
  offer(body: object): Observable<ReservationOffer> {
    return this.http.post<ReservationOffer>(`${this.base}/reservations/offer`, body);
  }
  reserve(body: object) {
    return this.http.post<{ reservations: Reservation[] }>(`${this.base}/reservations`, body);
  }
  release(id: string) {
    return this.http.post<Reservation>(`${this.base}/reservations/${id}/release`, {});
  }
  issueReserved(id: string) {
    return this.http.post<Movement[]>(`${this.base}/reservations/${id}/issue`, {});
  }
  pickingList(jobId: string) {
    return this.http.get<{ items: PickingItem[] }>(`${this.base}/jobs/${jobId}/picking-list`);
  }
  materials(jobId: string): Observable<JobMaterials> {
    return this.http.get<JobMaterials>(`${this.base}/jobs/${jobId}/materials`);
  }
  /** One job's reference and title (the jobs API's header), to name a job given by id. */
  job(id: string) {
    return this.http.get<{ reference: string; title: string }>(`/api/v1/jobs/${id}`);
  }
  /** Jobs to pick from (the jobs API's list, searched by reference or title). */
  jobs(q: string) {
    return this.http.get<{ items: { id: string; reference: string; title: string }[] }>(
      '/api/v1/jobs',
      { params: params({ q, pageSize: 20 }) },
    );
  }
  valueReport(): Observable<ValueReport> {
    return this.http.get<ValueReport>(`${this.base}/reports/value`);
  }
  expiring(days?: number) {
    return this.http.get<{ days: number; batches: ExpiringBatch[] }>(
      `${this.base}/reports/expiring`,
      {
        params: params({ days }),
      },
    );
  }
}

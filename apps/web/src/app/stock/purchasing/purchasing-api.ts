import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';

export type OrderStatus = 'draft' | 'sent' | 'part_received' | 'received' | 'cancelled';

/** Plain words for the order statuses. */
export const ORDER_STATUS: Readonly<Record<OrderStatus, string>> = {
  draft: 'Draft',
  sent: 'Sent',
  part_received: 'Part received',
  received: 'Received',
  cancelled: 'Cancelled',
};

export interface OrderSummary {
  readonly id: string;
  readonly reference: string;
  readonly status: OrderStatus;
  readonly source: 'manual' | 'reorder';
  readonly supplierName: string;
  readonly deliveryLocationName: string | null;
  readonly expectedOn: string | null;
  readonly createdAt: string;
  readonly lineCount: number;
}

export interface OrderLine {
  readonly id: string;
  readonly productId: string;
  readonly sku: string;
  readonly productName: string;
  readonly packSize: number;
  readonly units: { unitOne: string; unitOther: string; packOne: string; packOther: string };
  readonly quantity: number;
  readonly quantityPacks: string;
  readonly unitCostMinor: number;
  readonly lineTotalMinor: number;
  readonly receivedQuantity: number;
  readonly receivedPacks: string;
  readonly damagedQuantity: number;
  readonly damagedPacks: string;
  readonly outstanding: number;
  readonly outstandingPacks: string;
  readonly note: string;
}

export interface Order
  extends Omit<OrderSummary, 'supplierName' | 'deliveryLocationName' | 'lineCount'> {
  readonly supplierId: string;
  readonly deliveryLocationId: string | null;
  readonly notes: string;
  readonly sentAt: string | null;
  readonly sentTo: string | null;
  readonly cancelReason: string | null;
  readonly supplier: { id: string; name: string; email: string | null };
  readonly deliveryLocation: { id: string; name: string } | null;
  readonly lines: readonly OrderLine[];
  readonly totals: { netMinor: number; taxMinor: number; grossMinor: number };
  readonly receipts: readonly {
    id: string;
    receivedOn: string;
    locationName: string;
    receivedByName: string | null;
    lines: {
      purchaseOrderLineId: string;
      batchCode: string | null;
      expiresOn: string | null;
      quantity: number;
      packs: string;
      damagedQuantity: number;
      damagedPacks: string;
    }[];
  }[];
}

export interface OrderInput {
  supplierId: string;
  deliveryLocationId: string | null;
  expectedOn: string | null;
  notes: string;
  lines: { productId: string; packs: number; units: number; unitCostMinor?: number }[];
}

export interface GoodsInLine {
  purchaseOrderLineId: string;
  packs: number;
  units: number;
  damaged: number;
  batchCode?: string;
  expiresOn?: string;
  unitCostMinor?: number;
}

export interface Suggestion {
  readonly productId: string;
  readonly sku: string;
  readonly name: string;
  readonly supplierName: string | null;
  readonly onHand: number;
  readonly onOrder: number;
  readonly reserved: number;
  readonly reorderPoint: number;
  readonly quantity: number;
  readonly packs: number;
  readonly blocked: 'no-supplier' | 'on-open-order' | 'no-cost' | null;
  readonly reasons: readonly { code: string; message: string }[];
}

export interface ReorderResult {
  readonly today: string;
  readonly suggestions: readonly Suggestion[];
  readonly created: readonly { id: string; reference: string; lines: number }[];
}

/** Purchase orders, goods in and the reorder run. */
@Injectable({ providedIn: 'root' })
export class PurchasingApi {
  private readonly http = inject(HttpClient);
  private readonly base = '/api/v1/stock/purchase-orders';

  list(status?: string): Observable<OrderSummary[]> {
    const params = status ? new HttpParams().set('status', status) : undefined;
    return this.http.get<OrderSummary[]>(this.base, { params });
  }
  get(id: string): Observable<Order> {
    return this.http.get<Order>(`${this.base}/${id}`);
  }
  create(body: OrderInput): Observable<Order> {
    return this.http.post<Order>(this.base, body);
  }
  send(id: string, body: { to?: string; message: string }): Observable<Order> {
    return this.http.post<Order>(`${this.base}/${id}/send`, body);
  }
  cancel(id: string, reason: string): Observable<Order> {
    return this.http.post<Order>(`${this.base}/${id}/cancel`, { reason });
  }
  receive(
    id: string,
    body: { receivedOn?: string; note: string; lines: GoodsInLine[] },
  ): Observable<Order> {
    return this.http.post<Order>(`${this.base}/${id}/receipts`, body);
  }
  pdfUrl(id: string): string {
    return `${this.base}/${id}/pdf`;
  }
  suggestions(): Observable<ReorderResult> {
    return this.http.get<ReorderResult>('/api/v1/stock/reorder/suggestions');
  }
  runReorder(): Observable<ReorderResult> {
    return this.http.post<ReorderResult>('/api/v1/stock/reorder/run', {});
  }
}

import { openStockPage, type StockPageUnderTest } from '../stock-spec-setup';
import { PoPage } from './po-page';
import type { Order } from './purchasing-api';

const URL = '/api/v1/stock/purchase-orders/po-1';

/** A sent order for 5 boxes of 20 tiles, nothing in yet; `change` adjusts it. */
function order(change: Partial<Order> = {}): Order {
  return {
    id: 'po-1',
    reference: 'PO-12',
    status: 'sent',
    source: 'manual',
    expectedOn: null,
    createdAt: '2026-12-01T08:00:00Z',
    supplierId: 's-1',
    deliveryLocationId: 'yard',
    notes: '',
    sentAt: '2026-12-01T09:00:00Z',
    sentTo: 'orders@harrowgate-polymers.test',
    cancelReason: null,
    supplier: { id: 's-1', name: 'Harrowgate Polymers Ltd', email: null },
    deliveryLocation: { id: 'yard', name: 'Tannery Yard warehouse' },
    lines: [
      {
        id: 'line-1',
        productId: 'p-1',
        sku: 'KS-7-GRA',
        productName: 'Keystep 7 mm, Graphite',
        packSize: 20,
        units: { unitOne: 'tile', unitOther: 'tiles', packOne: 'box', packOther: 'boxes' },
        quantity: 100,
        quantityPacks: '5 boxes',
        unitCostMinor: 298,
        lineTotalMinor: 29800,
        receivedQuantity: 0,
        receivedPacks: '0 tiles',
        damagedQuantity: 0,
        damagedPacks: '0 tiles',
        outstanding: 100,
        outstandingPacks: '5 boxes',
        note: '',
      },
    ],
    totals: { netMinor: 29800, taxMinor: 5960, grossMinor: 35760 },
    receipts: [],
    ...change,
  };
}

describe('PoPage goods in', () => {
  let t: StockPageUnderTest;

  beforeEach(async () => {
    t = await openStockPage('orders/:purchaseOrderId', PoPage, '/orders/po-1');
    t.backend.expectOne(URL).flush(order());
    await t.settle();
  });

  afterEach(() => t.backend.verify());

  const batchRows = () => [...t.el().querySelectorAll<HTMLElement>('.goods')];
  const field = (row: HTMLElement, name: string) =>
    row.querySelector<HTMLInputElement>(`input[formcontrolname="${name}"]`);
  const button = (text: string) =>
    [...t.el().querySelectorAll<HTMLButtonElement>('button')].find((b) =>
      b.textContent?.includes(text),
    );

  async function enterTwoBatches(): Promise<void> {
    button('Another batch')?.click();
    await t.settle();
    const [a, b] = batchRows();
    t.type(field(a, 'packs'), '3');
    t.type(field(a, 'batchCode'), 'A-1');
    t.type(field(b, 'packs'), '2');
    t.type(field(b, 'batchCode'), 'B-1');
    t.type(field(b, 'expiresOn'), '2027-05-31');
    await t.settle();
    button('Book goods in')?.click();
    await t.settle();
  }

  it('books one line of the order in two batches, each with its own code', async () => {
    await enterTwoBatches();
    const req = t.backend.expectOne(`${URL}/receipts`);
    expect(req.request.body.lines).toEqual([
      { purchaseOrderLineId: 'line-1', packs: 3, units: 0, damaged: 0, batchCode: 'A-1' },
      {
        purchaseOrderLineId: 'line-1',
        packs: 2,
        units: 0,
        damaged: 0,
        batchCode: 'B-1',
        expiresOn: '2027-05-31',
      },
    ]);
    req.flush(
      order({
        status: 'received',
        lines: [
          {
            ...order().lines[0],
            receivedQuantity: 100,
            receivedPacks: '5 boxes',
            outstanding: 0,
          },
        ],
        receipts: [
          {
            id: 'g-1',
            receivedOn: '2026-12-02',
            locationName: 'Tannery Yard warehouse',
            receivedByName: 'Colm Brannagh',
            lines: ['A-1', 'B-1'].map((batchCode, i) => ({
              purchaseOrderLineId: 'line-1',
              batchCode,
              expiresOn: i ? '2027-05-31' : null,
              quantity: i ? 40 : 60,
              packs: i ? '2 boxes' : '3 boxes',
              damagedQuantity: 0,
              damagedPacks: '0 tiles',
            })),
          },
        ],
      }),
    );
    await t.settle();
    const cells = [...t.el().querySelectorAll('tbody tr:first-child td')].map((c) =>
      c.textContent?.trim(),
    );
    expect(cells.slice(4)).toEqual(['5 boxes', '—', '—']);
    expect(batchRows()).toHaveLength(0);
    expect(t.el().querySelector('li')?.textContent?.trim()).toBe(
      '2026-12-02 at Tannery Yard warehouse by Colm Brannagh: 3 boxes batch A-1; 2 boxes batch B-1 use by 2027-05-31',
    );
  });

  it("puts the API's refusal of the second batch on that batch's field", async () => {
    await enterTwoBatches();
    t.backend.expectOne(`${URL}/receipts`).flush(
      {
        error: {
          code: 'validation',
          message: 'Check the fields.',
          details: { problems: [{ path: 'lines.1.batchCode', message: 'is already used' }] },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await t.settle();
    const [a, b] = batchRows();
    expect(a.querySelector('mat-error')).toBeNull();
    expect(b.querySelector('mat-error')?.textContent).toContain('is already used');
  });

  it('takes a batch row away again, and offers no removal of the first', async () => {
    button('Another batch')?.click();
    await t.settle();
    expect(batchRows()).toHaveLength(2);
    expect(batchRows()[0].querySelector('[aria-label^="Remove"]')).toBeNull();
    batchRows()[1].querySelector<HTMLButtonElement>('[aria-label="Remove batch 2"]')?.click();
    await t.settle();
    expect(batchRows()).toHaveLength(1);
  });
});

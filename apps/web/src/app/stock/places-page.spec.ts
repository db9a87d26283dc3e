import { PlacesPage } from './places-page';
import { openStockPage, type StockPageUnderTest } from './stock-spec-setup';
import type { StockLocation } from './stock-api';

const PLACES: StockLocation[] = [
  { id: 'l1', name: 'Van 1 (WX19 KFL)', kind: 'van', jobId: null, active: true, lines: 13 },
  {
    id: 'l2',
    name: 'Tannery Yard warehouse',
    kind: 'warehouse',
    jobId: null,
    active: true,
    lines: 32,
  },
];

describe('PlacesPage', () => {
  let t: StockPageUnderTest;

  beforeEach(async () => {
    t = await openStockPage('places', PlacesPage, '/places');
    t.backend.expectOne('/api/v1/stock/locations').flush(PLACES);
    t.backend.expectOne('/api/v1/stock/batches').flush([
      {
        id: 'b1',
        productId: 'p1',
        code: 'GRA-260705-1',
        receivedOn: '2026-07-05',
        expiresOn: null,
        sku: 'KS-7-GRA',
        productName: 'Keystep 7 mm, Graphite',
        onHand: 65,
        onHandPacks: '3 boxes + 5 tiles',
      },
    ]);
    t.backend.expectOne((r) => r.url === '/api/v1/stock/products').flush({ items: [], total: 0 });
    await t.settle();
  });

  afterEach(() => t.backend.verify());

  const cells = (row: number) =>
    [
      ...(t.el().querySelector('table')?.querySelectorAll(`tbody tr:nth-child(${row}) td`) ?? []),
    ].map((c) => c.textContent?.trim());

  it('names the kinds in words and shows batches in packs', () => {
    expect(cells(1)).toEqual(['Van 1 (WX19 KFL)', 'Van', '13']);
    expect(cells(2)).toEqual(['Tannery Yard warehouse', 'Warehouse', '32']);
    const batch = [...t.el().querySelectorAll('tbody')][1].textContent;
    expect(batch).toContain('3 boxes + 5 tiles');
  });

  it('empties the new location form without calling the emptied name missing', async () => {
    const form = t.el().querySelector<HTMLFormElement>('form[aria-label="Add a location"]');
    t.type(form?.querySelector('input'), 'Van 3 (WX24 KFL)');
    await t.settle();
    form?.querySelector<HTMLButtonElement>('button[type="submit"]')?.click();
    await t.settle();
    const req = t.backend.expectOne((r) => r.method === 'POST');
    expect(req.request.body).toEqual({ name: 'Van 3 (WX24 KFL)', kind: 'warehouse' });
    req.flush({ id: 'l3' });
    t.backend.expectOne('/api/v1/stock/locations').flush(PLACES);
    t.backend.expectOne('/api/v1/stock/batches').flush([]);
    await t.settle();
    expect(form?.querySelector('input')?.value).toBe('');
    expect(form?.querySelector('mat-error')).toBeNull();
  });
});

import { MovementFormPage } from './movement-form-page';
import { openStockPage, type StockPageUnderTest } from './stock-spec-setup';

const PRODUCT = {
  id: 'p1',
  sku: 'KS-7-GRA',
  name: 'Keystep 7 mm, Graphite',
  decimals: 0,
  packSize: 20,
  unitOne: 'tile',
  unitOther: 'tiles',
  packOne: 'box',
  packOther: 'boxes',
};

describe('MovementFormPage opened from a job', () => {
  let t: StockPageUnderTest;

  beforeEach(async () => {
    t = await openStockPage('book', MovementFormPage, '/book?jobId=job-9&productId=p1');
    t.backend.expectOne('/api/v1/stock/locations').flush([]);
    t.backend.expectOne('/api/v1/stock/products/p1').flush(PRODUCT);
    t.backend.expectOne((r) => r.url === '/api/v1/stock/batches').flush([]);
    // Not among the first jobs the search lists: the page asks for it by id.
    t.backend.expectOne('/api/v1/jobs/job-9').flush({ reference: 'J-0107', title: 'Gym floor' });
    await t.settle(300);
    t.backend.expectOne((r) => r.url === '/api/v1/stock/products').flush({ items: [PRODUCT] });
    t.backend
      .expectOne((r) => r.url === '/api/v1/jobs')
      .flush({
        items: [{ id: 'job-1', reference: 'J-0001', title: 'Garage' }],
      });
    await t.settle();
  });

  afterEach(() => t.backend.verify());

  const jobSelect = () =>
    [...t.el().querySelectorAll('mat-form-field')].find(
      (f) => f.querySelector('mat-label')?.textContent?.trim() === 'Job',
    ) as HTMLElement;

  it('names the job it was opened for', () => {
    expect(jobSelect().textContent).toContain('J-0107 · Gym floor');
  });

  it('after booking, says what was booked and leaves the emptied quantity unflagged', async () => {
    const quantity = t.el().querySelector<HTMLInputElement>('input[formcontrolname="quantity"]');
    t.type(quantity, '50');
    await t.settle();
    t.el().querySelector<HTMLButtonElement>('button[type="submit"]')?.click();
    const req = t.backend.expectOne((r) => r.method === 'POST');
    expect(req.request.body).toMatchObject({ kind: 'issue', jobId: 'job-9', quantity: 50 });
    req.flush({ id: 'm1', productId: 'p1', packs: '2 boxes + 10 tiles' });
    await t.settle();
    t.backend.expectOne('/api/v1/stock/products/p1').flush(PRODUCT);
    t.backend.expectOne((r) => r.url === '/api/v1/stock/batches').flush([]);
    await t.settle();
    expect(t.el().querySelector('[role="status"]')?.textContent).toContain(
      'Booked: 2 boxes + 10 tiles.',
    );
    expect(quantity?.value).toBe('');
    expect(t.el().querySelector('mat-error')).toBeNull();
    expect(jobSelect().textContent).toContain('J-0107');
  });
});

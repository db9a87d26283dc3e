import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { ImportPreview as Preview } from '../customers-api';
import { CustomerImportPage } from './customer-import-page';
import { ImportPreview, SHOWN_ROWS } from './import-preview';

const WITH_ERRORS: Preview = {
  kind: 'customers',
  rows: [
    { row: 2, action: 'create', label: 'Greyling Motors' },
    { row: 3, action: 'error', label: '' },
    { row: 4, action: 'unchanged', label: 'Hana Vickery' },
  ],
  errors: [
    { row: 3, column: 'Name', message: 'Required.' },
    { row: 3, column: 'Email', message: '"bad-address" is not an e-mail address.' },
  ],
  counts: { create: 1, update: 0, unchanged: 1, error: 1 },
  unknownColumns: ['Fax'],
};

describe('ImportPreview', () => {
  let fixture: ComponentFixture<ImportPreview>;
  const el = () => fixture.nativeElement as HTMLElement;

  async function show(preview: Preview): Promise<void> {
    fixture = TestBed.createComponent(ImportPreview);
    fixture.componentRef.setInput('preview', preview);
    await fixture.whenStable();
  }

  it('shows the counts, the unknown columns and every error by row, column and reason', async () => {
    await show(WITH_ERRORS);
    const counts = [...el().querySelectorAll('.counts li')].map((li) =>
      li.textContent?.replace(/\s+/g, ' ').trim(),
    );
    expect(counts).toEqual(['1 new', '0 to update', '1 unchanged', '1 with errors']);
    expect(el().querySelector('.note')?.textContent).toContain('Fax');
    const errorRows = [...el().querySelectorAll('.errors tbody tr')].map((tr) =>
      [...tr.querySelectorAll('td')].map((td) => td.textContent?.trim()),
    );
    expect(errorRows).toEqual([
      ['3', 'Name', 'Required.'],
      ['3', 'Email', '"bad-address" is not an e-mail address.'],
    ]);
    const plan = el().querySelector('.plan tbody tr.action-error')?.textContent ?? '';
    expect(plan).toContain('Name: Required.');
  });

  it('lists a long file in part, and says how many rows are not listed', async () => {
    const rows = Array.from({ length: SHOWN_ROWS + 5 }, (_, i) => ({
      row: i + 2,
      action: 'create' as const,
      label: `Customer ${i}`,
    }));
    await show({
      ...WITH_ERRORS,
      rows,
      errors: [],
      counts: { create: rows.length, update: 0, unchanged: 0, error: 0 },
    });
    expect(el().querySelectorAll('.plan tbody tr')).toHaveLength(SHOWN_ROWS);
    expect(el().textContent).toContain('…and 5 more rows');
    expect(el().querySelector('.errors')).toBeNull();
  });
});

describe('CustomerImportPage', () => {
  let backend: HttpTestingController;
  let fixture: ComponentFixture<CustomerImportPage>;
  const el = () => fixture.nativeElement as HTMLElement;
  const confirmButton = () =>
    [...el().querySelectorAll<HTMLButtonElement>('.confirm button')].find((b) =>
      b.textContent?.includes('Import'),
    );

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(CustomerImportPage);
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  /** Lets the page's async handlers finish and the view catch up. */
  async function settle(): Promise<void> {
    for (let turn = 0; turn < 3; turn++) {
      await new Promise((resolve) => setTimeout(resolve));
      await fixture.whenStable();
    }
  }

  async function choose(csv: string): Promise<void> {
    const input = el().querySelector<HTMLInputElement>('input[type="file"]');
    const file = new File([csv], 'customers.csv', { type: 'text/csv' });
    Object.defineProperty(input, 'files', { value: [file], configurable: true });
    input?.dispatchEvent(new Event('change'));
    await new Promise((resolve) => setTimeout(resolve, 20));
  }

  it('previews a chosen file, keeps Confirm disabled while errors exist, and writes nothing', async () => {
    await choose('Name,Email\n,bad-address\n');
    const req = backend.expectOne('/api/v1/customers/import/preview');
    expect(req.request.body).toEqual({ kind: 'customers', csv: 'Name,Email\n,bad-address\n' });
    req.flush(WITH_ERRORS);
    await settle();
    expect(confirmButton()?.disabled).toBe(true);
    expect(el().textContent).toContain('Fix the rows with errors before importing.');
    confirmButton()?.click();
    backend.expectNone('/api/v1/customers/import/commit');
  });

  it('imports on Confirm when the preview is clean, and shows the result', async () => {
    await choose('Name\nGreyling Motors\n');
    backend.expectOne('/api/v1/customers/import/preview').flush({
      ...WITH_ERRORS,
      rows: [WITH_ERRORS.rows[0]],
      errors: [],
      counts: { create: 1, update: 0, unchanged: 0, error: 0 },
    });
    await settle();
    expect(confirmButton()?.disabled).toBe(false);
    confirmButton()?.click();
    const commit = backend.expectOne('/api/v1/customers/import/commit');
    expect(commit.request.body.kind).toBe('customers');
    commit.flush({ kind: 'customers', counts: { create: 1, update: 0, unchanged: 0, error: 0 } });
    await settle();
    expect(el().querySelector('.done')?.textContent).toContain('Imported: 1 new, 0 updated');
  });
});

import { provideHttpClient } from '@angular/common/http';
import {
  HttpTestingController,
  provideHttpClientTesting,
  TestRequest,
} from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { convertToParamMap, provideRouter, Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { meOf } from '../session/me-fixture';
import { Session } from '../session/session.store';
import { CustomerListPage, queryFromParams } from './customer-list-page';
import { CustomerRow } from './customers-api';

const ROWS: CustomerRow[] = [
  {
    id: 'c1',
    kind: 'business',
    name: 'Greyling Motors',
    email: 'office@greyling-motors.test',
    phone: '01632 960123',
    postcode: 'WX3 1AB',
    externalRef: 'K-C0001',
    siteCount: 2,
    openJobCount: 1,
  },
  {
    id: 'c2',
    kind: 'homeowner',
    name: 'Hana Vickery',
    email: null,
    phone: null,
    postcode: 'WX5 2DE',
    externalRef: null,
    siteCount: 1,
    openJobCount: 0,
  },
];

describe('queryFromParams', () => {
  it('reads the list state from the address and falls back on odd values', () => {
    expect(
      queryFromParams(
        convertToParamMap({ q: 'gym', sort: 'postcode', dir: 'desc', page: '3', pageSize: '50' }),
      ),
    ).toEqual({ q: 'gym', sort: 'postcode', dir: 'desc', page: 3, pageSize: 50 });
    expect(
      queryFromParams(convertToParamMap({ sort: 'colour', dir: 'up', page: '-2', pageSize: '7' })),
    ).toEqual({ q: '', sort: 'name', dir: 'asc', page: 1, pageSize: 25 });
  });
});

describe('CustomerListPage', () => {
  let backend: HttpTestingController;
  let harness: RouterTestingHarness;

  async function start(permissions: string[], url = '/customers'): Promise<void> {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([{ path: 'customers', component: CustomerListPage }]),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    const session = TestBed.inject(Session);
    const loaded = session.load();
    backend.expectOne('/api/v1/me').flush(meOf('estimator', permissions));
    await loaded;
    harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(url, CustomerListPage);
  }

  afterEach(() => backend.verify());

  const el = () => harness.routeNativeElement as HTMLElement;
  const listRequest = (): TestRequest => backend.expectOne((r) => r.url === '/api/v1/customers');
  async function settle(ms = 0): Promise<void> {
    await new Promise((resolve) => setTimeout(resolve, ms));
    await harness.fixture.whenStable();
  }

  it('asks the server for the page in the address and shows the rows', async () => {
    await start(['customers:read', 'customers:write'], '/customers?sort=postcode&dir=desc&page=2');
    const req = listRequest();
    expect(req.request.params.get('sort')).toBe('postcode');
    expect(req.request.params.get('dir')).toBe('desc');
    expect(req.request.params.get('page')).toBe('2');
    expect(req.request.params.has('q')).toBe(false);
    req.flush({ items: ROWS, total: 27 });
    await settle();
    const rows = [...el().querySelectorAll('tr.mat-mdc-row')].map((r) => r.textContent);
    expect(rows).toHaveLength(2);
    expect(rows[0]).toContain('Greyling Motors');
    expect(el().querySelector('a.name')?.getAttribute('href')).toBe('/customers/c1');
    expect(el().querySelector('.mat-mdc-paginator-range-label')?.textContent).toContain(
      '26 – 27 of 27',
    );
  });

  it('searches on the server once typing pauses, and keeps the search in the address', async () => {
    await start(['customers:read']);
    listRequest().flush({ items: ROWS, total: 2 });
    await settle();
    const input = el().querySelector<HTMLInputElement>('input[type="search"]');
    if (!input) throw new Error('no search field');
    for (const text of ['g', 'gy', 'gym']) {
      input.value = text;
      input.dispatchEvent(new Event('input'));
    }
    await settle(400);
    const req = listRequest();
    expect(req.request.params.get('q')).toBe('gym');
    expect(req.request.params.get('page')).toBe('1');
    req.flush({ items: [], total: 0 });
    await settle();
    expect(TestBed.inject(Router).url).toBe('/customers?q=gym');
    expect(el().querySelector('.empty')?.textContent).toContain('No customer matches “gym”');
  });

  it('offers New customer and Import to writers only', async () => {
    await start(['customers:read']);
    listRequest().flush({ items: [], total: 0 });
    await settle();
    expect(el().querySelector('a[href="/customers/new"]')).toBeNull();
    expect(el().querySelector('.empty')?.textContent).toContain('No customers yet');
    expect(el().querySelector('.empty')?.textContent).toContain('The owner or an estimator');
  });

  it('shows writers the way in when the list is empty', async () => {
    await start(['customers:read', 'customers:write']);
    listRequest().flush({ items: [], total: 0 });
    await settle();
    expect(el().querySelectorAll('a[href="/customers/new"]').length).toBe(2);
    expect(el().querySelectorAll('a[href="/customers/import"]').length).toBe(2);
  });
});

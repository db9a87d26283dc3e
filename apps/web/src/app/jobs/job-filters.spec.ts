import { convertToParamMap } from '@angular/router';
import {
  filterParams,
  filterQueryParams,
  filtersFromParams,
  hasFilters,
  NO_FILTERS,
  tableQueryFromParams,
} from './job-filters';

const OWNER = '2f1c3c9e-8d5a-4a53-9a61-2b0d6e0f6a11';
const CUSTOMER = '7b0e9a4c-1d2e-4f3a-8b5c-6d7e8f9a0b1c';

describe('job filters in the address', () => {
  it('reads every filter the address holds', () => {
    const f = filtersFromParams(
      convertToParamMap({
        owner: `${OWNER},none`,
        customer: CUSTOMER,
        customerName: 'Greyling Motors',
        stage: 'quoted,won',
        dateField: 'installStartOn',
        from: '2026-01-01',
        to: '2026-03-31',
        minValue: '150000',
        maxValue: '900000',
        q: ' gym ',
      }),
    );
    expect(f).toEqual({
      owners: [OWNER, 'none'],
      customer: CUSTOMER,
      customerName: 'Greyling Motors',
      stages: ['quoted', 'won'],
      dateField: 'installStartOn',
      from: '2026-01-01',
      to: '2026-03-31',
      minValue: 150000,
      maxValue: 900000,
      q: 'gym',
    });
  });

  it('leaves out what is malformed instead of sending it on', () => {
    const f = filtersFromParams(
      convertToParamMap({
        owner: 'bob,none',
        customer: 'x',
        customerName: 'Ghost',
        stage: 'quoted,finished',
        dateField: 'birthday',
        from: '2026-02-30',
        minValue: '12.5',
        maxValue: '-1',
      }),
    );
    expect(f).toEqual({ ...NO_FILTERS, owners: ['none'], stages: ['quoted'] });
  });

  it('writes filters back so that reading them again gives the same filters', () => {
    const f = {
      ...NO_FILTERS,
      owners: [OWNER],
      customer: CUSTOMER,
      customerName: 'Greyling Motors',
      dateField: 'quoteDueOn' as const,
      to: '2026-06-30',
      minValue: 0,
    };
    const params = filterQueryParams(f);
    const kept = Object.fromEntries(
      Object.entries(params)
        .filter(([, v]) => v !== null)
        .map(([k, v]) => [k, String(v)]),
    );
    expect(kept).toEqual({
      owner: OWNER,
      customer: CUSTOMER,
      customerName: 'Greyling Motors',
      dateField: 'quoteDueOn',
      to: '2026-06-30',
      minValue: '0',
    });
    expect(filtersFromParams(convertToParamMap(kept))).toEqual(f);
  });

  it('gives the API the filters without the display-only customer name', () => {
    const f = { ...NO_FILTERS, customer: CUSTOMER, customerName: 'Greyling Motors', q: 'ramp' };
    expect(filterParams(f).toString()).toBe(`customer=${CUSTOMER}&q=ramp`);
  });

  it('clears to a plain address, and knows when a view is filtered', () => {
    expect(Object.values(filterQueryParams(NO_FILTERS)).every((v) => v === null)).toBe(true);
    expect(hasFilters(NO_FILTERS)).toBe(false);
    expect(hasFilters({ ...NO_FILTERS, maxValue: 5000 })).toBe(true);
    // A date field alone narrows nothing.
    expect(hasFilters({ ...NO_FILTERS, dateField: 'surveyAt' })).toBe(false);
  });

  it('reads the table’s sort and page with defaults for odd values', () => {
    expect(
      tableQueryFromParams(
        convertToParamMap({ sort: 'value', dir: 'asc', page: '3', pageSize: '50' }),
      ),
    ).toMatchObject({ sort: 'value', dir: 'asc', page: 3, pageSize: 50 });
    expect(
      tableQueryFromParams(
        convertToParamMap({ sort: 'colour', dir: 'up', page: '0', pageSize: '7' }),
      ),
    ).toMatchObject({ sort: 'reference', dir: 'desc', page: 1, pageSize: 25 });
  });
});

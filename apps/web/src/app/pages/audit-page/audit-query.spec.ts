import { convertToParamMap } from '@angular/router';
import {
  PAGE_SIZE,
  actionLabel,
  apiQuery,
  describeDetail,
  filtersFromQuery,
  queryFromFilters,
} from './audit-query';

describe('audit log filters', () => {
  it('reads the filters from the address and drops malformed days', () => {
    const query = convertToParamMap({ action: 'sign-in', from: '2026-11-03', to: 'yesterday' });
    expect(filtersFromQuery(query)).toEqual({
      action: 'sign-in',
      userId: '',
      from: '2026-11-03',
      to: '',
    });
  });

  it('leaves empty filters out of the address', () => {
    expect(queryFromFilters({ action: '', userId: 'u1', from: '', to: '2026-11-04' })).toEqual({
      action: null,
      userId: 'u1',
      from: null,
      to: '2026-11-04',
    });
  });

  it('asks the API for whole local days: from local midnight to the next local midnight', () => {
    const query = apiQuery({ action: '', userId: '', from: '2026-11-03', to: '2026-11-04' });
    expect(new Date(query['from']).getTime()).toBe(new Date(2026, 10, 3).getTime());
    expect(new Date(query['to']).getTime()).toBe(new Date(2026, 10, 5).getTime());
    expect(query['limit']).toBe(String(PAGE_SIZE));
    expect(query['before']).toBeUndefined();
  });

  it('pages with the last row’s time', () => {
    const query = apiQuery(
      { action: 'sign-out', userId: '', from: '', to: '' },
      '2026-11-03T10:00:00.000Z',
    );
    expect(query).toEqual({
      limit: String(PAGE_SIZE),
      action: 'sign-out',
      before: '2026-11-03T10:00:00.000Z',
    });
  });

  it('describes role and settings changes in one line', () => {
    expect(describeDetail({ from: 'estimator', to: 'owner' })).toBe('estimator → owner');
    expect(
      describeDetail({
        paymentTermsDays: { from: 30, to: 14 },
        currency: { from: 'GBP', to: 'EUR' },
      }),
    ).toBe('paymentTermsDays: 30 → 14; currency: GBP → EUR');
    expect(describeDetail({ role: 'stores' })).toBe('role: stores');
    expect(describeDetail(null)).toBe('');
  });

  it('names known actions and shows unknown ones as recorded', () => {
    expect(actionLabel('member-role-changed')).toBe('Changed a role');
    expect(actionLabel('something-new')).toBe('something-new');
  });
});

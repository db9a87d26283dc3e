import { HttpParams } from '@angular/common/http';
import type { ParamMap, Params } from '@angular/router';
import { isIsoDate, isStage, type Stage } from '@latchwork/jobs-domain';

/** The dates a job can be filtered on, as the API names them, with their labels. */
export const DATE_FIELDS = [
  { value: 'enquiryOn', label: 'Enquiry date' },
  { value: 'surveyAt', label: 'Survey date' },
  { value: 'quoteDueOn', label: 'Quote due' },
  { value: 'installStartOn', label: 'Install start' },
  { value: 'stageChangedAt', label: 'Last move' },
] as const;
export type DateField = (typeof DATE_FIELDS)[number]['value'];

/**
 * The filters the board and the table share, kept in the address bar so that a view can be
 * bookmarked, shared and survives switching between board and table. Money is integer minor
 * units, as the API takes it; `none` in `owners` means jobs nobody owns.
 */
export interface JobFilters {
  readonly owners: readonly string[];
  readonly customer: string | null;
  /** Only to show the chosen customer's name without asking the server again. */
  readonly customerName: string | null;
  readonly stages: readonly Stage[];
  readonly dateField: DateField;
  readonly from: string | null;
  readonly to: string | null;
  readonly minValue: number | null;
  readonly maxValue: number | null;
  readonly q: string;
}

export const SORTS = [
  'reference',
  'title',
  'customer',
  'stage',
  'value',
  'owner',
  'enquiryOn',
  'stageChangedAt',
  'installStartOn',
] as const;
export type JobSort = (typeof SORTS)[number];
export const PAGE_SIZES = [10, 25, 50, 100];

export interface TableQuery extends JobFilters {
  readonly sort: JobSort;
  readonly dir: 'asc' | 'desc';
  readonly page: number;
  readonly pageSize: number;
}

export const NO_FILTERS: JobFilters = {
  owners: [],
  customer: null,
  customerName: null,
  stages: [],
  dateField: 'enquiryOn',
  from: null,
  to: null,
  minValue: null,
  maxValue: null,
  q: '',
};

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const list = (text: string | null) => (text ? text.split(',').filter(Boolean) : []);
const minor = (text: string | null) => {
  const n = text === null || text === '' ? Number.NaN : Number(text);
  return Number.isSafeInteger(n) && n >= 0 ? n : null;
};
const date = (text: string | null) => (text && isIsoDate(text) ? text : null);

/** The filters in the address; anything malformed is left out rather than sent on. */
export function filtersFromParams(p: ParamMap): JobFilters {
  const dateField = p.get('dateField');
  const customer = p.get('customer');
  return {
    owners: list(p.get('owner')).filter((o) => o === 'none' || UUID.test(o)),
    customer: customer && UUID.test(customer) ? customer : null,
    customerName: customer && UUID.test(customer) ? p.get('customerName') : null,
    stages: list(p.get('stage')).filter(isStage),
    dateField: DATE_FIELDS.some((f) => f.value === dateField)
      ? (dateField as DateField)
      : 'enquiryOn',
    from: date(p.get('from')),
    to: date(p.get('to')),
    minValue: minor(p.get('minValue')),
    maxValue: minor(p.get('maxValue')),
    q: (p.get('q') ?? '').trim().slice(0, 100),
  };
}

/** The table's state in the address: the filters plus sort and page. */
export function tableQueryFromParams(p: ParamMap): TableQuery {
  const sort = p.get('sort') as JobSort;
  const page = Number(p.get('page'));
  const size = Number(p.get('pageSize'));
  return {
    ...filtersFromParams(p),
    sort: SORTS.includes(sort) ? sort : 'reference',
    dir: p.get('dir') === 'asc' ? 'asc' : 'desc',
    page: Number.isInteger(page) && page > 0 ? page : 1,
    pageSize: PAGE_SIZES.includes(size) ? size : 25,
  };
}

/**
 * Query parameters for `router.navigate`: each filter as the address holds it, null where it
 * is the default, so that merging removes it and a plain view has a plain address.
 */
export function filterQueryParams(f: JobFilters): Params {
  return {
    owner: f.owners.length ? f.owners.join(',') : null,
    customer: f.customer,
    customerName: f.customer ? f.customerName : null,
    stage: f.stages.length ? f.stages.join(',') : null,
    dateField: f.dateField === 'enquiryOn' || (!f.from && !f.to) ? null : f.dateField,
    from: f.from,
    to: f.to,
    minValue: f.minValue,
    maxValue: f.maxValue,
    q: f.q || null,
  };
}

/** The filters as the API's query string (the same names; display-only ones left out). */
export function filterParams(f: JobFilters): HttpParams {
  let params = new HttpParams();
  for (const [key, value] of Object.entries(filterQueryParams(f)))
    if (value !== null && key !== 'customerName') params = params.set(key, String(value));
  return params;
}

/** True when any filter narrows the view (the empty state then offers to clear them). */
export function hasFilters(f: JobFilters): boolean {
  return Object.entries(filterQueryParams(f)).some(([, v]) => v !== null);
}

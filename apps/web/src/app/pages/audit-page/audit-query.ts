import { ParamMap, Params } from '@angular/router';

/** One row of `GET /api/v1/audit`. */
export interface AuditEntry {
  readonly id: string;
  /** ISO date-time. */
  readonly createdAt: string;
  readonly action: string;
  readonly subject: string | null;
  readonly detail: Readonly<Record<string, unknown>> | null;
  readonly ipAddress: string | null;
  readonly userId: string | null;
  readonly userName: string | null;
  readonly userEmail: string | null;
}

/** The audit actions the API records, with the words shown for each. */
export const AUDIT_ACTIONS: readonly { readonly value: string; readonly label: string }[] = [
  { value: 'sign-in', label: 'Signed in' },
  { value: 'sign-in-failed', label: 'Sign-in failed' },
  { value: 'sign-in-locked', label: 'Sign-in locked out' },
  { value: 'sign-out', label: 'Signed out' },
  { value: 'member-invited', label: 'Invited a member' },
  { value: 'member-role-changed', label: 'Changed a role' },
  { value: 'member-removed', label: 'Removed a member' },
  { value: 'settings-changed', label: 'Changed settings' },
  { value: 'customer-created', label: 'Added a customer' },
  { value: 'customer-updated', label: 'Changed a customer' },
  { value: 'customer-deleted', label: 'Deleted a customer' },
  { value: 'site-created', label: 'Added a site' },
  { value: 'site-updated', label: 'Changed a site' },
  { value: 'site-deleted', label: 'Deleted a site' },
  { value: 'customers-imported', label: 'Imported customers or sites' },
  { value: 'file-uploaded', label: 'Uploaded a file' },
  { value: 'file-deleted', label: 'Deleted a file' },
  { value: 'stock-expired-issued', label: 'Issued an expired batch' },
];

/** The filters, as kept in the page's address (dates are local calendar days, `YYYY-MM-DD`). */
export interface AuditFilters {
  readonly action: string;
  readonly userId: string;
  readonly from: string;
  readonly to: string;
}

/** Rows asked for per page; "Load older" asks for the next this many. */
export const PAGE_SIZE = 50;

const DAY = /^(\d{4})-(\d{2})-(\d{2})$/;

/** The filters in an address's query; anything malformed counts as no filter. */
export function filtersFromQuery(query: ParamMap): AuditFilters {
  const day = (name: string) =>
    DAY.test(query.get(name) ?? '') ? (query.get(name) as string) : '';
  return {
    action: query.get('action') ?? '',
    userId: query.get('userId') ?? '',
    from: day('from'),
    to: day('to'),
  };
}

/** The query to put in the address: empty filters are left out so the address stays short. */
export function queryFromFilters(filters: AuditFilters): Params {
  return Object.fromEntries(
    Object.entries(filters).map(([key, value]: [string, string]) => [key, value || null]),
  );
}

/**
 * The API's query for one page. Days are the person's local days: "from" starts at local
 * midnight and "to" includes the whole day, so it ends at the next local midnight.
 */
export function apiQuery(filters: AuditFilters, before?: string): Record<string, string> {
  const query: Record<string, string> = { limit: String(PAGE_SIZE) };
  if (filters.action) query['action'] = filters.action;
  if (filters.userId) query['userId'] = filters.userId;
  if (filters.from) query['from'] = localMidnight(filters.from, 0).toISOString();
  if (filters.to) query['to'] = localMidnight(filters.to, 1).toISOString();
  if (before) query['before'] = before;
  return query;
}

function localMidnight(day: string, plusDays: number): Date {
  const [, y, m, d] = DAY.exec(day) ?? [];
  return new Date(Number(y), Number(m) - 1, Number(d) + plusDays);
}

/** An action in words; an action this page does not know yet is shown as recorded. */
export function actionLabel(action: string): string {
  return AUDIT_ACTIONS.find((a) => a.value === action)?.label ?? action;
}

/**
 * The details of an entry in one line: a role change as "estimator → owner", a settings change
 * as each field's old and new value, anything else as its fields.
 */
export function describeDetail(detail: AuditEntry['detail']): string {
  if (!detail) return '';
  if (isChange(detail)) return `${show(detail.from)} → ${show(detail.to)}`;
  return Object.entries(detail)
    .map(([key, value]) => {
      if (isChange(value)) return `${key}: ${show(value.from)} → ${show(value.to)}`;
      return `${key}: ${show(value)}`;
    })
    .join('; ');
}

function isChange(value: unknown): value is { from: unknown; to: unknown } {
  return typeof value === 'object' && value !== null && 'from' in value && 'to' in value;
}

function show(value: unknown): string {
  if (typeof value === 'string') return value;
  return JSON.stringify(value);
}

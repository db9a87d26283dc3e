import { HttpErrorResponse } from '@angular/common/http';
import { apiErrorMessage } from '../../shell/api-error-interceptor';

/**
 * The body of `GET /api/v1/health`. Declared here until the shared API contract library exports
 * it; the guard below keeps the page honest if the two ever drift apart.
 */
export interface HealthReport {
  readonly status: 'up' | 'degraded';
  readonly checks: Readonly<Record<string, DependencyCheck>>;
}

/** One dependency's state as the API measured it. */
export interface DependencyCheck {
  readonly status: 'up' | 'down';
  readonly latencyMs?: number | null;
  readonly error?: string;
}

/** A dependency row ready to show. */
export interface CheckRow {
  readonly key: string;
  readonly label: string;
  readonly up: boolean;
  readonly latency: string;
  readonly error?: string;
}

/** What the status page shows: the API's report, or why it could not get one. */
export type StatusView =
  | { readonly kind: 'report'; readonly allUp: boolean; readonly rows: readonly CheckRow[] }
  | { readonly kind: 'unreachable'; readonly reason: string };

/** Plain names for the dependencies the API checks, in the order they are shown. */
const LABELS: Readonly<Record<string, string>> = {
  postgres: 'Database (PostgreSQL)',
  redis: 'Job queue (Redis)',
  objectStore: 'File store',
  mail: 'Outgoing mail',
  payments: 'Card payments',
};

/** Turns a successful response body into the view; a body of the wrong shape counts as a failure. */
export function viewOfReport(body: unknown): StatusView {
  if (!isHealthReport(body)) {
    return { kind: 'unreachable', reason: 'The API answered, but not with a health report.' };
  }
  const known = Object.keys(LABELS).filter((key) => key in body.checks);
  const extra = Object.keys(body.checks).filter((key) => !(key in LABELS));
  const rows = [...known, ...extra].map((key) => toRow(key, body.checks[key]));
  return { kind: 'report', allUp: body.status === 'up', rows };
}

/**
 * Turns a failed request into the view. A health endpoint may answer 503 with a full report
 * when something is down; that report is still worth showing.
 */
export function viewOfError(err: unknown): StatusView {
  if (err instanceof HttpErrorResponse) {
    if (isHealthReport(err.error)) {
      return viewOfReport(err.error);
    }
    return { kind: 'unreachable', reason: apiErrorMessage(err) };
  }
  return { kind: 'unreachable', reason: 'The health check failed unexpectedly.' };
}

function toRow(key: string, check: DependencyCheck): CheckRow {
  const latency =
    typeof check.latencyMs === 'number' ? `${Math.round(check.latencyMs)} ms` : 'no answer';
  return {
    key,
    label: LABELS[key] ?? key,
    up: check.status === 'up',
    latency,
    ...(check.error ? { error: check.error } : {}),
  };
}

function isHealthReport(body: unknown): body is HealthReport {
  if (typeof body !== 'object' || body === null) {
    return false;
  }
  const { status, checks } = body as Partial<HealthReport>;
  return (
    (status === 'up' || status === 'degraded') &&
    typeof checks === 'object' &&
    checks !== null &&
    Object.values(checks).every(isDependencyCheck)
  );
}

function isDependencyCheck(value: unknown): value is DependencyCheck {
  const status = (value as Partial<DependencyCheck> | null)?.status;
  return status === 'up' || status === 'down';
}

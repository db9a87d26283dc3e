import { HttpErrorResponse } from '@angular/common/http';
import { viewOfError, viewOfReport } from './health-report';

const degraded = {
  status: 'degraded',
  checks: {
    payments: { status: 'up', latencyMs: 3.4 },
    postgres: { status: 'up', latencyMs: 1.6 },
    search: { status: 'up', latencyMs: 9 },
    redis: { status: 'down', latencyMs: null, error: 'connect ECONNREFUSED 127.0.0.1:63799' },
  },
};

describe('viewOfReport', () => {
  it('lists known dependencies in a fixed order, then any the page does not know yet', () => {
    const view = viewOfReport(degraded);
    expect(view.kind).toBe('report');
    if (view.kind !== 'report') return;
    expect(view.allUp).toBe(false);
    expect(view.rows.map((row) => row.label)).toEqual([
      'Database (PostgreSQL)',
      'Job queue (Redis)',
      'Card payments',
      'search',
    ]);
  });

  it('rounds latency to whole milliseconds and keeps the reason a dependency is down', () => {
    const view = viewOfReport(degraded);
    if (view.kind !== 'report') throw new Error('expected a report');
    expect(view.rows[0]).toEqual({
      key: 'postgres',
      label: 'Database (PostgreSQL)',
      up: true,
      latency: '2 ms',
    });
    expect(view.rows[1]).toEqual({
      key: 'redis',
      label: 'Job queue (Redis)',
      up: false,
      latency: 'no answer',
      error: 'connect ECONNREFUSED 127.0.0.1:63799',
    });
  });

  it('treats a body of another shape as a failure rather than showing nonsense', () => {
    expect(viewOfReport('<html></html>').kind).toBe('unreachable');
    expect(viewOfReport({ status: 'fine', checks: {} }).kind).toBe('unreachable');
    expect(viewOfReport({ status: 'up', checks: { redis: { ok: true } } }).kind).toBe(
      'unreachable',
    );
  });
});

describe('viewOfError', () => {
  it('still shows the report when the API answers 503 with one', () => {
    const err = new HttpErrorResponse({ status: 503, statusText: 'Unavailable', error: degraded });
    expect(viewOfError(err)).toMatchObject({ kind: 'report', allUp: false });
  });

  it("explains a failure with the API's message or the HTTP status", () => {
    const apiError = new HttpErrorResponse({
      status: 500,
      error: { error: { code: 'internal', message: 'Something broke on our side.' } },
    });
    expect(viewOfError(apiError)).toEqual({
      kind: 'unreachable',
      reason: 'Something broke on our side.',
    });
    const gateway = new HttpErrorResponse({ status: 502, statusText: 'Bad Gateway', error: '' });
    expect(viewOfError(gateway)).toEqual({
      kind: 'unreachable',
      reason: 'The server answered 502 Bad Gateway. Please try again.',
    });
  });
});

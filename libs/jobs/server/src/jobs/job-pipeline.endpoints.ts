import { z } from 'zod';
import { withTenant } from '@latchwork/shared-db';
import { actorOf, endpoint, scopeOf, type EndpointDef } from '@latchwork/shared-server-kit';
import type { JobsDeps } from '../jobs-deps';
import { board, exportCsv, listJobs } from './job-pipeline';
import { listTeam } from './job.repository';
import { boardQuery, listQuery } from './job.schemas';

/**
 * The pipeline's views of many jobs: the table, the board and the CSV export (one set of
 * filters for all three), and the team to filter by and mention. Declared before
 * `/jobs/:jobId` so that their fixed paths are matched first.
 */
export function jobPipelineEndpoints(deps: JobsDeps): EndpointDef[] {
  return [
    endpoint({
      method: 'get',
      path: '/jobs',
      summary: 'Jobs after the filters, sorted and paged on the server',
      tags: ['jobs'],
      permission: 'jobs:read',
      query: listQuery,
      handle: ({ query, req }) =>
        withTenant(deps.db, scopeOf(req), (tx) => listJobs(tx, scopeOf(req), actorOf(req), query)),
    }),
    endpoint({
      method: 'get',
      path: '/jobs/board',
      summary: 'The pipeline board: per stage count, value and first cards (or more of one column)',
      tags: ['jobs'],
      permission: 'jobs:read',
      query: boardQuery,
      handle: ({ query, req }) =>
        withTenant(deps.db, scopeOf(req), (tx) => board(tx, scopeOf(req), actorOf(req), query)),
    }),
    endpoint({
      method: 'get',
      path: '/jobs/export.csv',
      summary: 'The job table after the same filters and sort, as CSV (RFC 4180, UTF-8 with BOM)',
      tags: ['jobs'],
      permission: 'jobs:read',
      query: listQuery,
      async handle({ query, req, res }) {
        const csv = await withTenant(deps.db, scopeOf(req), (tx) =>
          exportCsv(tx, scopeOf(req), actorOf(req), query),
        );
        const day = new Date().toISOString().slice(0, 10);
        res.type('text/csv; charset=utf-8').attachment(`jobs-${day}.csv`).send(csv);
      },
    }),
    endpoint({
      method: 'get',
      path: '/jobs/team',
      summary: 'The firm’s members, to pick a job’s owner and to @-mention in notes',
      tags: ['jobs'],
      permission: 'jobs:read',
      response: z.array(
        z.object({ id: z.string(), name: z.string(), email: z.string(), role: z.string() }),
      ),
      handle: ({ req }) => withTenant(deps.db, scopeOf(req), (tx) => listTeam(tx, scopeOf(req))),
    }),
  ];
}

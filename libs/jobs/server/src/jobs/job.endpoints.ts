import { withTenant } from '@latchwork/shared-db';
import { actorOf, endpoint, scopeOf, type EndpointDef } from '@latchwork/shared-server-kit';
import type { JobsDeps } from '../jobs-deps';
import { assertJobVisible } from './job-events';
import { moveJob } from './job-moves';
import { addNote, timeline } from './job-notes';
import { jobPipelineEndpoints } from './job-pipeline.endpoints';
import { createJob, jobHeader, stageHistory, updateJob } from './job.repository';
import {
  createJobBody,
  jobIdParams,
  moveBody,
  noteBody,
  timelineQuery,
  updateJobBody,
} from './job.schemas';

/**
 * Jobs: the pipeline views, then one job — create, change, move between stages, notes with
 * @-mentions, its timeline and stage history. Reading needs `jobs:read` (an installer sees
 * only the jobs they are on the crew of); changing needs `jobs:write`.
 */
export function jobEndpoints(deps: JobsDeps): EndpointDef[] {
  return [
    ...jobPipelineEndpoints(deps),
    endpoint({
      method: 'post',
      path: '/jobs',
      summary: 'Open a job at Enquiry with the firm’s next reference',
      tags: ['jobs'],
      permission: 'jobs:write',
      body: createJobBody,
      status: 201,
      async handle({ body, req }) {
        const scope = scopeOf(req);
        const actor = actorOf(req);
        return withTenant(deps.db, scope, async (tx) => {
          const { id } = await createJob(tx, scope, actor.userId, body);
          return jobHeader(tx, scope, actor, id);
        });
      },
    }),
    endpoint({
      method: 'get',
      path: '/jobs/:jobId',
      summary: 'One job’s header: customer, site, stage, value, owner, dates, next stages',
      tags: ['jobs'],
      permission: 'jobs:read',
      params: jobIdParams,
      handle: ({ params, req }) =>
        withTenant(deps.db, scopeOf(req), (tx) =>
          jobHeader(tx, scopeOf(req), actorOf(req), params.jobId),
        ),
    }),
    endpoint({
      method: 'patch',
      path: '/jobs/:jobId',
      summary: 'Change a job’s details (not its stage: see moves)',
      tags: ['jobs'],
      permission: 'jobs:write',
      params: jobIdParams,
      body: updateJobBody,
      handle: ({ params, body, req }) =>
        withTenant(deps.db, scopeOf(req), async (tx) => {
          await updateJob(tx, scopeOf(req), actorOf(req), params.jobId, body);
          return jobHeader(tx, scopeOf(req), actorOf(req), params.jobId);
        }),
    }),
    endpoint({
      method: 'post',
      path: '/jobs/:jobId/moves',
      summary: 'Move a job to another stage (409 with the reason when the stage table refuses)',
      tags: ['jobs'],
      permission: 'jobs:write',
      params: jobIdParams,
      body: moveBody,
      status: 201,
      handle: ({ params, body, req }) =>
        withTenant(deps.db, scopeOf(req), async (tx) => {
          await moveJob(tx, scopeOf(req), actorOf(req), params.jobId, body);
          return jobHeader(tx, scopeOf(req), actorOf(req), params.jobId);
        }),
    }),
    endpoint({
      method: 'get',
      path: '/jobs/:jobId/stage-history',
      summary: 'Every stage move of a job, oldest first: who, when, from, to, why',
      tags: ['jobs'],
      permission: 'jobs:read',
      params: jobIdParams,
      handle: ({ params, req }) =>
        withTenant(deps.db, scopeOf(req), async (tx) => {
          await assertJobVisible(tx, scopeOf(req), actorOf(req), params.jobId);
          return stageHistory(tx, scopeOf(req), params.jobId);
        }),
    }),
    endpoint({
      method: 'get',
      path: '/jobs/:jobId/timeline',
      summary: 'What happened to a job, newest first, a page at a time',
      tags: ['jobs'],
      permission: 'jobs:read',
      params: jobIdParams,
      query: timelineQuery,
      handle: ({ params, query, req }) =>
        withTenant(deps.db, scopeOf(req), (tx) =>
          timeline(tx, scopeOf(req), actorOf(req), params.jobId, query),
        ),
    }),
    endpoint({
      method: 'post',
      path: '/jobs/:jobId/notes',
      summary: 'Add a note; each member @-mentioned in it is e-mailed a link to the job',
      tags: ['jobs'],
      permission: 'jobs:write',
      params: jobIdParams,
      body: noteBody,
      status: 201,
      handle: ({ params, body, req }) =>
        addNote(deps, scopeOf(req), actorOf(req), params.jobId, body.body),
    }),
  ];
}

import { actorOf, endpoint, scopeOf, type EndpointDef } from '@latchwork/shared-server-kit';
import { KIND_LABELS, formatFigure, type ReadingKind } from '@latchwork/jobs-domain';
import { recordAudit, withTenant } from '@latchwork/shared-db';
import type { JobsDeps } from '../jobs-deps';
import { recordJobEvent } from '../jobs/job-events';
import { onVisibleJob } from './survey-context';
import {
  firmSlabLimits,
  limitsView,
  saveSlabLimitOverrides,
  slabLimitOverrides,
} from './slab-limits.repository';
import { deleteReading, recordReading } from './slab-readings.repository';
import { jobParams, limitOverrides, readingBody, readingParams } from './survey.schemas';

const tags = ['survey'];

const UNIT_TEXT: Record<string, string> = {
  relative_humidity: ' %',
  surface_regularity: ' mm',
  air_temperature: ' °C',
  slab_temperature: ' °C',
};

/** "Relative humidity 82 % at bay 2" for a timeline line. */
function readingText(r: { kind: string; value: number; unit: string | null; location: string }) {
  const unit =
    r.kind === 'moisture_emission'
      ? r.unit === 'g_per_m2_24h'
        ? ' g/m²/24 h'
        : ' lb/1000 ft²/24 h'
      : (UNIT_TEXT[r.kind] ?? '');
  const at = r.location ? ` at ${r.location}` : '';
  return `${KIND_LABELS[r.kind as ReadingKind]} ${formatFigure(r.value)}${unit}${at}`;
}

/** Slab readings of a job, and the firm's slab limits they are judged by. */
export function readingEndpoints(deps: JobsDeps): EndpointDef[] {
  return [
    endpoint({
      method: 'post',
      path: '/jobs/:jobId/survey/readings',
      summary: 'Record a slab reading; it is judged pass / warn / fail against the firm’s limits',
      tags,
      permission: 'jobs:write',
      status: 201,
      params: jobParams,
      body: readingBody,
      handle: ({ params, body, req }) =>
        onVisibleJob(deps, req, params.jobId, async ({ tx, scope, actor }) => {
          const limits = await firmSlabLimits(tx, scope);
          const saved = await recordReading(tx, scope, params.jobId, body, limits, actor.userId);
          await recordJobEvent(tx, scope, {
            jobId: params.jobId,
            kind: 'reading-recorded',
            summary: `${readingText(saved)}: ${saved.status}`,
            detail: { readingId: saved.id, status: saved.status },
            actorUserId: actor.userId,
          });
          return saved;
        }),
    }),
    endpoint({
      method: 'delete',
      path: '/jobs/:jobId/survey/readings/:readingId',
      summary: 'Remove a reading recorded by mistake',
      tags,
      permission: 'jobs:write',
      params: readingParams,
      handle: ({ params, req }) =>
        onVisibleJob(deps, req, params.jobId, async ({ tx, scope, actor }) => {
          const gone = await deleteReading(tx, scope, params.jobId, params.readingId);
          await recordJobEvent(tx, scope, {
            jobId: params.jobId,
            kind: 'reading-removed',
            summary: `Reading removed: ${readingText({ ...gone, unit: null })}`,
            detail: { readingId: gone.id },
            actorUserId: actor.userId,
          });
          return { id: gone.id };
        }),
    }),
    endpoint({
      method: 'get',
      path: '/survey/limits',
      summary: 'Slab limits: the defaults with their sources, the firm’s overrides, the result',
      tags,
      permission: 'jobs:read',
      handle: async ({ req }) => {
        const scope = scopeOf(req);
        return limitsView(await withTenant(deps.db, scope, (tx) => slabLimitOverrides(tx, scope)));
      },
    }),
    endpoint({
      method: 'put',
      path: '/survey/limits',
      summary: 'Replace the firm’s own slab limits (kinds left out use the defaults)',
      tags,
      permission: 'settings:write',
      body: limitOverrides,
      async handle({ body, req }) {
        const scope = scopeOf(req);
        const actor = actorOf(req);
        await withTenant(deps.db, scope, async (tx) => {
          await saveSlabLimitOverrides(tx, scope, body, actor.userId);
          await recordAudit(tx, scope, {
            userId: actor.userId,
            action: 'settings-changed',
            subject: 'slab limits',
            detail: { overrides: body },
            ipAddress: req.ip,
          });
        });
        return limitsView(body);
      },
    }),
  ];
}

import { endpoint, type EndpointDef } from '@latchwork/shared-server-kit';
import { GOVERNING_NOTE, evaluateReading, surveyWarnings } from '@latchwork/jobs-domain';
import { takeoffInput } from '@latchwork/takeoff-server';
import type { TakeoffInput } from '@latchwork/takeoff';
import type { JobsDeps } from '../jobs-deps';
import { recordJobEvent } from '../jobs/job-events';
import { readingEndpoints } from './reading.endpoints';
import { onVisibleJob } from './survey-context';
import { firmSlabLimits } from './slab-limits.repository';
import { asSlabReading, listReadings } from './slab-readings.repository';
import { addArea, findSurvey, listAreas, renameArea, saveSurvey } from './survey.repository';
import { areaBody, areaParams, jobParams, surveyDetails, versionParams } from './survey.schemas';
import {
  findArea,
  getVersion,
  latestVersions,
  listVersions,
  saveVersion,
} from './takeoff-versions';

const tags = ['survey'];

/**
 * The site survey of a job: details, areas with their takeoff versions, slab readings and the
 * warnings they raise; the firm's slab limits. Every route checks the job is visible first.
 */
export function surveyEndpoints(deps: JobsDeps): EndpointDef[] {
  return [
    endpoint({
      method: 'get',
      path: '/jobs/:jobId/survey',
      summary: 'The job’s survey: details, areas with their latest takeoff, readings, warnings',
      tags,
      permission: 'jobs:read',
      params: jobParams,
      handle: ({ params, req }) =>
        onVisibleJob(deps, req, params.jobId, async ({ tx, scope }) => {
          const survey = await findSurvey(tx, scope, params.jobId);
          const areas = await listAreas(tx, scope, params.jobId);
          const latest = new Map(
            (await latestVersions(tx, scope, params.jobId)).map((v) => [v.areaId, v]),
          );
          const limits = await firmSlabLimits(tx, scope);
          const readings = await listReadings(tx, scope, params.jobId);
          return {
            jobId: params.jobId,
            survey: survey ?? null,
            areas: areas.map((a) => {
              const v = latest.get(a.id);
              return {
                ...a,
                latest: v
                  ? { version: v.version, summary: v.summary, createdAt: v.createdAt }
                  : null,
              };
            }),
            // Judged by today's limits, so the table agrees with the warnings; the verdict
            // given when the reading was recorded stays alongside.
            readings: readings.map(({ status, message, source, ...r }) => {
              const now = evaluateReading(asSlabReading(r), limits);
              return {
                ...r,
                status: now.status,
                message: now.message,
                source: now.source,
                recorded: { status, message, source },
              };
            }),
            limits,
            // The same warnings surveyWarningsForJob gives the quote, from the rows read above.
            surveyWarnings: surveyWarnings(readings.map(asSlabReading), limits),
            caution: GOVERNING_NOTE,
          };
        }),
    }),
    endpoint({
      method: 'put',
      path: '/jobs/:jobId/survey',
      summary: 'Save the survey details (substrate, when, who, notes)',
      tags,
      permission: 'jobs:write',
      params: jobParams,
      body: surveyDetails,
      handle: ({ params, body, req }) =>
        onVisibleJob(deps, req, params.jobId, async ({ tx, scope, actor }) => {
          const saved = await saveSurvey(tx, scope, params.jobId, body);
          await recordJobEvent(tx, scope, {
            jobId: params.jobId,
            kind: 'survey-saved',
            summary: `Survey details saved${body.substrate ? ` (substrate: ${body.substrate.replace('_', ' ')})` : ''}`,
            detail: { surveyId: saved.id },
            actorUserId: actor.userId,
          });
          return saved;
        }),
    }),
    endpoint({
      method: 'post',
      path: '/jobs/:jobId/survey/areas',
      summary: 'Add an area to the survey',
      tags,
      permission: 'jobs:write',
      status: 201,
      params: jobParams,
      body: areaBody,
      handle: ({ params, body, req }) =>
        onVisibleJob(deps, req, params.jobId, async ({ tx, scope, actor }) => {
          const area = await addArea(tx, scope, params.jobId, body.name, actor.userId);
          await recordJobEvent(tx, scope, {
            jobId: params.jobId,
            kind: 'area-added',
            summary: `Area "${area.name}" added to the survey`,
            detail: { areaId: area.id },
            actorUserId: actor.userId,
          });
          return { ...area, latest: null };
        }),
    }),
    endpoint({
      method: 'patch',
      path: '/jobs/:jobId/survey/areas/:areaId',
      summary: 'Rename an area',
      tags,
      permission: 'jobs:write',
      params: areaParams,
      body: areaBody,
      handle: ({ params, body, req }) =>
        onVisibleJob(deps, req, params.jobId, async ({ tx, scope }) => {
          await findArea(tx, scope, params.jobId, params.areaId);
          return renameArea(tx, scope, params.areaId, body.name);
        }),
    }),
    endpoint({
      method: 'get',
      path: '/jobs/:jobId/survey/areas/:areaId/versions',
      summary: 'The area’s saved takeoff versions, newest first',
      tags,
      permission: 'jobs:read',
      params: areaParams,
      handle: ({ params, req }) =>
        onVisibleJob(deps, req, params.jobId, async ({ tx, scope }) => {
          await findArea(tx, scope, params.jobId, params.areaId);
          return listVersions(tx, scope, params.areaId);
        }),
    }),
    endpoint({
      method: 'post',
      path: '/jobs/:jobId/survey/areas/:areaId/versions',
      summary: 'Compute the floor with the firm’s rates and save it as the next version',
      tags,
      permission: 'takeoffs:write',
      status: 201,
      params: areaParams,
      body: takeoffInput,
      handle: ({ params, body, req }) =>
        onVisibleJob(deps, req, params.jobId, async ({ tx, scope, actor }) => {
          const area = await findArea(tx, scope, params.jobId, params.areaId);
          const input = body as TakeoffInput;
          const saved = await saveVersion(tx, scope, area.id, input, actor.userId);
          const s = saved.summary;
          await recordJobEvent(tx, scope, {
            jobId: params.jobId,
            kind: 'takeoff-saved',
            summary: `Takeoff v${saved.version} of "${area.name}" saved: ${s.netAreaM2.toFixed(1)} m², ${s.tiles.toOrder} tiles to order`,
            detail: { areaId: area.id, version: saved.version },
            actorUserId: actor.userId,
          });
          return saved;
        }),
    }),
    endpoint({
      method: 'get',
      path: '/jobs/:jobId/survey/areas/:areaId/versions/:takeoffVersion',
      summary: 'One saved takeoff version with its input and the rates used',
      tags,
      permission: 'jobs:read',
      params: versionParams,
      handle: ({ params, req }) =>
        onVisibleJob(deps, req, params.jobId, async ({ tx, scope }) => {
          await findArea(tx, scope, params.jobId, params.areaId);
          return getVersion(tx, scope, params.areaId, params.takeoffVersion);
        }),
    }),
    ...readingEndpoints(deps),
  ];
}

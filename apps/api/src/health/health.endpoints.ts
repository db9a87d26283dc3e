import { z } from 'zod';
import { endpoint } from '@latchwork/shared-server-kit';
import type { ApiDeps } from '../deps';
import { checkDependencies } from './dependency-checks';

const check = z.object({
  status: z.enum(['up', 'down']),
  latencyMs: z.number().int(),
  error: z.string().optional(),
});

export const healthResponse = z.object({
  status: z.enum(['up', 'degraded']),
  version: z.string(),
  checks: z.object({
    postgres: check,
    redis: check,
    objectStore: check,
    mail: check,
    payments: check,
  }),
});

export function healthEndpoints(deps: ApiDeps) {
  return [
    endpoint({
      method: 'get',
      path: '/health',
      summary: 'State of the API and of every service it depends on',
      tags: ['system'],
      permission: 'public',
      response: healthResponse,
      async handle({ res }) {
        const checks = await checkDependencies(deps);
        const allUp = Object.values(checks).every((c) => c.status === 'up');
        // 503 lets a load balancer take a copy that cannot reach its dependencies out of rotation.
        res.status(allUp ? 200 : 503);
        return { status: allUp ? 'up' : 'degraded', version: deps.config.version, checks };
      },
    }),
  ];
}

import type { Request } from 'express';
import { withTenant, type TenantScope, type Tx } from '@latchwork/shared-db';
import { actorOf, scopeOf, type Actor } from '@latchwork/shared-server-kit';
import type { JobsDeps } from '../jobs-deps';
import { assertJobVisible } from '../jobs/job-events';

export interface JobWork {
  tx: Tx;
  scope: TenantScope;
  actor: Actor;
}

/**
 * Runs `work` in the actor's firm after checking the job is visible to them (404 otherwise,
 * alike for another firm's job and a job an installer is not booked on).
 */
export function onVisibleJob<T>(
  deps: JobsDeps,
  req: Request,
  jobId: string,
  work: (w: JobWork) => Promise<T>,
): Promise<T> {
  const actor = actorOf(req);
  const scope = scopeOf(req);
  return withTenant(deps.db, scope, async (tx) => {
    await assertJobVisible(tx, scope, actor, jobId);
    return work({ tx, scope, actor });
  });
}

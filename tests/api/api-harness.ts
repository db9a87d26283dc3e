import { createApp } from '../../apps/api/src/app';
import { createDepsFromEnv } from '../../apps/api/src/create-deps';

/** The real API app wired to the test stack's real services (env from tests/run-all.mjs). */
export function createTestApi() {
  const deps = createDepsFromEnv();
  deps.logger.level = 'silent';
  return { app: createApp(deps), deps };
}

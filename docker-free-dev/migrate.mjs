// `npm run db:migrate`: applies new migrations to the running demo database (or the test
// one with LW_PROFILE=test). PostgreSQL is started first if it is not running.
import { loadConfig } from './lib/config.mjs';
import { startPostgres } from './lib/postgres.mjs';
import { runStep } from './lib/processes.mjs';

const cfg = loadConfig(process.env.LW_PROFILE === 'test' ? 'test' : 'dev');
startPostgres(cfg);
const { ok } = runStep(cfg, 'npx', [
  'tsx',
  '--tsconfig',
  'tsconfig.base.json',
  'docker-free-dev/lib/db-tasks.ts',
  'migrate',
]);
process.exit(ok ? 0 : 1);

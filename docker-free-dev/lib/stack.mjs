// Starting and stopping the whole local stack, shared by `npm start` and `npm test`.
import path from 'node:path';
import { startPostgres, stopPostgres } from './postgres.mjs';
import { startRedis, stopRedis } from './redis.mjs';
import { runStep, startProcess, stopProcesses, waitForUrl } from './processes.mjs';

const FAKES = ['identity-provider', 'object-store', 'mail', 'payments'];

function fakeReadyUrls(cfg) {
  const { ports } = cfg;
  return {
    'identity-provider': `http://127.0.0.1:${ports.idp}/.well-known/openid-configuration`,
    'object-store': `http://127.0.0.1:${ports.s3}/`,
    mail: `http://127.0.0.1:${ports.mailUi}/api/messages`,
    payments: `http://127.0.0.1:${ports.payments}/health`,
  };
}

const tsx = (cfg, args) =>
  runStep(cfg, 'npx', ['tsx', '--tsconfig', 'tsconfig.base.json', ...args]);

/** PostgreSQL, Redis, the four fakes, migrations and (if empty) the demo data. */
export async function startServices(cfg, log) {
  log('Starting PostgreSQL and Redis …');
  startPostgres(cfg, log);
  startRedis(cfg, log);
  log('Starting the local fakes …');
  for (const fake of FAKES)
    startProcess(cfg, fake, process.execPath, [path.join('docker-free-dev', fake, 'main.mjs')]);
  await Promise.all(Object.values(fakeReadyUrls(cfg)).map((url) => waitForUrl(url)));
  log('Migrating the database …');
  if (!tsx(cfg, ['docker-free-dev/lib/db-tasks.ts', 'migrate']).ok)
    throw new Error('migration failed');
  if (!tsx(cfg, ['docker-free-dev/lib/db-tasks.ts', 'seed-if-empty']).ok)
    throw new Error('loading the demo data failed');
  // Imported here, not at the top: start and test scripts load this module before
  // `npm ci` has run on a fresh clone, and this one needs npm packages.
  const { ensureDemoAccounts } = await import('../demo/identity-accounts.mjs');
  const accounts = await ensureDemoAccounts(cfg);
  if (accounts) log(`Demo sign-ins created at the identity provider: ${accounts}`);
}

export function buildApps(cfg, log) {
  log('Building the web app, API and worker …');
  const built = runStep(cfg, 'npx', [
    'nx',
    'run-many',
    '-t',
    'build',
    '-p',
    'web',
    'api',
    'worker',
    '--output-style=static',
  ]);
  if (!built.ok) throw new Error('build failed');
}

/** The API, the worker and the gateway, from the built bundles. */
export async function startApps(cfg) {
  startProcess(cfg, 'api', process.execPath, ['--enable-source-maps', 'dist/apps/api/main.cjs']);
  startProcess(cfg, 'worker', process.execPath, [
    '--enable-source-maps',
    'dist/apps/worker/main.cjs',
  ]);
  startProcess(cfg, 'gateway', process.execPath, ['docker-free-dev/gateway/server.mjs']);
  await waitForUrl(`${cfg.env.API_URL}/api/v1/openapi.json`, { okOnly: true });
  await waitForUrl(`${cfg.env.APP_URL}/`, { okOnly: true });
}

/** Ends every process of the profile, then Redis and PostgreSQL (cleanly: nothing lost). */
export async function stopAll(cfg) {
  await stopProcesses(cfg);
  stopRedis(cfg);
  stopPostgres(cfg);
}

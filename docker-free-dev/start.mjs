// `npm start`: everything the demo needs, from a fresh clone, on 127.0.0.1; Ctrl-C stops it.
import { loadConfig } from './lib/config.mjs';
import { ensureNodeModules } from './lib/npm-deps.mjs';
import { takeLock, logDir } from './lib/processes.mjs';
import { buildApps, startApps, startServices, stopAll } from './lib/stack.mjs';
import scenario from './demo/demo-scenario.json' with { type: 'json' };

const signInLines = (s) =>
  s.people.map(
    (p) =>
      `  ${p.email.padEnd(34)} ${p.memberships.map((m) => `${m.role} at ${s.tenants.find((t) => t.slug === m.tenant).name}`).join('; ')}`,
  );

const cfg = loadConfig('dev');
const log = (line) => console.log(`[latchwork] ${line}`);
const lock = takeLock(cfg);
if (!lock.ok) {
  console.error(
    `Latchwork is already running (process ${lock.pid}). Open ${cfg.env.APP_URL} or stop it with Ctrl-C in its terminal or \`npm run stop\`.`,
  );
  process.exit(1);
}

let stopping = false;
async function shutdown(code) {
  if (stopping) return;
  stopping = true;
  log('Stopping everything that was started …');
  await stopAll(cfg);
  lock.release();
  log('Stopped. Your data is kept in .local/dev and will be there on the next start.');
  process.exit(code);
}
process.on('SIGINT', () => void shutdown(0));
process.on('SIGTERM', () => void shutdown(0));

try {
  const started = Date.now();
  ensureNodeModules(log);
  await startServices(cfg, log);
  buildApps(cfg, log);
  await startApps(cfg);
  const p = cfg.ports;
  console.log(`
Latchwork is running (ready in ${((Date.now() - started) / 1000).toFixed(1)} s).

  App                 ${cfg.env.APP_URL}
  API reference       ${cfg.env.APP_URL}/api/v1/docs/
  Health              ${cfg.env.APP_URL}/api/v1/health
  Mail inbox (fake)   http://127.0.0.1:${p.mailUi}
  Sign-in (fake IdP)  http://127.0.0.1:${p.idp}/.well-known/openid-configuration
  Object store (fake) http://127.0.0.1:${p.s3}
  Payments (fake)     http://127.0.0.1:${p.payments}
  PostgreSQL          127.0.0.1:${p.pg} (database latchwork)
  Redis               127.0.0.1:${p.redis}
  Logs                ${logDir(cfg)}

Demo sign-ins (password: ${scenario.password}):
${signInLines(scenario).join('\n')}

Press Ctrl-C to stop.`);
} catch (err) {
  console.error(`[latchwork] ${err.message}`);
  await shutdown(1);
}

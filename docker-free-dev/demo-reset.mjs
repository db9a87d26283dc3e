// `npm run demo:reset`: throws away the demo's data (database, stored files, mail, payments)
// so the next `npm start` loads the demo scenario afresh. Refuses while the demo runs.
import { existsSync, readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import { loadConfig } from './lib/config.mjs';
import { stopPostgres } from './lib/postgres.mjs';
import { stopRedis } from './lib/redis.mjs';

const cfg = loadConfig('dev');
const lockFile = path.join(cfg.dataDir, 'lock.pid');
if (existsSync(lockFile)) {
  const pid = Number(readFileSync(lockFile, 'utf8'));
  let running = false;
  try {
    process.kill(pid, 0);
    running = true;
  } catch {
    running = false;
  }
  if (running) {
    console.error(`The demo is running (process ${pid}); stop it with Ctrl-C first.`);
    process.exit(1);
  }
}
stopRedis(cfg);
stopPostgres(cfg);
rmSync(cfg.dataDir, { recursive: true, force: true });
console.log('[latchwork] demo data removed; `npm start` will load the demo scenario again.');

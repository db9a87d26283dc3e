// `npm run stop`: ends a demo left running (e.g. its terminal was closed) and frees its lock.
import { rmSync } from 'node:fs';
import path from 'node:path';
import { loadConfig } from './lib/config.mjs';
import { stopAll } from './lib/stack.mjs';

const cfg = loadConfig(process.env.LW_PROFILE === 'test' ? 'test' : 'dev');
await stopAll(cfg);
rmSync(path.join(cfg.dataDir, 'lock.pid'), { force: true });
console.log(`[latchwork] stopped the ${cfg.profile} stack`);

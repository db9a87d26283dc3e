// Child processes started by `npm start` / `npm test`: each logs to a file in the data
// folder and leaves a pid file, so `npm run stop` can end exactly what was started.
import { spawn, spawnSync } from 'node:child_process';
import {
  closeSync,
  existsSync,
  mkdirSync,
  openSync,
  readdirSync,
  readFileSync,
  rmSync,
  writeFileSync,
} from 'node:fs';
import path from 'node:path';
import { ROOT } from './config.mjs';

const runDir = (cfg) => path.join(cfg.dataDir, 'run');
export const logDir = (cfg) => path.join(cfg.dataDir, 'logs');

/** Starts `command args` in the background with the profile's environment. */
export function startProcess(cfg, name, command, args, extraEnv = {}) {
  mkdirSync(runDir(cfg), { recursive: true });
  mkdirSync(logDir(cfg), { recursive: true });
  // The child writes to the log file itself, so it lives on if this process ends first.
  const log = openSync(path.join(logDir(cfg), `${name}.log`), 'a');
  const child = spawn(command, args, {
    cwd: ROOT,
    env: { ...process.env, ...cfg.env, ...extraEnv, NX_DAEMON: 'false', NX_NO_CLOUD: 'true' },
    stdio: ['ignore', log, log],
    // A process group of its own: Ctrl-C reaches only the starter, which then stops the
    // children in order (front door first, databases last) instead of all at once.
    detached: true,
  });
  closeSync(log);
  writeFileSync(path.join(runDir(cfg), `${name}.pid`), String(child.pid));
  child.on('exit', () => rmSync(path.join(runDir(cfg), `${name}.pid`), { force: true }));
  return child;
}

/** Runs a command to completion in the foreground, with the profile's environment. */
export function runStep(cfg, command, args, options = {}) {
  const result = spawnSync(command, args, {
    cwd: ROOT,
    env: {
      ...process.env,
      ...cfg.env,
      NX_DAEMON: 'false',
      NX_NO_CLOUD: 'true',
      NG_CLI_ANALYTICS: 'false',
      ...options.env,
    },
    stdio: options.capture ? ['ignore', 'pipe', 'pipe'] : 'inherit',
    encoding: 'utf8',
    maxBuffer: 64 * 1024 * 1024,
  });
  return {
    ok: result.status === 0,
    status: result.status,
    stdout: result.stdout ?? '',
    stderr: result.stderr ?? '',
  };
}

const alive = (pid) => {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
};

/** Sends SIGTERM to every recorded process, waits for them, then SIGKILLs stragglers. */
export async function stopProcesses(cfg, { graceMs = 25_000 } = {}) {
  if (!existsSync(runDir(cfg))) return;
  const pids = readdirSync(runDir(cfg))
    .filter((f) => f.endsWith('.pid'))
    .map((f) => ({
      file: path.join(runDir(cfg), f),
      pid: Number(readFileSync(path.join(runDir(cfg), f), 'utf8')),
    }));
  for (const { pid } of pids) if (alive(pid)) process.kill(pid, 'SIGTERM');
  const deadline = Date.now() + graceMs;
  while (pids.some(({ pid }) => alive(pid)) && Date.now() < deadline)
    await new Promise((r) => setTimeout(r, 100));
  for (const { pid, file } of pids) {
    if (alive(pid)) process.kill(pid, 'SIGKILL');
    rmSync(file, { force: true });
  }
}

/** Polls `url` until it answers (any status below 500 unless `okOnly`). */
export async function waitForUrl(url, { timeoutMs = 60_000, okOnly = false } = {}) {
  const deadline = Date.now() + timeoutMs;
  let lastError = '';
  while (Date.now() < deadline) {
    try {
      const res = await fetch(url);
      if (okOnly ? res.ok : res.status < 500) return res;
      lastError = `HTTP ${res.status}`;
    } catch (err) {
      lastError = err.cause?.code ?? err.message;
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`${url} did not answer within ${timeoutMs} ms (${lastError})`);
}

/** One running `npm start`/`npm test` per profile: a lock file holding the owner's pid. */
export function takeLock(cfg) {
  const file = path.join(cfg.dataDir, 'lock.pid');
  mkdirSync(cfg.dataDir, { recursive: true });
  if (existsSync(file)) {
    const pid = Number(readFileSync(file, 'utf8'));
    if (pid && pid !== process.pid && alive(pid)) return { ok: false, pid };
  }
  writeFileSync(file, String(process.pid));
  return { ok: true, release: () => rmSync(file, { force: true }) };
}

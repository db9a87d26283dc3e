// A private Redis on 127.0.0.1 with an append-only file in a git-ignored folder. BullMQ
// needs `noeviction`: an evicted job key would silently lose work.
import { existsSync, mkdirSync, readFileSync } from 'node:fs';
import { execFileSync } from 'node:child_process';
import path from 'node:path';
import { ensureDebianPackages } from './debian.mjs';

function paths(cfg) {
  const dir = path.join(cfg.dataDir, 'redis');
  return { dir, pid: path.join(dir, 'redis.pid'), log: path.join(dir, 'redis.log') };
}

function ping(cfg) {
  try {
    return (
      execFileSync('redis-cli', ['-h', '127.0.0.1', '-p', String(cfg.ports.redis), 'ping'], {
        encoding: 'utf8',
        stdio: ['ignore', 'pipe', 'ignore'],
      }).trim() === 'PONG'
    );
  } catch {
    return false;
  }
}

export function startRedis(cfg, log = console.log) {
  ensureDebianPackages(['redis-server'], log);
  const p = paths(cfg);
  mkdirSync(p.dir, { recursive: true });
  if (ping(cfg)) return;
  execFileSync(
    'redis-server',
    [
      '--bind',
      '127.0.0.1',
      '--port',
      String(cfg.ports.redis),
      '--dir',
      p.dir,
      '--appendonly',
      'yes',
      '--maxmemory-policy',
      'noeviction',
      '--save',
      '',
      '--daemonize',
      'yes',
      '--pidfile',
      p.pid,
      '--logfile',
      p.log,
      '--protected-mode',
      'yes',
    ],
    { stdio: 'inherit' },
  );
  for (let i = 0; i < 100 && !ping(cfg); i++) execFileSync('sleep', ['0.05']);
  if (!ping(cfg)) throw new Error(`Redis did not start; see ${p.log}`);
}

export function stopRedis(cfg) {
  if (!ping(cfg)) return;
  // SHUTDOWN rewrites nothing by itself with --save ''; the AOF is already on disk.
  try {
    execFileSync('redis-cli', ['-h', '127.0.0.1', '-p', String(cfg.ports.redis), 'shutdown'], {
      stdio: 'ignore',
    });
  } catch {
    // redis-cli reports the dropped connection as an error once the server has gone.
  }
  const p = paths(cfg);
  for (let i = 0; i < 100 && existsSync(p.pid); i++) execFileSync('sleep', ['0.05']);
  if (existsSync(p.pid)) process.kill(Number(readFileSync(p.pid, 'utf8')), 'SIGTERM');
}

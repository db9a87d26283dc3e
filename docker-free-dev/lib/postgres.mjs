// A private PostgreSQL cluster in a git-ignored folder, listening on 127.0.0.1 only and run
// as the `postgres` system user (PostgreSQL refuses to run as root).
import { existsSync, mkdirSync, readdirSync, chownSync } from 'node:fs';
import { execFileSync } from 'node:child_process';
import path from 'node:path';
import { ensureDebianPackages } from './debian.mjs';

function binDir() {
  const base = '/usr/lib/postgresql';
  const versions = existsSync(base) ? readdirSync(base).filter((v) => /^\d+$/.test(v)) : [];
  if (versions.length === 0)
    throw new Error('PostgreSQL server binaries not found under /usr/lib/postgresql');
  return path.join(base, String(Math.max(...versions.map(Number))), 'bin');
}

function postgresIds() {
  const uid = Number(execFileSync('id', ['-u', 'postgres'], { encoding: 'utf8' }).trim());
  const gid = Number(execFileSync('id', ['-g', 'postgres'], { encoding: 'utf8' }).trim());
  return { uid, gid };
}

function asPostgres(cmd, args, options = {}) {
  return execFileSync('runuser', ['-u', 'postgres', '--', cmd, ...args], {
    encoding: 'utf8',
    ...options,
  });
}

function paths(cfg) {
  const dir = path.join(cfg.dataDir, 'pg');
  return {
    dir,
    data: path.join(dir, 'data'),
    socket: path.join(dir, 'socket'),
    log: path.join(dir, 'server.log'),
  };
}

export function postgresRunning(cfg) {
  const p = paths(cfg);
  if (!existsSync(path.join(p.data, 'PG_VERSION'))) return false;
  try {
    asPostgres(path.join(binDir(), 'pg_ctl'), ['-D', p.data, 'status'], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  }
}

function psql(cfg, database, statement) {
  const p = paths(cfg);
  return asPostgres('psql', [
    '-X',
    '-q',
    '-v',
    'ON_ERROR_STOP=1',
    '-h',
    p.socket,
    '-p',
    String(cfg.ports.pg),
    '-U',
    'postgres',
    '-d',
    database,
    '-tAc',
    statement,
  ]);
}

/** Creates (first time) and starts the cluster, then makes sure roles and database exist. */
export function startPostgres(cfg, log = console.log) {
  ensureDebianPackages(['postgresql'], log);
  const bin = binDir();
  const p = paths(cfg);
  const { uid, gid } = postgresIds();
  for (const dir of [cfg.dataDir, p.dir, p.socket]) {
    mkdirSync(dir, { recursive: true });
    chownSync(dir, uid, gid);
  }
  if (!existsSync(path.join(p.data, 'PG_VERSION'))) {
    log('Creating the PostgreSQL cluster …');
    asPostgres(
      path.join(bin, 'initdb'),
      [
        '-D',
        p.data,
        '-U',
        'postgres',
        '-E',
        'UTF8',
        '--locale=C.UTF-8',
        '--auth-local=trust',
        '--auth-host=scram-sha-256',
      ],
      { stdio: 'ignore' },
    );
  }
  if (!postgresRunning(cfg)) {
    const options = `-p ${cfg.ports.pg} -k ${p.socket} -c listen_addresses=127.0.0.1 -c max_connections=200 -c fsync=${cfg.profile === 'test' ? 'off' : 'on'}`;
    asPostgres(
      path.join(bin, 'pg_ctl'),
      ['-D', p.data, '-l', p.log, '-o', options, '-w', '-t', '60', 'start'],
      { stdio: 'ignore' },
    );
  }
  bootstrap(cfg);
}

function bootstrap(cfg) {
  const { ownerPassword, appPassword } = cfg.secrets;
  const roles = psql(
    cfg,
    'postgres',
    `select string_agg(rolname, ',') from pg_roles where rolname like 'latchwork_%'`,
  );
  if (!roles.includes('latchwork_owner'))
    psql(cfg, 'postgres', `create role latchwork_owner login password '${ownerPassword}'`);
  // The API's role: not superuser, not owner, cannot bypass row-level security.
  if (!roles.includes('latchwork_app'))
    psql(
      cfg,
      'postgres',
      `create role latchwork_app login nosuperuser nobypassrls password '${appPassword}'`,
    );
  const hasDb =
    psql(cfg, 'postgres', `select 1 from pg_database where datname = 'latchwork'`).trim() === '1';
  if (!hasDb) {
    psql(cfg, 'postgres', 'create database latchwork owner latchwork_owner');
    psql(
      cfg,
      'latchwork',
      'alter schema public owner to latchwork_owner; grant usage on schema public to latchwork_app; create extension if not exists citext',
    );
  }
}

export function stopPostgres(cfg) {
  if (!postgresRunning(cfg)) return;
  asPostgres(path.join(binDir(), 'pg_ctl'), ['-D', paths(cfg).data, '-m', 'fast', '-w', 'stop'], {
    stdio: 'ignore',
  });
}

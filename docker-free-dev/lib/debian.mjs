// Installs missing Debian packages. Service start-up during install is refused through
// policy-rc.d so that no system-wide server (listening on a default port) is started.
import { existsSync, writeFileSync, unlinkSync } from 'node:fs';
import { execFileSync } from 'node:child_process';

function installed(pkg) {
  try {
    const out = execFileSync('dpkg-query', ['-W', '-f=${Status}', pkg], {
      encoding: 'utf8',
      stdio: ['ignore', 'pipe', 'ignore'],
    });
    return out.includes('install ok installed');
  } catch {
    return false;
  }
}

/** @param {string[]} packages Debian package names; installs those not yet installed. */
export function ensureDebianPackages(packages, log = console.log) {
  const missing = packages.filter((p) => !installed(p));
  if (missing.length === 0) return;
  if (process.getuid?.() !== 0) {
    throw new Error(
      `Missing Debian packages: ${missing.join(' ')}. Install them with: sudo apt-get install -y ${missing.join(' ')}`,
    );
  }
  log(`Installing Debian packages: ${missing.join(' ')} …`);
  const policy = '/usr/sbin/policy-rc.d';
  const ownPolicy = !existsSync(policy);
  if (ownPolicy) writeFileSync(policy, '#!/bin/sh\nexit 101\n', { mode: 0o755 });
  try {
    const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
    execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
    execFileSync('apt-get', ['install', '-y', '-qq', '--no-install-recommends', ...missing], {
      stdio: 'inherit',
      env,
    });
  } finally {
    if (ownPolicy) unlinkSync(policy);
  }
}

// Installs npm dependencies from the lockfile when node_modules is missing or older than it.
import { existsSync, statSync } from 'node:fs';
import { execFileSync } from 'node:child_process';
import path from 'node:path';
import { ROOT } from './config.mjs';

export function ensureNodeModules(log = console.log) {
  const marker = path.join(ROOT, 'node_modules', '.package-lock.json');
  const lock = path.join(ROOT, 'package-lock.json');
  if (existsSync(marker) && statSync(marker).mtimeMs >= statSync(lock).mtimeMs) return false;
  log('Installing npm dependencies from package-lock.json …');
  execFileSync('npm', ['ci', '--no-audit', '--no-fund'], { cwd: ROOT, stdio: 'inherit' });
  return true;
}

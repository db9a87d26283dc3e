// `npm test`: sets up everything from scratch on the test profile's own ports and data
// folder (so it can run beside a running demo), runs every check and test runner, stops
// what it started, and ends with one line: `N passed, N failed[, N skipped]`.
import { mkdirSync, readdirSync, rmSync } from 'node:fs';
import path from 'node:path';
import { loadConfig, ROOT } from '../docker-free-dev/lib/config.mjs';
import { ensureDebianPackages } from '../docker-free-dev/lib/debian.mjs';
import { ensureNodeModules } from '../docker-free-dev/lib/npm-deps.mjs';
import { runStep, takeLock } from '../docker-free-dev/lib/processes.mjs';
import { buildApps, startApps, startServices, stopAll } from '../docker-free-dev/lib/stack.mjs';
import { countsFromVitestJson, countsFromVitestText } from './test-counts.mjs';

const cfg = loadConfig('test');
const outputDir = path.join(ROOT, 'tests', 'output');
const totals = { passed: 0, failed: 0, skipped: 0 };
const log = (line) => console.log(`\n[test] ${line}`);

function record(name, counts) {
  totals.passed += counts.passed;
  totals.failed += counts.failed;
  totals.skipped += counts.skipped;
  log(
    `${name}: ${counts.passed} passed, ${counts.failed} failed${counts.skipped ? `, ${counts.skipped} skipped` : ''}`,
  );
}

/** A check that is one test: it passes or fails as a whole (format, lint, types, build). */
function check(name, command, args) {
  log(`${name} …`);
  const { ok } = runStep(cfg, command, args);
  record(name, { passed: ok ? 1 : 0, failed: ok ? 0 : 1, skipped: 0 });
  return ok;
}

function vitest(name, args) {
  log(`${name} …`);
  const report = path.join(outputDir, `${name}.json`);
  rmSync(report, { force: true });
  runStep(cfg, 'npx', [
    'vitest',
    'run',
    ...args,
    '--reporter=default',
    '--reporter=json',
    `--outputFile.json=${report}`,
  ]);
  record(name, countsFromVitestJson(report));
}

function freshDataDir() {
  mkdirSync(cfg.dataDir, { recursive: true });
  for (const entry of readdirSync(cfg.dataDir)) {
    if (entry !== 'lock.pid')
      rmSync(path.join(cfg.dataDir, entry), { recursive: true, force: true });
  }
}

const lock = takeLock(cfg);
if (!lock.ok) {
  console.error(`A test run is already going on (process ${lock.pid}).`);
  process.exit(1);
}
mkdirSync(outputDir, { recursive: true });
let stackUp = false;
const interrupted = async () => {
  if (stackUp) await stopAll(cfg);
  lock.release();
  process.exit(130);
};
process.on('SIGINT', interrupted);
process.on('SIGTERM', interrupted);

try {
  ensureNodeModules(console.log);
  ensureDebianPackages(['postgresql', 'redis-server', 'chromium'], console.log);
  await stopAll(cfg);
  freshDataDir();

  check('format', 'npx', ['prettier', '--check', '.']);
  // One ESLint run over the whole tree: the projects and tests/, which is not an Nx project.
  // The module-boundary rule reads Nx's project graph and silently skips itself without
  // one, as on a fresh clone: compute the graph first.
  runStep(cfg, 'npx', ['nx', 'show', 'projects'], { capture: true });
  check('lint', 'npx', ['eslint', '.', '--max-warnings=0']);
  check('typecheck', 'npx', ['nx', 'run-many', '-t', 'typecheck', '--output-style=static']);
  check('typecheck tests', 'npx', ['tsc', '-p', 'tests/tsconfig.json', '--noEmit']);
  check('typecheck fakes', 'npx', ['tsc', '-p', 'tests/fakes/tsconfig.json', '--noEmit']);
  vitest('unit', ['--config', 'tests/vitest.unit.config.ts']);

  log('web component tests …');
  const web = runStep(cfg, 'npx', ['nx', 'run', 'web:test', '--output-style=static'], {
    capture: true,
  });
  process.stdout.write(web.stdout + web.stderr);
  record('web', countsFromVitestText(web.stdout + web.stderr, web.ok));

  stackUp = true;
  await startServices(cfg, log);
  let built = true;
  try {
    buildApps(cfg, log);
  } catch {
    built = false;
  }
  record('build', { passed: built ? 1 : 0, failed: built ? 0 : 1, skipped: 0 });
  if (built) {
    await startApps(cfg);
    vitest('integration', [
      '--config',
      'tests/vitest.config.ts',
      '--project',
      'api',
      '--project',
      'worker',
      '--project',
      'fakes',
    ]);
    vitest('e2e', ['--config', 'tests/vitest.config.ts', '--project', 'e2e']);
    // Last: every firm's stock summaries still agree with its ledger after all of the above.
    vitest('after the suite', ['--config', 'tests/vitest.config.ts', '--project', 'after-suite']);
  }
} catch (err) {
  console.error(`[test] ${err.stack ?? err}`);
  record('set-up', { passed: 0, failed: 1, skipped: 0 });
} finally {
  if (stackUp) await stopAll(cfg);
  lock.release();
}

const skipped = totals.skipped ? `, ${totals.skipped} skipped` : '';
console.log(`${totals.passed} passed, ${totals.failed} failed${skipped}`);
process.exit(totals.failed > 0 ? 1 : 0);

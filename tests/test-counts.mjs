// Reading pass/fail counts from the runners, so the summary line adds up every runner.
import { existsSync, readFileSync } from 'node:fs';

/** Counts from Vitest's JSON reporter. A run that wrote no report counts as one failure. */
export function countsFromVitestJson(file) {
  if (!existsSync(file)) return { passed: 0, failed: 1, skipped: 0 };
  const r = JSON.parse(readFileSync(file, 'utf8'));
  // A file that failed to load has no tests but must still fail the run.
  const brokenFiles = (r.testResults ?? []).filter(
    (f) => f.status === 'failed' && f.assertionResults.length === 0,
  ).length;
  return {
    passed: r.numPassedTests,
    failed: r.numFailedTests + brokenFiles,
    skipped: r.numPendingTests + r.numTodoTests,
  };
}

/** Counts from Vitest's default text summary (`Tests  3 failed | 12 passed (15)`). */
export function countsFromVitestText(text, exitedOk) {
  // eslint-disable-next-line no-control-regex
  const plain = text.replace(/\u001b\[[0-9;]*m/g, '');
  const line = [...plain.matchAll(/^\s*Tests\s+(.+)$/gm)].pop()?.[1] ?? '';
  const count = (word) => Number(line.match(new RegExp(`(\\d+) ${word}`))?.[1] ?? 0);
  const counts = {
    passed: count('passed'),
    failed: count('failed'),
    skipped: count('skipped') + count('todo'),
  };
  if (!exitedOk && counts.failed === 0) counts.failed = 1;
  return counts;
}

// Runs axe-core (the accessibility rules engine) inside a page and returns what it finds.
import axe from 'axe-core';
import type { Page } from 'playwright-core';

/** One rule broken on the page, with the first few places it is broken. */
export interface A11yProblem {
  readonly rule: string;
  readonly impact: string;
  readonly help: string;
  readonly targets: string[];
}

/**
 * Accessibility problems of impact "serious" or "critical" on the page as it is now. axe is
 * injected through the debugging protocol, so the page's content security policy allows it.
 */
export async function seriousA11yProblems(page: Page): Promise<A11yProblem[]> {
  await page.evaluate(axe.source);
  const results = await page.evaluate(() =>
    (window as unknown as { axe: typeof axe }).axe.run(document, {
      resultTypes: ['violations'],
    }),
  );
  return results.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => ({
      rule: v.id,
      impact: v.impact ?? '',
      help: v.help,
      targets: v.nodes.slice(0, 3).map((n) => n.target.join(' ')),
    }));
}

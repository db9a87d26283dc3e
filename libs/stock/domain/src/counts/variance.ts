/**
 * Stock count variances. A count is judged against what should be there *when each line
 * was counted*: the balance at the count's start plus the movements booked during the count
 * (goods in, issues, transfers while people counted). Without that, a van loaded half-way
 * through a count would show a false loss.
 *
 * Variance = counted − expected, valued at the product's average unit cost (rounded
 * half-even). Owner approval is needed when the gross value (the sum of |variance value|, so
 * a loss cannot hide behind a gain) exceeds the tenant's threshold, or when one line alone
 * does. Posting books one count-correction movement per line that differs.
 */
import { extendCost, type Minor } from '../money';

/** One counted product (× batch) at the counted location. Quantities in stock steps. */
export interface CountLineInput {
  productId: string;
  batchCode?: string | null;
  /** Balance when the count started. */
  expectedAtStart: number;
  /** Net of the movements into (+) and out of (−) this line booked during the count. */
  movementsDuring: number;
  counted: number;
  /** Average unit cost per whole unit, minor units. */
  unitCost: Minor;
  decimals?: number;
}

/** A line of the variance report. */
export interface CountLineResult {
  productId: string;
  batchCode: string | null;
  expected: number;
  counted: number;
  variance: number;
  varianceValue: Minor;
  overLineThreshold: boolean;
}

/** The correction a posting books (signed: + found, − missing). */
export interface CountCorrection {
  kind: 'count-correction';
  productId: string;
  batchCode: string | null;
  quantity: number;
  unitCost: Minor;
}

/** The report and what posting would do. */
export interface CountVariance {
  lines: CountLineResult[];
  /** Σ variance values (a loss is negative). */
  netValue: Minor;
  /** Σ |variance values|. */
  grossValue: Minor;
  needsApproval: boolean;
  corrections: CountCorrection[];
}

/** Approval thresholds in minor units; absent means no limit of that kind. */
export interface CountThresholds {
  gross?: Minor;
  perLine?: Minor;
}

/** Computes the variance of every line and the corrections that posting would book. */
export function countVariance(
  lines: readonly CountLineInput[],
  thresholds: CountThresholds = {},
): CountVariance {
  const results = lines.map((l): CountLineResult => {
    const expected = l.expectedAtStart + l.movementsDuring;
    const variance = l.counted - expected;
    const varianceValue = extendCost(variance, l.unitCost, l.decimals ?? 0);
    return {
      productId: l.productId,
      batchCode: l.batchCode ?? null,
      expected,
      counted: l.counted,
      variance,
      varianceValue,
      overLineThreshold:
        thresholds.perLine !== undefined && Math.abs(varianceValue) > thresholds.perLine,
    };
  });
  const netValue = results.reduce((s, r) => s + r.varianceValue, 0);
  const grossValue = results.reduce((s, r) => s + Math.abs(r.varianceValue), 0);
  const needsApproval =
    (thresholds.gross !== undefined && grossValue > thresholds.gross) ||
    results.some((r) => r.overLineThreshold);
  const corrections = results
    .map((r, i) => ({ r, unitCost: lines[i].unitCost }))
    .filter(({ r }) => r.variance !== 0)
    .map(
      ({ r, unitCost }): CountCorrection => ({
        kind: 'count-correction',
        productId: r.productId,
        batchCode: r.batchCode,
        quantity: r.variance,
        unitCost,
      }),
    );
  return { lines: results, netValue, grossValue, needsApproval, corrections };
}

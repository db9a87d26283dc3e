/**
 * Daily demand from the issue history: one figure per calendar day of the window, days with
 * no issue counting as zero (otherwise a product issued twice a month would look as busy as
 * one issued daily). Returns to stock are netted off the day's issues. Dates are ISO
 * calendar dates `YYYY-MM-DD` in the tenant's time zone.
 */

const DAY_MS = 86_400_000;
const ISO_DATE = /^\d{4}-\d{2}-\d{2}$/;

/** Days since 1970-01-01 of an ISO date; throws for anything that is not a real date. */
export function dayNumber(date: string): number {
  const ms = ISO_DATE.test(date) ? Date.parse(`${date}T00:00:00Z`) : NaN;
  if (Number.isNaN(ms) || new Date(ms).toISOString().slice(0, 10) !== date) {
    throw new RangeError(`not a calendar date: "${date}"`);
  }
  return ms / DAY_MS;
}

/** Whole days from `a` to `b` (negative when `b` is earlier). */
export function daysBetween(a: string, b: string): number {
  return dayNumber(b) - dayNumber(a);
}

/** One issued (or, negative, returned) quantity on a day. */
export interface DemandEvent {
  date: string;
  quantity: number;
}

/** Mean and sample standard deviation of daily demand over `days` days. */
export interface DemandStats {
  days: number;
  mean: number;
  /** Sample standard deviation (n − 1): the history is a sample of future days. */
  sd: number;
}

/**
 * Net demand per day from `from` to `to` inclusive. Events outside the window are ignored.
 */
export function dailyDemandSeries(
  events: readonly DemandEvent[],
  from: string,
  to: string,
): number[] {
  const start = dayNumber(from);
  const length = dayNumber(to) - start + 1;
  if (length < 1) throw new RangeError('the window ends before it starts');
  const days = new Array<number>(length).fill(0);
  for (const e of events) {
    const i = dayNumber(e.date) - start;
    if (i >= 0 && i < length) days[i] += e.quantity;
  }
  return days;
}

/**
 * Mean and sample standard deviation of a daily series (Welford's one-pass update, which
 * does not lose precision on long, large series). A single day has no spread: sd 0.
 */
export function demandStats(daily: readonly number[]): DemandStats {
  let mean = 0;
  let m2 = 0;
  daily.forEach((x, i) => {
    const delta = x - mean;
    mean += delta / (i + 1);
    m2 += delta * (x - mean);
  });
  const n = daily.length;
  return { days: n, mean, sd: n > 1 ? Math.sqrt(m2 / (n - 1)) : 0 };
}

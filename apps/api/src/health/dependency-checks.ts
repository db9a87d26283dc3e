import { sql } from 'kysely';
import { randomUUID } from 'node:crypto';
import type { ApiDeps } from '../deps';

export interface CheckResult {
  status: 'up' | 'down';
  latencyMs: number;
  error?: string;
}

const TIMEOUT_MS = 3000;

async function timed(check: () => Promise<unknown>): Promise<CheckResult> {
  const started = performance.now();
  let timer: NodeJS.Timeout | undefined;
  try {
    await Promise.race([
      check(),
      new Promise(
        (_, reject) =>
          (timer = setTimeout(
            () => reject(new Error(`no answer within ${TIMEOUT_MS} ms`)),
            TIMEOUT_MS,
          )),
      ),
    ]);
    return { status: 'up', latencyMs: Math.round(performance.now() - started) };
  } catch (err) {
    return {
      status: 'down',
      latencyMs: Math.round(performance.now() - started),
      error: (err as Error).message || String(err),
    };
  } finally {
    clearTimeout(timer);
  }
}

/** A put/stat/remove round trip: proves the store accepts and returns objects, not just that it listens. */
async function objectStoreRoundTrip({ client, bucket }: ApiDeps['objectStore']): Promise<void> {
  const key = `health/${randomUUID()}.txt`;
  const body = Buffer.from('latchwork health probe');
  await client.putObject(bucket, key, body, body.length, { 'Content-Type': 'text/plain' });
  const stat = await client.statObject(bucket, key);
  await client.removeObject(bucket, key);
  if (stat.size !== body.length)
    throw new Error(`stored ${stat.size} bytes, expected ${body.length}`);
}

/**
 * The card service has no health call: retrieving an id that cannot exist must come back as
 * the service's own "no such object" error, which proves it answers and accepts our key.
 */
async function paymentsAnswer(payments: ApiDeps['payments']): Promise<void> {
  try {
    await payments.paymentIntents.retrieve('pi_latchwork_health_probe');
  } catch (err) {
    const e = err as { type?: string; statusCode?: number };
    if (e.type === 'StripeInvalidRequestError' && e.statusCode === 404) return;
    throw err;
  }
  throw new Error('the probe id unexpectedly exists');
}

export async function checkDependencies(deps: ApiDeps) {
  const [postgres, redis, objectStore, mail, payments] = await Promise.all([
    timed(() => sql`select 1`.execute(deps.db)),
    timed(() => deps.redis.ping()),
    timed(() => objectStoreRoundTrip(deps.objectStore)),
    timed(() => deps.mailer.verify()),
    timed(() => paymentsAnswer(deps.payments)),
  ]);
  return { postgres, redis, objectStore, mail, payments };
}

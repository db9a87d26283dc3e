import type { Kysely } from 'kysely';
import type { Database } from '@latchwork/shared-db';

/** Firm A and its owner, as the route walker found them in the demo data. */
export interface WalkerSetup {
  db: Kysely<Database>;
  tenantA: string;
  ownerA: string;
}

/**
 * One feature's part of the route walk: the objects of firm A its routes are aimed at, and a
 * valid body for each of its state-changing routes (so a refusal cannot hide behind a 400).
 */
export interface WalkerFixture {
  /** Creates what the routes need in firm A; returns route parameter values by name (`jobId`). */
  prepare(setup: WalkerSetup): Promise<Record<string, string>>;
  /** Keyed `METHOD /api/v1/path` as Express declares it; `firm` is the caller's tenant id. */
  bodies: Record<string, (firm: string, params: Record<string, string>) => object>;
}

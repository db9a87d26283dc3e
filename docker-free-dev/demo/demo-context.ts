import type { Tx } from '@latchwork/shared-db';

/** One demo firm as a feature's demo step sees it, inside that firm's tenant scope. */
export interface DemoFirm {
  tx: Tx;
  tenantId: string;
  slug: string;
  /** Member ids by e-mail. */
  members: Map<string, string>;
  /** Deterministic pseudo-random numbers in [0, 1), so every `demo:reset` gives the same data. */
  random: () => number;
  /** "Today" for the demo: data is spread over the 18 months before it. */
  today: Date;
}

/** A feature's demo step: adds its data to one firm and says what it added. */
export type DemoStep = (firm: DemoFirm) => Promise<string>;

/** mulberry32: a small, well-known seeded generator, good enough for demo data. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

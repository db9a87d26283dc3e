// @ts-check
// Sign-in attempt limits: at most `attempts` failed sign-ins per window for one account
// (e-mail) and, separately, for one client address. The e-mail limit stops guessing one
// person's password from many addresses; the address limit stops one address trying many
// e-mails. Memory store: the fake is a single process, and a restart forgetting counts is fine.
import { RateLimiterMemory } from 'rate-limiter-flexible';
import { normaliseEmail } from './account-rules.mjs';

/**
 * @typedef {{
 *   begin(email: string, address: string): Promise<SignInAttempt>,
 * }} SignInLimits
 * @typedef {{
 *   lockedForSeconds: number,
 *   failed(): Promise<number>,
 *   succeeded(): Promise<void>,
 * }} SignInAttempt
 *   lockedForSeconds > 0: refuse without checking the password. Otherwise check it, then call
 *   failed() (answers how long the keys are now locked, 0 if not) or succeeded().
 */

/**
 * @param {{ attempts?: number, windowSeconds?: number }} [options] defaults: 10 a minute
 * @returns {SignInLimits}
 */
export function createSignInLimits({ attempts = 10, windowSeconds = 60 } = {}) {
  const byAccount = new RateLimiterMemory({
    keyPrefix: 'account',
    points: attempts,
    duration: windowSeconds,
  });
  const byAddress = new RateLimiterMemory({
    keyPrefix: 'address',
    points: attempts,
    duration: windowSeconds,
  });

  /** @param {{ consumedPoints: number, msBeforeNext: number }[]} results */
  const lockedFor = (results) =>
    Math.max(
      0,
      ...results
        .filter((r) => r.consumedPoints >= attempts)
        .map((r) => Math.max(1, Math.ceil(r.msBeforeNext / 1000))),
    );

  return {
    async begin(email, address) {
      const keys = /** @type {[RateLimiterMemory, string][]} */ (
        [
          [byAccount, normaliseEmail(email)],
          [byAddress, address],
        ].filter(([, key]) => key)
      );
      // Count the attempt before the (slow) password check, so that parallel requests cannot
      // all slip through before the first failure is counted; a success gives it back.
      const counted = await Promise.all(keys.map(([limiter, key]) => limiter.penalty(key, 1)));
      const over = counted.filter((r) => r.consumedPoints > attempts);
      if (over.length) {
        await Promise.all(keys.map(([limiter, key]) => limiter.reward(key, 1)));
        const lockedForSeconds = lockedFor(over);
        // Never checked, so neither call changes a count.
        return {
          lockedForSeconds,
          failed: async () => lockedForSeconds,
          succeeded: async () => undefined,
        };
      }
      return {
        lockedForSeconds: 0,
        async failed() {
          return lockedFor(counted);
        },
        async succeeded() {
          await Promise.all(keys.map(([limiter, key]) => limiter.reward(key, 1)));
        },
      };
    },
  };
}

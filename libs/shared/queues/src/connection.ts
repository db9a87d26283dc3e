import { Redis } from 'ioredis';

/**
 * An ioredis connection fit for BullMQ: `maxRetriesPerRequest: null` is required by its
 * blocking commands (a wrong value leaves workers hanging instead of failing).
 */
export function createRedisConnection(url: string): Redis {
  return new Redis(url, { maxRetriesPerRequest: null, enableReadyCheck: true, lazyConnect: false });
}

import type { RequestHandler } from 'express';
import IORedis from 'ioredis';
import { RateLimiterMemory, RateLimiterRedis, RateLimiterRes } from 'rate-limiter-flexible';
import { AppError } from '@server/errors';

const connections = new Set<IORedis>();

/**
 * Limits requests per client address to `perMinute`, counted in Redis so every API process
 * shares the count. The limiter has its own connection that never queues commands while Redis is
 * away, and an in-memory limiter takes over then: a Redis outage neither hangs nor opens sign-in.
 */
export function limitPerAddress(opts: { name: string; perMinute: number; redisUrl: string; what: string }): RequestHandler & { connected: Promise<boolean> } {
  const storeClient = new IORedis(opts.redisUrl, { enableOfflineQueue: false, maxRetriesPerRequest: 1, connectTimeout: 2000 });
  storeClient.on('error', () => undefined); // the insurance limiter answers while Redis is away
  connections.add(storeClient);
  const limiter = new RateLimiterRedis({
    storeClient,
    keyPrefix: `rate-${opts.name}`,
    points: opts.perMinute,
    duration: 60,
    insuranceLimiter: new RateLimiterMemory({ points: opts.perMinute, duration: 60 }),
  });
  /** Settles once the first connection attempt has succeeded (true) or failed (false). */
  const connected = new Promise<boolean>((resolve) => storeClient.once('ready', () => resolve(true)).once('error', () => resolve(false)));
  const middleware: RequestHandler = async (req, res, next) => {
    try {
      await limiter.consume(req.ip ?? 'unknown');
    } catch (refusal) {
      if (!(refusal instanceof RateLimiterRes)) throw refusal;
      const seconds = Math.max(1, Math.ceil(refusal.msBeforeNext / 1000));
      res.set('Retry-After', String(seconds));
      throw new AppError(429, 'too_many_requests', `Too many ${opts.what} from this address; try again in ${seconds} s.`);
    }
    next();
  };
  return Object.assign(middleware, { connected });
}

/** Closes the limiters' Redis connections (at shutdown). */
export async function closeRateLimiters(): Promise<void> {
  await Promise.all([...connections].map((c) => c.quit().catch(() => c.disconnect())));
  connections.clear();
}

import {
  MemoryStore,
  type ClientRateLimitInfo,
  type IncrementResponse,
  type Options,
  type Store,
} from 'express-rate-limit';
import type { Redis } from 'ioredis';
import { RedisStore, type RedisReply } from 'rate-limit-redis';

/**
 * A limiter's counters on the shared Redis (rate-limit-redis), so N API replicas give no more attempts than one.
 * If Redis cannot answer (down, or a Sentinel failover under way) the counting goes on in this process's memory
 * until Redis answers again: sign-ins keep working and stay limited per replica, rather than failing with 500
 * (fail closed) or not counting at all (express-rate-limit's passOnStoreError, fail open).
 */
export class SharedLimitStore implements Store {
  readonly prefix: string;
  private readonly redisStore: RedisStore;
  private readonly memory = new MemoryStore();
  private options: Options | undefined;
  private scriptsLoaded: Promise<boolean> = Promise.resolve(false);

  constructor(
    redis: Redis,
    prefix: string,
    private readonly onFallback: (err: unknown) => void,
  ) {
    this.prefix = prefix;
    this.redisStore = new RedisStore({
      prefix,
      sendCommand: (command: string, ...args: string[]) => redis.call(command, ...args) as Promise<RedisReply>,
    });
  }

  init(options: Options): void {
    this.options = options;
    this.memory.init(options);
    // Loaded at the first count, not here: at construction the Redis connection is not yet up.
  }

  // RedisStore keeps the promise of its script load: a load that failed (Redis down at boot) must be redone.
  private loadScripts(): Promise<boolean> {
    if (this.options === undefined) return Promise.resolve(false);
    return this.redisStore.init(this.options).then(
      () => true,
      (err: unknown) => {
        this.onFallback(err);
        return false;
      },
    );
  }

  private async use<T>(work: (store: Store) => Promise<T>): Promise<T> {
    if (!(await this.scriptsLoaded)) {
      this.scriptsLoaded = this.loadScripts();
      if (!(await this.scriptsLoaded)) return work(this.memory);
    }
    try {
      return await work(this.redisStore);
    } catch (err) {
      this.onFallback(err);
      this.scriptsLoaded = Promise.resolve(false);
      return work(this.memory);
    }
  }

  get(key: string): Promise<ClientRateLimitInfo | undefined> {
    return this.use((store) => Promise.resolve(store.get?.(key)));
  }

  increment(key: string): Promise<IncrementResponse> {
    return this.use((store) => Promise.resolve(store.increment(key)));
  }

  decrement(key: string): Promise<void> {
    return this.use((store) => Promise.resolve(store.decrement(key)));
  }

  resetKey(key: string): Promise<void> {
    return this.use((store) => Promise.resolve(store.resetKey(key)));
  }

  shutdown(): void {
    void this.memory.shutdown();
  }
}

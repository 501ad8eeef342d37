/**
 * The watch scheduler: a durable job queue (pg-boss 10) in its own schema of the app's PostgreSQL.
 *
 * - `watch-scan` (one at a time across app copies): finds due e-mails and queues one
 *   `watch-send` job per delivery. Every app copy offers a scan each interval; the offers are
 *   throttled to one job per interval slot, so two copies do not scan twice as often.
 * - `watch-send`: sends one delivery (see WatchDeliveryService for the exactly-once steps),
 *   retried with exponential back-off while the SMTP server refuses or is unreachable.
 *
 * The clock and the interval are injected: tests move a fake clock and call scanNow() and
 * drain() to run weeks of watches in seconds.
 */
import PgBoss from 'pg-boss';
import type { Sequelize } from 'sequelize';
import { RetryableSendError, type WatchDeliveryService } from '../services/watch-delivery-service';

export const SCAN_QUEUE = 'watch-scan';
export const SEND_QUEUE = 'watch-send';
/** The queue's own schema in the app database. */
export const JOB_SCHEMA = 'pgboss';
/** Every scan job carries this key: the singleton queue then runs one scan at a time. */
const SCAN_KEY = 'scan';
/**
 * A scan running longer than this is taken as lost (its app copy died) and retried: one scan runs at
 * a time, so a lost one must not hold the others back for the queue's default of 15 minutes.
 */
const SCAN_EXPIRE_SECONDS = 600;

export type Clock = () => Date;
export const systemClock: Clock = () => new Date();

export interface WatchSchedulerOptions {
  /** How often a scan runs, seconds. */
  scanIntervalSeconds: number;
  clock: Clock;
  /** Retries of a send after the first attempt (default 5). */
  retryLimit: number;
  /** First retry delay, seconds; doubled each retry with jitter (pg-boss back-off; default 30). */
  retryDelaySeconds: number;
  /** How often idle workers look for jobs, seconds (pg-boss allows 0.5 and up; default 2). */
  pollingIntervalSeconds: number;
  /** Longest a send job may run before the queue takes it as lost, seconds (default 300). */
  sendExpireSeconds: number;
  /** Logs scan results and failures (default true). */
  log: boolean;
}

export const defaultSchedulerOptions: Omit<WatchSchedulerOptions, 'scanIntervalSeconds'> = {
  clock: systemClock,
  retryLimit: 5,
  retryDelaySeconds: 30,
  pollingIntervalSeconds: 2,
  sendExpireSeconds: 300,
  log: true,
};

interface SendJob { deliveryId: string }

/** pg-boss connection settings from the Sequelize instance the app already has. */
function connectionFrom(sequelize: Sequelize): PgBoss.DatabaseOptions {
  const c = sequelize.config;
  return {
    host: c.host,
    port: c.port ? Number(c.port) : undefined,
    database: c.database,
    user: c.username,
    ...(c.password ? { password: c.password } : {}),
    application_name: 'gnomon-jobs',
    max: 4,
  };
}

export class WatchScheduler {
  private boss: PgBoss | undefined;
  private starting: Promise<void> | undefined;
  private timer: NodeJS.Timeout | undefined;
  private readonly workerIds: Record<string, string> = {};
  private readonly options: WatchSchedulerOptions;

  constructor(
    private readonly sequelize: Sequelize,
    /** The scan and send steps the jobs run (tests call them directly too). */
    readonly deliveries: WatchDeliveryService,
    options: Partial<WatchSchedulerOptions> & Pick<WatchSchedulerOptions, 'scanIntervalSeconds'>,
  ) {
    this.options = { ...defaultSchedulerOptions, ...options };
  }

  get running(): boolean {
    return this.boss !== undefined;
  }

  /** Starts the queue (creating its schema on first use), the workers and the periodic scan. */
  start(): Promise<void> {
    this.starting ??= this.doStart().catch((error: unknown) => {
      this.starting = undefined;
      throw error;
    });
    return this.starting;
  }

  private async doStart(): Promise<void> {
    const o = this.options;
    const boss = new PgBoss({
      ...connectionFrom(this.sequelize),
      schema: JOB_SCHEMA,
      // Our own interval offers the scans; the queue's cron clock is not needed.
      schedule: false,
      supervise: true,
      migrate: true,
    });
    boss.on('error', (error) => { if (o.log) console.error('Watch job queue:', error.message); });
    await boss.start();
    await boss.createQueue(SCAN_QUEUE, { name: SCAN_QUEUE, policy: 'singleton' });
    await boss.createQueue(SEND_QUEUE, { name: SEND_QUEUE, policy: 'standard' });
    this.boss = boss;

    this.workerIds[SCAN_QUEUE] = await boss.work(SCAN_QUEUE, { pollingIntervalSeconds: o.pollingIntervalSeconds, batchSize: 1 }, async () => {
      await this.runScan();
    });
    this.workerIds[SEND_QUEUE] = await boss.work<SendJob>(SEND_QUEUE, { pollingIntervalSeconds: o.pollingIntervalSeconds, batchSize: 1 }, async ([job]) => {
      try {
        return { outcome: await this.deliveries.send(job!.data.deliveryId, o.clock()) };
      } catch (error) {
        if (o.log && error instanceof RetryableSendError) console.warn(`Watch e-mail not sent, will retry: ${error.message}`);
        throw error;
      } finally {
        // Look for the next send at once rather than after the polling interval.
        boss.notifyWorker(this.workerIds[SEND_QUEUE]!);
      }
    });

    this.timer = setInterval(() => { void this.offerScan(); }, o.scanIntervalSeconds * 1000);
    this.timer.unref();
    await this.offerScan();
  }

  private async runScan(): Promise<void> {
    const boss = this.boss;
    if (!boss) return;
    const result = await this.deliveries.scan(this.options.clock());
    if (result.toSend.length) {
      await boss.insert(result.toSend.map((deliveryId) => ({
        name: SEND_QUEUE,
        data: { deliveryId },
        retryLimit: this.options.retryLimit,
        retryDelay: this.options.retryDelaySeconds,
        retryBackoff: true,
        expireInSeconds: this.options.sendExpireSeconds,
      })));
      boss.notifyWorker(this.workerIds[SEND_QUEUE]!);
    }
    if (this.options.log && (result.created || result.failedWatches)) {
      console.log(`Watch scan: ${result.created} new e-mail(s), ${result.toSend.length} to send, ${result.failedWatches} watch(es) failed, ${result.heldBackByCloud} held back by a cloud limit`);
    }
  }

  /** The periodic offer: at most one scan job per interval slot, whichever app copy offers first. */
  private async offerScan(): Promise<void> {
    try {
      await this.boss?.send(SCAN_QUEUE, {}, { singletonSeconds: this.options.scanIntervalSeconds, singletonKey: SCAN_KEY, expireInSeconds: SCAN_EXPIRE_SECONDS });
    } catch (error) {
      if (this.options.log) console.error('Watch scan could not be queued:', error instanceof Error ? error.message : error);
    }
  }

  /** Queues a scan now (outside the interval) and wakes the scan worker. */
  async scanNow(): Promise<void> {
    const boss = this.requireStarted();
    await boss.send(SCAN_QUEUE, {}, { singletonKey: SCAN_KEY, expireInSeconds: SCAN_EXPIRE_SECONDS });
    boss.notifyWorker(this.workerIds[SCAN_QUEUE]!);
  }

  /** Jobs not finished yet (queued, waiting for a retry, or running), per queue. */
  async pending(): Promise<{ scan: number; send: number }> {
    const boss = this.requireStarted();
    const [scan, send] = await Promise.all([
      boss.getQueueSize(SCAN_QUEUE, { before: 'completed' }),
      boss.getQueueSize(SEND_QUEUE, { before: 'completed' }),
    ]);
    return { scan, send };
  }

  /**
   * Resolves when no scan or send job is left, retries included (for tests and the demo).
   * @throws Error after `timeoutMs`
   */
  async drain(timeoutMs = 20_000): Promise<void> {
    const boss = this.requireStarted();
    const deadline = Date.now() + timeoutMs;
    for (;;) {
      const { scan, send } = await this.pending();
      if (scan === 0 && send === 0) return;
      if (Date.now() > deadline) throw new Error(`Watch jobs still pending after ${timeoutMs} ms (scan ${scan}, send ${send})`);
      for (const id of Object.values(this.workerIds)) boss.notifyWorker(id);
      await new Promise((r) => setTimeout(r, 100));
    }
  }

  private requireStarted(): PgBoss {
    if (!this.boss) throw new Error('The watch scheduler is not started');
    return this.boss;
  }

  /** Stops the periodic scan and the workers; running jobs get `timeoutMs` to finish. */
  async stop(timeoutMs = 10_000): Promise<void> {
    if (this.timer) clearInterval(this.timer);
    this.timer = undefined;
    await this.starting?.catch(() => undefined);
    const boss = this.boss;
    this.boss = undefined;
    this.starting = undefined;
    if (!boss) return;
    await boss.stop({ graceful: true, wait: true, timeout: timeoutMs });
  }
}

import { Inject, Injectable } from '@nestjs/common';
import type { Health } from '@shuntwise/contracts';
import { ENV, type Env } from '../config/env';
import { DatabaseProbe } from '../database/database-probe';
import { MailService } from '../mail/mail.service';
import { StorageService } from '../storage/storage.service';

const withTimeout = <T>(p: Promise<T>, ms: number, fallback: T): Promise<T> =>
  Promise.race([p, new Promise<T>((resolve) => setTimeout(() => resolve(fallback), ms).unref())]);

const DATABASE_TIMEOUT_MS = 3_000;
const PROBE_TIMEOUT_MS = 3_000;

interface Probe {
  up: boolean;
  at: number;
}

/**
 * Liveness and readiness. Liveness answers from memory. Readiness pings the database
 * (concurrent checks share one ping) and reports the object store and the mail server from
 * their last probe: those are probed in the background when the last result is older than
 * HEALTH_PROBE_SECONDS, so a load balancer polling often opens no SMTP or S3 connection per poll.
 */
@Injectable()
export class HealthService {
  private database?: Promise<boolean>;
  private readonly probes = new Map<'objectStore' | 'mail', { last?: Probe; running?: Promise<Probe> }>([
    ['objectStore', {}],
    ['mail', {}],
  ]);

  constructor(
    @Inject(ENV) private readonly env: Env,
    private readonly probe: DatabaseProbe,
    private readonly storage: StorageService,
    private readonly mail: MailService,
  ) {}

  live(): { status: 'up'; uptimeSeconds: number } {
    return { status: 'up', uptimeSeconds: Math.round(process.uptime()) };
  }

  async report(): Promise<Health> {
    const [database, objectStore, mail] = await Promise.all([this.pingDatabase(), this.cached('objectStore'), this.cached('mail')]);
    const up = (b: boolean) => (b ? 'up' : 'down') as 'up' | 'down';
    const status = !database ? 'down' : objectStore && mail ? 'ok' : 'degraded';
    return { status, services: { database: up(database), objectStore: up(objectStore), mail: up(mail) } };
  }

  private pingDatabase(): Promise<boolean> {
    this.database ??= withTimeout(
      this.probe.ping().then(
        () => true,
        () => false,
      ),
      DATABASE_TIMEOUT_MS,
      false,
    ).finally(() => (this.database = undefined));
    return this.database;
  }

  /** The last probe; a stale one starts a new probe in the background. Only the very first call waits. */
  private async cached(name: 'objectStore' | 'mail'): Promise<boolean> {
    const slot = this.probes.get(name)!;
    const fresh = slot.last && Date.now() - slot.last.at < this.env.HEALTH_PROBE_SECONDS * 1000;
    if (!fresh && !slot.running) {
      const check = name === 'mail' ? () => this.mail.isUp() : () => this.storage.isUp();
      slot.running = withTimeout(
        check().catch(() => false),
        PROBE_TIMEOUT_MS,
        false,
      )
        .then((up) => (slot.last = { up, at: Date.now() }))
        .finally(() => (slot.running = undefined));
    }
    if (slot.last) return slot.last.up;
    return (await slot.running!).up;
  }
}

import { randomBytes } from 'node:crypto';
import { hostname } from 'node:os';
import { Inject, Injectable, Logger, type OnApplicationBootstrap, type OnApplicationShutdown } from '@nestjs/common';
import { createTransport, type Transporter } from 'nodemailer';
import type { Transaction } from 'sequelize';
import { ENV, publicUrl, type Env } from '../config/env';
import { absoluteLinks } from './mail-links';
import type { OutgoingMail } from './outgoing-mail.model';
import { OutgoingMailRepository } from './outgoing-mail.repository';

export interface MailMessage {
  to: string[];
  subject: string;
  body: string;
  kind: string;
}

const MAX_ATTEMPTS = 50;
/** Messages one replica claims at a time. */
const CLAIM_BATCH = 20;

/**
 * Mail goes through the persisted outbox: `enqueue` writes a row inside the caller's
 * transaction; the dispatcher sends pending rows, retrying with back-off while the mail
 * server is away. A decision never waits for SMTP.
 *
 * Any number of API replicas share the outbox. A replica first claims a batch of due rows
 * in a short transaction (SELECT … FOR UPDATE SKIP LOCKED, then its id in `claimed_by` and
 * `next_attempt_at` moved to the end of a MAIL_CLAIM_SECONDS lease), commits, and only then
 * sends, renewing the lease on each message just before handing it to SMTP; each result is
 * written only while it still holds the claim. So two live replicas never send one message
 * (unless one SMTP hand-over alone takes longer than the lease). On a Galera cluster two nodes may lock the same row at once; the
 * certification then fails one claim at commit (a deadlock error), and that replica sends
 * nothing. A replica that dies mid-batch leaves its rows claimed until the lease ends; another
 * replica then sends them — a message that was already handed to the SMTP server when the
 * process died can go out twice (SMTP has no way to ask), which the Message-ID
 * (`<outbox-ID@…>`, the same on every attempt) lets a receiving system recognise.
 */
@Injectable()
export class MailService implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly logger = new Logger('Mail');
  private readonly transport: Transporter;
  private timer?: NodeJS.Timeout;
  /** Sent messages whose result the database has not taken yet (by outbox id). */
  private readonly unsettled = new Map<number, Record<string, unknown>>();
  private running?: Promise<number>;
  private again?: Promise<number>;

  /** This process's name in `claimed_by`. */
  readonly replicaId = `${hostname().slice(0, 40)}:${process.pid}:${randomBytes(3).toString('hex')}`;

  constructor(
    @Inject(ENV) private readonly env: Env,
    private readonly outbox: OutgoingMailRepository,
  ) {
    this.transport = createTransport({
      host: env.SMTP_HOST,
      port: env.SMTP_PORT,
      secure: env.SMTP_SECURE,
      ignoreTLS: !env.SMTP_SECURE,
      auth: env.SMTP_USER ? { user: env.SMTP_USER, pass: env.SMTP_PASSWORD ?? '' } : undefined,
      connectionTimeout: 3_000,
      greetingTimeout: 3_000,
      socketTimeout: 10_000,
    });
  }

  onApplicationBootstrap(): void {
    this.timer = setInterval(() => void this.flush().catch(() => undefined), this.env.MAIL_RETRY_SECONDS * 1000);
    this.timer.unref();
  }

  onApplicationShutdown(): void {
    if (this.timer) clearInterval(this.timer);
    this.transport.close();
  }

  /** Writes the message to the outbox in the caller's transaction; it is sent after commit. App paths in the body become absolute links (PUBLIC_URL). */
  async enqueue(message: MailMessage, transaction?: Transaction): Promise<OutgoingMail> {
    const recipients = [...new Set(message.to.map((t) => t.toLowerCase()))];
    const body = absoluteLinks(message.body, publicUrl(this.env));
    const row = await this.outbox.create({ recipients, subject: message.subject, body, kind: message.kind, nextAttemptAt: new Date() }, transaction);
    const kick = () => {
      setImmediate(() => void this.flush().catch(() => undefined));
    };
    if (transaction) transaction.afterCommit(kick);
    else kick();
    return row;
  }

  /**
   * Sends every due message; returns how many went out. One run at a time per process: a call
   * during a run gets one more run after it (shared by every call made meanwhile), so what was
   * committed before the call is always looked at.
   */
  flush(): Promise<number> {
    if (this.running) {
      this.again ??= this.running
        .catch(() => 0)
        .then(() => {
          this.again = undefined;
          return this.flush();
        });
      return this.again;
    }
    this.running = this.sendDue().finally(() => (this.running = undefined));
    return this.running;
  }

  async isUp(): Promise<boolean> {
    try {
      await this.transport.verify();
      return true;
    } catch {
      return false;
    }
  }

  /** Claims and sends batches until nothing is due (or the mail server refuses one). */
  private async sendDue(): Promise<number> {
    let sent = 0;
    // Results the database did not take last time (it went away between send and record) go in first:
    // those messages were handed to SMTP and must not be claimed and sent again.
    for (const [id, values] of this.unsettled) {
      await this.release(id, values);
      this.unsettled.delete(id);
    }
    for (;;) {
      const batch = await this.claim();
      if (!batch.length) return sent;
      const { delivered, refused } = await this.sendBatch(batch);
      sent += delivered;
      if (refused || batch.length < CLAIM_BATCH) return sent;
    }
  }

  /** Takes up to CLAIM_BATCH due rows for this replica; another replica's claim is skipped, never waited for. */
  private async claim(): Promise<OutgoingMail[]> {
    try {
      const now = new Date();
      return await this.outbox.claim(this.replicaId, CLAIM_BATCH, now, new Date(now.getTime() + this.env.MAIL_CLAIM_SECONDS * 1000));
    } catch (error) {
      // A claim that lost to another replica (Galera certification: a deadlock error) takes nothing this round.
      this.logger.debug(`outbox claim not taken: ${(error as Error).message}`);
      return [];
    }
  }

  private async sendBatch(batch: OutgoingMail[]): Promise<{ delivered: number; refused: boolean }> {
    let delivered = 0;
    for (const [index, mail] of batch.entries()) {
      // The lease is renewed per message, so a slow batch never outlives it: a message whose claim
      // ran out (another replica took it) is left to that replica.
      if (!(await this.renew(mail.id))) continue;
      try {
        await this.transport.sendMail({
          from: this.env.MAIL_FROM,
          to: mail.recipients,
          subject: mail.subject,
          text: mail.body,
          messageId: `<outbox-${mail.id}@${mailDomain(this.env.MAIL_FROM)}>`,
        });
      } catch (error) {
        const attempts = mail.attempts + 1;
        const delay = Math.min(this.env.MAIL_RETRY_SECONDS * 2 ** Math.min(attempts - 1, 6), 3600) * 1000;
        const next = new Date(Date.now() + delay);
        await this.release(mail.id, {
          attempts,
          last_error: String((error as Error).message ?? error).slice(0, 500),
          state: attempts >= MAX_ATTEMPTS ? 'failed' : 'pending',
          next_attempt_at: next,
        });
        // The server is probably away: the rest of the batch waits as long, without counting an attempt.
        for (const rest of batch.slice(index + 1)) await this.release(rest.id, { next_attempt_at: next });
        this.logger.warn(`mail ${mail.id} not sent (attempt ${attempts}): ${(error as Error).message}`);
        return { delivered, refused: true };
      }
      const result = { state: 'sent', sent_at: new Date(), attempts: mail.attempts + 1, last_error: null };
      let kept: boolean;
      try {
        kept = await this.release(mail.id, result);
      } catch (error) {
        this.unsettled.set(mail.id, result);
        throw error;
      }
      if (!kept)
        this.logger.warn(
          `mail ${mail.id} was sent after this replica's claim ran out (the send took longer than MAIL_CLAIM_SECONDS); another replica may send it again`,
        );
      delivered++;
    }
    return { delivered, refused: false };
  }

  /** Extends this replica's claim on one message by a full lease; false when it no longer holds it. */
  private renew(id: number): Promise<boolean> {
    return this.outbox.renew(id, this.replicaId, new Date(Date.now() + this.env.MAIL_CLAIM_SECONDS * 1000));
  }

  /** Writes a result and drops the claim, only while this replica still holds it; false when it no longer did. */
  private release(id: number, values: Record<string, unknown>): Promise<boolean> {
    return this.outbox.release(id, this.replicaId, values);
  }
}

/** The domain of the sender address, for Message-IDs. */
function mailDomain(from: string): string {
  return /@([^>\s]+)/.exec(from)?.[1] ?? 'shuntwise.local';
}

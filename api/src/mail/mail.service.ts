import { Inject, Injectable, Logger, type OnApplicationBootstrap, type OnApplicationShutdown } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { createTransport, type Transporter } from 'nodemailer';
import { Op, type Transaction } from 'sequelize';
import { ENV, publicUrl, type Env } from '../config/env';
import { absoluteLinks } from './mail-links';
import { OutgoingMail } from './outgoing-mail.model';

export interface MailMessage {
  to: string[];
  subject: string;
  body: string;
  kind: string;
}

const MAX_ATTEMPTS = 50;

/**
 * Mail goes through the persisted outbox: `enqueue` writes a row inside the caller's
 * transaction; the dispatcher sends pending rows, retrying with back-off while the mail
 * server is away. A decision never waits for SMTP.
 */
@Injectable()
export class MailService implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly logger = new Logger('Mail');
  private readonly transport: Transporter;
  private timer?: NodeJS.Timeout;
  private running?: Promise<number>;

  constructor(
    @Inject(ENV) private readonly env: Env,
    @InjectModel(OutgoingMail) private readonly outbox: typeof OutgoingMail,
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
    const row = await this.outbox.create(
      { recipients, subject: message.subject, body, kind: message.kind, nextAttemptAt: new Date() },
      { transaction },
    );
    const kick = () => {
      setImmediate(() => void this.flush().catch(() => undefined));
    };
    if (transaction) transaction.afterCommit(kick);
    else kick();
    return row;
  }

  /** Sends every due message; returns how many went out. Concurrent calls share one run. */
  flush(): Promise<number> {
    this.running ??= this.sendDue().finally(() => (this.running = undefined));
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

  private async sendDue(): Promise<number> {
    const due = await this.outbox.findAll({
      where: { state: 'pending', nextAttemptAt: { [Op.lte]: new Date() } },
      order: [['id', 'ASC']],
      limit: 50,
    });
    let sent = 0;
    for (const mail of due) {
      try {
        await this.transport.sendMail({ from: this.env.MAIL_FROM, to: mail.recipients, subject: mail.subject, text: mail.body });
        await mail.update({ state: 'sent', sentAt: new Date(), attempts: mail.attempts + 1, lastError: null });
        sent++;
      } catch (error) {
        const attempts = mail.attempts + 1;
        const delay = Math.min(this.env.MAIL_RETRY_SECONDS * 2 ** Math.min(attempts - 1, 6), 3600) * 1000;
        await mail.update({
          attempts,
          lastError: String((error as Error).message ?? error).slice(0, 500),
          state: attempts >= MAX_ATTEMPTS ? 'failed' : 'pending',
          nextAttemptAt: new Date(Date.now() + delay),
        });
        this.logger.warn(`mail ${mail.id} not sent (attempt ${attempts}): ${(error as Error).message}`);
        break; // the server is probably away; the rest waits for the next run
      }
    }
    return sent;
  }
}

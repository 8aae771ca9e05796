import type { AddressInfo } from 'node:net';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { RunningFake } from './s3-fake';

export interface ReceivedMail {
  from: string;
  to: string[];
  subject: string;
  text: string;
}

/** An SMTP server on loopback that accepts everything and hands each parsed message to `onMessage`. */
export async function startSmtpFake(options: { port: number; onMessage: (mail: ReceivedMail) => Promise<void> }): Promise<RunningFake> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    banner: 'Shuntwise local mail fake',
    size: 10 * 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          const envelopeTo = session.envelope.rcptTo.map((r) => r.address.toLowerCase());
          await options.onMessage({
            from: session.envelope.mailFrom ? session.envelope.mailFrom.address : (addresses(parsed.from)[0] ?? ''),
            to: envelopeTo.length ? envelopeTo : addresses(parsed.to),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
          });
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port, '127.0.0.1', () => resolve());
  });
  const port = (server.server.address() as AddressInfo).port;
  return {
    port,
    stop: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

function addresses(value: AddressObject | AddressObject[] | undefined): string[] {
  if (!value) return [];
  const list = Array.isArray(value) ? value : [value];
  return list.flatMap((a) => a.value.map((v) => (v.address ?? '').toLowerCase())).filter(Boolean);
}

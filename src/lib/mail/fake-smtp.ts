// A local SMTP server that accepts every message and keeps it as JSON, for `npm start` and the tests. Pure Node.
import { randomUUID } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { storeCaptured, type CapturedMail } from './captured';

export interface FakeSmtp {
  host: string;
  port: number;
  dir: string;
  close(): Promise<void>;
}

/** Largest message accepted (bytes); plenty for our templates. */
const MAX_MESSAGE = 5 * 1024 * 1024;

const addresses = (field: AddressObject | AddressObject[] | undefined): string[] =>
  (Array.isArray(field) ? field : field ? [field] : []).flatMap((a) => a.value.map((v) => v.address ?? '')).filter(Boolean);

/** Start the fake on 127.0.0.1 (port 0 picks a free one); each message is parsed and stored before it is acknowledged. */
export async function startFakeSmtp(opts: { dir: string; port?: number; host?: string; onMessage?: (mail: CapturedMail) => void }): Promise<FakeSmtp> {
  const host = opts.host ?? '127.0.0.1';
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    size: MAX_MESSAGE,
    logger: false,
    banner: 'Plumbline local mail catcher',
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const header = parsed.headers.get('x-plumbline-brand');
          const mail: CapturedMail = {
            id: randomUUID(),
            receivedAt: new Date().toISOString(),
            envelope: {
              from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
              to: session.envelope.rcptTo.map((r) => r.address),
            },
            from: addresses(parsed.from).join(', '),
            to: addresses(parsed.to),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : '',
            messageId: parsed.messageId ?? null,
            brandId: typeof header === 'string' ? header : null,
          };
          storeCaptured(opts.dir, mail);
          opts.onMessage?.(mail);
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(opts.port ?? 0, host, () => resolve());
  });
  const port = (server.server.address() as AddressInfo).port;
  return { host, port, dir: opts.dir, close: () => new Promise<void>((r) => server.close(() => r())) };
}

/**
 * A local SMTP server that keeps what it receives in memory. It stands in for the hosted
 * mail service in development and tests; the developer page lists its messages.
 */
import type { AddressInfo } from 'node:net';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { SinkMessage } from '@swardwise/domain';

export type { SinkMessage };

export interface MailSink {
  port: number;
  messages(): SinkMessage[];
  /** Resolves with the first message (new or already received) that matches. */
  waitFor(match: (m: SinkMessage) => boolean, timeoutMs?: number): Promise<SinkMessage>;
  clear(): void;
  close(): Promise<void>;
}

const KEEP = 500;

export async function startMailSink(options: { port?: number; host?: string } = {}): Promise<MailSink> {
  const received: SinkMessage[] = [];
  const waiters = new Set<(m: SinkMessage) => void>();
  let nextId = 1;

  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    banner: 'Swardwise development mail sink',
    size: 10 * 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const message: SinkMessage = {
            id: nextId++,
            receivedAt: new Date().toISOString(),
            from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : null,
          };
          received.push(message);
          if (received.length > KEEP) received.shift();
          for (const waiter of waiters) waiter(message);
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });

  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port ?? 0, options.host ?? '127.0.0.1', () => resolve());
  });
  const port = (server.server.address() as AddressInfo).port;

  return {
    port,
    messages: () => [...received].reverse(),
    waitFor(match, timeoutMs = 5000) {
      const already = received.find(match);
      if (already) return Promise.resolve(already);
      return new Promise((resolve, reject) => {
        const timer = setTimeout(() => {
          waiters.delete(check);
          reject(new Error(`no matching e-mail arrived within ${timeoutMs} ms`));
        }, timeoutMs);
        const check = (m: SinkMessage) => {
          if (!match(m)) return;
          clearTimeout(timer);
          waiters.delete(check);
          resolve(m);
        };
        waiters.add(check);
      });
    },
    clear: () => {
      received.length = 0;
    },
    close: () => new Promise((resolve) => server.close(() => resolve())),
  };
}

import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { Orm } from '../../db/orm';
import { OutboxMessageSchema } from './outbox-message.entity';

export interface CaptureServer {
  port: number;
  close(): Promise<void>;
}

function addresses(a: AddressObject | AddressObject[] | undefined): string {
  if (!a) return '';
  return (Array.isArray(a) ? a : [a]).map((x) => x.text).join(', ');
}

/**
 * A local SMTP server on loopback that stores every message it receives in the outbox table.
 * Used in development, in the demo and in tests instead of a real mail server.
 */
export async function startCaptureServer(orm: Orm, port = 0, log: (...a: unknown[]) => void = () => {}): Promise<CaptureServer> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    banner: 'Splitcase capture SMTP',
    size: 5 * 1024 * 1024,
    logger: false,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          const em = orm.em.fork();
          em.create(OutboxMessageSchema, {
            from: addresses(parsed.from).slice(0, 320),
            to: addresses(parsed.to).slice(0, 1000),
            subject: (parsed.subject ?? '(no subject)').slice(0, 500),
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : null,
          });
          await em.flush();
          callback();
        })
        .catch((err: Error) => {
          log('capture SMTP: could not store a message', err);
          callback(err);
        });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  server.on('error', (err) => log('capture SMTP error', err));
  const address = server.server.address();
  const actualPort = typeof address === 'object' && address ? address.port : port;
  return {
    port: actualPort,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

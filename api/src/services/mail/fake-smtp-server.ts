import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import type { Database } from '../../db/client';
import { outboxMessages } from '../../db/schema';
import { parseMimeMessage } from './parse-mime-message';

export interface FakeSmtpServer {
  port: number;
  /** SMTP URL for nodemailer; `ignoreTLS` because the fake offers no STARTTLS. */
  url: string;
  close(): Promise<void>;
}

/**
 * A local SMTP server that keeps every message in `outbox_messages` instead of delivering it,
 * so nothing leaves the machine. Listens on 127.0.0.1; if the port is busy it takes a free one.
 */
export async function startFakeSmtpServer(options: { db: Database; port: number }): Promise<FakeSmtpServer> {
  const server = new SMTPServer({
    // smtp-server's bundled certificate has expired, so TLS is off for this local-only fake.
    disabledCommands: ['STARTTLS'],
    authOptional: true,
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('end', () => {
        const mail = parseMimeMessage(Buffer.concat(chunks).toString('utf8'));
        const from = session.envelope.mailFrom ? session.envelope.mailFrom.address : '';
        const to = session.envelope.rcptTo.map((r) => r.address);
        options.db
          .insert(outboxMessages)
          .values({ from, to, subject: mail.subject, text: mail.text, html: mail.html })
          .then(
            () => callback(),
            (error: Error) => callback(error),
          );
      });
    },
  });
  const listen = (port: number) =>
    new Promise<void>((resolve, reject) => {
      const onError = (error: Error) => reject(error);
      server.server.once('error', onError);
      server.listen(port, '127.0.0.1', () => {
        server.server.off('error', onError);
        resolve();
      });
    });
  try {
    await listen(options.port);
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code !== 'EADDRINUSE') throw error;
    await listen(0);
  }
  const { port } = server.server.address() as AddressInfo;
  return {
    port,
    url: `smtp://127.0.0.1:${port}/?ignoreTLS=true`,
    close: () => new Promise((resolve) => server.close(() => resolve())),
  };
}

import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import type { Database } from '../../db/client';
import { outboxMessages } from '../../db/schema';
import { parseMimeMessage } from './parse-mime-message';

export interface FakeSmtpServer {
  port: number;
  /** The port asked for, when it was taken by another process and a free one was used instead. */
  takenPort?: number;
  /** SMTP URL for nodemailer; `ignoreTLS` because the fake offers no STARTTLS. */
  url: string;
  close(): Promise<void>;
}

/**
 * A local SMTP server that keeps every message in `outbox_messages` instead of delivering it,
 * so nothing leaves the machine. Listens on 127.0.0.1; if the port is busy it takes a free one.
 */
export async function startFakeSmtpServer(options: {
  db: Database;
  port: number;
  /** Errors after start-up (a client's broken connection); logged, never fatal. */
  onError?: (error: Error) => void;
}): Promise<FakeSmtpServer> {
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
  // smtp-server re-emits its socket's errors on itself: without a listener a taken port (a second
  // server on this machine) ends the process with an unhandled 'error' event and a stack trace.
  let onListenError: ((error: Error) => void) | undefined;
  server.on('error', (error: Error) => {
    if (onListenError) onListenError(error);
    else options.onError?.(error);
  });
  const listen = (port: number) =>
    new Promise<void>((resolve, reject) => {
      onListenError = reject;
      server.listen(port, '127.0.0.1', () => {
        onListenError = undefined;
        resolve();
      });
    }).finally(() => {
      onListenError = undefined;
    });
  let takenPort: number | undefined;
  try {
    await listen(options.port);
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code !== 'EADDRINUSE') throw error;
    takenPort = options.port;
    await listen(0);
  }
  const { port } = server.server.address() as AddressInfo;
  return {
    port,
    takenPort,
    url: `smtp://127.0.0.1:${port}/?ignoreTLS=true`,
    close: () => new Promise((resolve) => server.close(() => resolve())),
  };
}

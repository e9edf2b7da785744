import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import { parseMimeMessage } from '../../api/src/services/mail/parse-mime-message';

export interface CapturedMail {
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
  raw: string;
}

/** An SMTP server on a free port that keeps what it receives in memory, for mail tests. */
export async function startCapturingSmtp(): Promise<{
  url: string;
  messages: CapturedMail[];
  close(): Promise<void>;
}> {
  const messages: CapturedMail[] = [];
  const server = new SMTPServer({
    disabledCommands: ['STARTTLS'],
    authOptional: true,
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('end', () => {
        const raw = Buffer.concat(chunks).toString('utf8');
        messages.push({
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
          to: session.envelope.rcptTo.map((r) => r.address),
          raw,
          ...parseMimeMessage(raw),
        });
        callback();
      });
    },
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', () => resolve()));
  const { port } = server.server.address() as AddressInfo;
  return {
    url: `smtp://127.0.0.1:${port}/?ignoreTLS=true`,
    messages,
    close: () => new Promise((resolve) => server.close(() => resolve())),
  };
}

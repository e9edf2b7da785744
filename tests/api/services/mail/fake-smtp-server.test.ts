import { createServer, type Server } from 'node:net';
import nodemailer from 'nodemailer';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DatabaseHandle } from '../../../../api/src/db/client';
import { outboxMessages } from '../../../../api/src/db/schema';
import { startFakeSmtpServer } from '../../../../api/src/services/mail/fake-smtp-server';
import { createTestDatabase } from '../../../support/test-database';

let database: DatabaseHandle;
let occupier: Server;
let occupiedPort: number;

beforeAll(async () => {
  database = await createTestDatabase();
  // Another process (a second Driftcase server on this machine) already holds the port.
  occupier = createServer();
  await new Promise<void>((resolve) => occupier.listen(0, '127.0.0.1', () => resolve()));
  const address = occupier.address();
  occupiedPort = typeof address === 'object' && address ? address.port : 0;
});
afterAll(async () => {
  await new Promise((resolve) => occupier.close(resolve));
  await database.close();
});

describe('local fake SMTP server', () => {
  it('takes a free port when SMTP_FAKE_PORT is taken, says which, and still keeps mail', async () => {
    const errors: Error[] = [];
    const fake = await startFakeSmtpServer({
      db: database.db,
      port: occupiedPort,
      onError: (error) => errors.push(error),
    });
    try {
      expect(fake.takenPort).toBe(occupiedPort);
      expect(fake.port).not.toBe(occupiedPort);
      expect(fake.port).toBeGreaterThan(0);
      const transport = nodemailer.createTransport({ host: '127.0.0.1', port: fake.port, ignoreTLS: true });
      await transport.sendMail({
        from: 'driftcase@localhost',
        to: 'legal@driftcase.example',
        subject: 'port check',
        text: 'kept',
      });
      transport.close();
      const kept = await database.db.select().from(outboxMessages);
      expect(kept.map((m) => m.subject)).toEqual(['port check']);
      expect(errors).toEqual([]);
    } finally {
      await fake.close();
    }
  });
});

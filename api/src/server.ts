import path from 'node:path';
import { pino } from 'pino';
import { createApp } from './app';
import { loadConfig, PROJECT_ROOT } from './config';
import { assertAuditTriggers } from './db/check-audit-triggers';
import { openDatabase } from './db/client';
import { seedDemoData } from './seed/seed-demo';
import { startFakeSmtpServer } from './services/mail/fake-smtp-server';
import { ensureWebBuild, WEB_DIST } from './web-build';

async function main() {
  const config = loadConfig();
  const logger = pino({ level: config.logLevel });
  const database = await openDatabase(
    config.databaseUrl
      ? { kind: 'postgres', url: config.databaseUrl }
      : { kind: 'pglite-dir', dataDir: path.join(config.dataDir, 'pglite') },
  );
  logger.info({ kind: database.kind, dataDir: config.dataDir }, 'database ready');
  // A dropped or disabled trigger would let rows of the audit trail change without a trace here.
  await assertAuditTriggers(database.db).catch(async (error: unknown) => {
    await database.close();
    throw error;
  });
  await ensureWebBuild(logger);

  // Without SMTP_URL, mail goes to a local fake server whose messages the Outbox page shows.
  const fakeSmtp = config.smtpUrl
    ? undefined
    : await startFakeSmtpServer({
        db: database.db,
        port: config.smtpFakePort,
        onError: (error) => logger.warn({ err: error.message }, 'local fake SMTP server: connection error'),
      });
  if (fakeSmtp?.takenPort !== undefined) {
    logger.warn(
      `SMTP_FAKE_PORT ${fakeSmtp.takenPort} is taken (another server on this machine?); the local fake SMTP server uses port ${fakeSmtp.port} instead`,
    );
  }
  if (fakeSmtp) logger.info({ port: fakeSmtp.port }, 'local fake SMTP server keeps all mail for the Outbox');
  const app = createApp({
    db: database.db,
    config: fakeSmtp ? { ...config, smtpUrl: fakeSmtp.url } : config,
    logger,
    webDir: WEB_DIST,
  });
  const { services } = app.locals;
  services.mailQueue.start();
  // Reported, never deleted: the admin decides what happens to files no bundle row accounts for.
  const orphans = await services.evidenceOrphans.findOrphans();
  if (orphans.incoming.length || orphans.unrecorded.length) {
    logger.warn(
      { incoming: orphans.incoming.length, unrecorded: orphans.unrecorded.length },
      'files under DATA_DIR that no bundle accounts for (left by an interrupted upload?); listed for the admin at GET /api/evidence/orphans (admin), nothing was deleted',
    );
  }
  const resumedUploads = await services.bundles.finishInterruptedUploads();
  if (resumedUploads > 0)
    logger.warn(
      { resumedUploads },
      'finished reading uploads the last stop interrupted (originals were kept)',
    );
  const interrupted = await services.replays.failInterruptedReplays();
  if (interrupted > 0) logger.warn({ interrupted }, 'marked replays interrupted by the last stop as failed');
  if (
    config.demoSeed &&
    (await seedDemoData(services, { sampleDir: path.join(PROJECT_ROOT, 'sample-logs') }))
  ) {
    logger.info('seeded demo accounts, cases and sample bundles');
  }
  // Anchors every audit chain head outside the database now if the last checkpoint is a day old, then daily.
  const stopCheckpoints = await services.checkpoints.startDaily();
  const server = app.listen(config.port, config.host, () => {
    logger.info(`Driftcase is listening on http://localhost:${config.port}`);
  });

  let isStopping = false;
  const stop = async (signal: string) => {
    if (isStopping) return;
    isStopping = true;
    logger.info({ signal }, 'shutting down');
    stopCheckpoints();
    server.close();
    server.closeAllConnections();
    await app.locals.shutdown();
    await services.mailQueue.stop();
    await fakeSmtp?.close();
    await database.close();
    process.exit(0);
  };
  process.on('SIGINT', () => void stop('SIGINT'));
  process.on('SIGTERM', () => void stop('SIGTERM'));
}

main().catch((error: unknown) => {
  process.stderr.write(
    `Driftcase could not start: ${error instanceof Error ? error.message : String(error)}\n`,
  );
  process.exit(1);
});

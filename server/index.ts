import { createServer as createHttpServer, type Server } from 'node:http';
import { createServer as createHttpsServer } from 'node:https';
import { createDatabase } from '../db';
import { runMigrations } from '../db/migrate';
import { seedDemo } from '../db/seed';
import { createApp } from './app';
import { closeStudyPool } from './studies/study-pool';
import { ConfigError, loadConfig } from './config';
import { findingMailWorker } from './jobs/finding-mail-worker';
import { startMailQueue } from './jobs/mail-queue';
import { schedulePhotoSweep } from './jobs/photo-sweep';
import { startSmtpFake, type SmtpFake } from './mail/smtp-fake';
import { createMailer } from './mail/transport';
import { createLogger } from './middleware/request-log';
import { loadOrMakeCertificate } from './network/tls';
import { localPhotoStorage } from './storage/photo-storage';

/** Tells scripts/supervise.sh that restarting cannot help (sysexits' EX_CONFIG). */
const EXIT_CONFIG = 78;

async function main() {
  const config = loadConfig();
  const logger = createLogger(config);
  await runMigrations(config.databaseUrl);
  const database = createDatabase(config.databaseUrl);
  const storage = localPhotoStorage(config.uploadsDir);
  const smtpFake: SmtpFake | undefined = config.smtp.fake ? await startSmtpFake(config.smtp.port, config.smtp.host) : undefined;
  const mailer = createMailer(config.smtp);
  const mailQueue = await startMailQueue(config.databaseUrl);
  if (process.env.SEED_DEMO === '1' && (await seedDemo(database, storage, mailQueue, config.jwtSecret))) console.log('demo scenario loaded');
  await mailQueue.work(findingMailWorker({ db: database.db, mailer, storage, publicUrl: config.publicUrl }));
  const sweep = schedulePhotoSweep({ db: database.db, storage, logger, ...config.photoSweep });

  // Network mode speaks HTTPS itself: browsers allow the camera only in a secure context.
  const tls = config.network.tls ? await loadOrMakeCertificate(config.network.tls) : null;
  if (tls?.made) console.log(`made a certificate for ${[...tls.names.dns, ...tls.names.ips].join(', ')} (fingerprint ${tls.fingerprint})`);
  const { app } = createApp({ config, database, mailQueue, storage, smtpFake, logger, tls });
  const server: Server = (tls ? createHttpsServer({ key: tls.key, cert: tls.cert }, app) : createHttpServer(app)).listen(config.port, config.host, () => {
    console.log(`Pitchcard is up at ${config.publicUrl}${smtpFake ? ` (mail fake on SMTP port ${smtpFake.port}; received mail at ${config.publicUrl}/dev/mail)` : ''}`);
  });

  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`${signal}: draining`);
    // Stop taking requests, let the queue finish the job in hand, then close mail and the pool.
    // Bounded: a request still running after 10 s (a long study) is cut rather than holding the exit.
    setTimeout(() => server.closeAllConnections(), 10_000).unref();
    await new Promise<void>((resolve) => server.close(() => resolve()));
    await sweep.stop();
    await closeStudyPool();
    await mailQueue.stop();
    mailer.close();
    await smtpFake?.close();
    await database.close();
    process.exit(0);
  };
  process.on('SIGINT', () => void stop('SIGINT'));
  process.on('SIGTERM', () => void stop('SIGTERM'));
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(err instanceof ConfigError ? EXIT_CONFIG : 1);
});

import { createServer as createHttpServer, type Server } from 'node:http';
import { createServer as createHttpsServer } from 'node:https';
import { seedDemo } from './dev/seed';
import { createApp } from './app';
import { closeStudyPool } from './studies/study-pool';
import { startJobs } from './jobs/run-jobs';
import type { SmtpFake } from './mail/smtp-fake';
import { loadOrMakeCertificate } from './network/tls';
import { exitOnStartError, onStopSignal, openShared } from './start-up';

async function main() {
  const { config, logger, database, photos, mailQueue } = await openShared();
  const storage = photos.storage;
  // Loaded only when asked for: smtp-server is a development dependency, absent from a production install.
  const smtpFake: SmtpFake | undefined = config.smtp.fake
    ? await (await import('./mail/smtp-fake')).startSmtpFake(config.smtp.port, config.smtp.host)
    : undefined;
  if (
    process.env.SEED_DEMO === '1' &&
    (await seedDemo(database, storage, mailQueue, config.jwtSecret, { notice: true }))
  )
    console.log('demo scenario loaded');
  // RUN_JOBS=0: this process only enqueues; `npm run worker` sends the mail and sweeps the photos.
  const jobs = config.runJobs ? await startJobs({ config, db: database.db, storage, mailQueue, logger }) : null;

  // Network mode speaks HTTPS itself: browsers allow the camera only in a secure context.
  const tls = config.network.tls ? await loadOrMakeCertificate(config.network.tls) : null;
  if (tls?.made)
    console.log(
      `made a certificate for ${[...tls.names.dns, ...tls.names.ips].join(', ')} (fingerprint ${tls.fingerprint})`,
    );
  const { app } = createApp({ config, database, mailQueue, storage, smtpFake, logger, tls });
  const server: Server = (
    tls ? createHttpsServer({ key: tls.key, cert: tls.cert }, app) : createHttpServer(app)
  ).listen(config.port, config.host, () => {
    const notes = [
      smtpFake ? `mail fake on SMTP port ${smtpFake.port}; received mail at ${config.publicUrl}/dev/mail` : '',
      config.photoStore.kind === 's3' ? `photos in ${photos.where}` : '',
      jobs ? '' : 'jobs left to the worker',
    ].filter(Boolean);
    console.log(`Pitchcard is up at ${config.publicUrl}${notes.length ? ` (${notes.join('; ')})` : ''}`);
  });

  onStopSignal(async () => {
    // Stop taking requests, let the queue finish the job in hand, then close mail and the pool.
    // Bounded: a request still running after 10 s (a long study) is cut rather than holding the exit.
    setTimeout(() => server.closeAllConnections(), 10_000).unref();
    await new Promise<void>((resolve) => server.close(() => resolve()));
    await jobs?.stopSchedules();
    await closeStudyPool();
    await mailQueue.stop();
    jobs?.close();
    await smtpFake?.close();
    photos.close();
    await database.close();
  });
}

main().catch(exitOnStartError);

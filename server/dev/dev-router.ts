import { Router } from 'express';
import type { SmtpFake } from '../mail/smtp-fake';

/** Development only: what the local SMTP fake received, newest first. Never mounted in production. */
export function devRouter(fake: SmtpFake): Router {
  const r = Router();
  r.get('/mail', (_req, res) => {
    res.json([...fake.messages].reverse().map(({ id, from, to, subject, text, html, receivedAt, attachments }) => ({ id, from, to, subject, text, html, receivedAt, attachments })));
  });
  return r;
}

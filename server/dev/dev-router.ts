import { Router } from 'express';
import type { ReceivedMail, SmtpFake } from '../mail/smtp-fake';

const cidLink = /(["'(])cid:([^"')\s]+)/gi;

/**
 * The HTML to look at on the development mail page: each `cid:` link swapped for its inline part as a
 * data: URL, which the page's sandboxed frame can show (the frame has no origin of its own, so it could
 * not fetch a part from the API). Only the preview: `html` stays as the mail was sent.
 */
export function previewHtml(m: Pick<ReceivedMail, 'html' | 'parts'>): string {
  return m.html.replace(cidLink, (whole, quote: string, cid: string) => {
    const part = m.parts.find((p) => p.cid === cid);
    return part ? `${quote}data:${part.contentType};base64,${part.content.toString('base64')}` : whole;
  });
}

/** Development only: what the local SMTP fake received, newest first. Never mounted in production. */
export function devRouter(fake: SmtpFake): Router {
  const r = Router();
  r.get('/mail', (_req, res) => {
    res.json(
      [...fake.messages].reverse().map((m) => ({
        id: String(m.id),
        from: m.from,
        to: m.to,
        subject: m.subject,
        text: m.text,
        html: m.html,
        receivedAt: m.receivedAt,
        attachments: m.parts.map(({ cid, filename, contentType, disposition, size }) => ({
          cid,
          filename,
          contentType,
          disposition,
          size,
        })),
        previewHtml: previewHtml(m),
      })),
    );
  });
  return r;
}

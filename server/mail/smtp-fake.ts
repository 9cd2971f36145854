import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

/** One attached file as it arrived: `cid` is the Content-ID an inline image is named by in the HTML. */
export type ReceivedPart = {
  cid: string | null;
  filename: string | null;
  contentType: string;
  disposition: string | null;
  size: number;
  content: Buffer;
};

export type ReceivedMail = {
  id: number;
  from: string;
  to: string[];
  subject: string;
  text: string;
  /** The HTML as sent: inline images stay `cid:` links, as a mail client receives them. */
  html: string;
  attachments: number;
  parts: ReceivedPart[];
  receivedAt: string;
};
export type SmtpFake = {
  port: number;
  messages: ReceivedMail[];
  /** The next `n` messages are refused with a temporary failure (451), as a relay that is busy or down refuses them. */
  refuseNext: (n: number) => void;
  close: () => Promise<void>;
};

/**
 * A real SMTP server on loopback that keeps what it receives, for development and tests: the product
 * speaks SMTP to it exactly as it would to a real relay.
 */
export async function startSmtpFake(port: number, host = '127.0.0.1'): Promise<SmtpFake> {
  const messages: ReceivedMail[] = [];
  let refusing = 0;
  const server = new SMTPServer({
    disabledCommands: ['STARTTLS'],
    authOptional: true,
    logger: false,
    onData(stream, session, callback) {
      // keepCidLinks: by default the parser rewrites each cid: link into a data: URL, which showed the
      // mail as carrying its photo inline when it does not.
      simpleParser(stream, { keepCidLinks: true }).then(
        (mail) => {
          if (refusing > 0) {
            refusing--;
            return callback(Object.assign(new Error('try again later'), { responseCode: 451 }));
          }
          const to = session.envelope.rcptTo.map((r) => r.address);
          messages.push({
            id: messages.length + 1,
            from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
            to,
            subject: mail.subject ?? '',
            text: mail.text ?? '',
            html: typeof mail.html === 'string' ? mail.html : '',
            attachments: mail.attachments.length,
            parts: mail.attachments.map((a) => ({
              cid: a.cid ?? null,
              filename: a.filename ?? null,
              contentType: a.contentType,
              disposition: a.contentDisposition ?? null,
              size: a.size,
              content: a.content,
            })),
            receivedAt: new Date().toISOString(),
          });
          callback();
        },
        (err) => callback(err),
      );
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => resolve());
  });
  const address = server.server.address();
  return {
    port: typeof address === 'object' && address ? address.port : port,
    messages,
    refuseNext: (n) => {
      refusing = Math.max(0, Math.min(n, 100));
    },
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

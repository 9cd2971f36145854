import nodemailer, { type SendMailOptions } from 'nodemailer';
import type { Config } from '../config';

export type Mailer = { send: (msg: SendMailOptions) => Promise<void>; close: () => void };

export function createMailer(cfg: Config['smtp']): Mailer {
  // Loopback relays (and our fake) speak plain SMTP: ignoreTLS stops nodemailer trying STARTTLS.
  const transport = nodemailer.createTransport({
    host: cfg.host,
    port: cfg.port,
    secure: false,
    ignoreTLS: true,
    connectionTimeout: 5000,
    socketTimeout: 10000,
  });
  return {
    async send(msg) {
      await transport.sendMail({ from: cfg.from, ...msg });
    },
    close: () => transport.close(),
  };
}

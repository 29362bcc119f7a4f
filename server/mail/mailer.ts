import nodemailer from 'nodemailer';
import { AGENCY_HEADER } from './catcher';

export type OutgoingMail = {
  to: string;
  subject: string;
  text: string;
  html?: string;
  agencyId?: string;
};

export type Mailer = {
  send: (mail: OutgoingMail) => Promise<void>;
  usesCatcher: boolean;
  close: () => void;
};

export function createMailer(opts: { smtpUrl?: string; catcherPort?: number; from: string }): Mailer {
  const transport = opts.smtpUrl
    ? nodemailer.createTransport(opts.smtpUrl)
    : nodemailer.createTransport({ host: '127.0.0.1', port: opts.catcherPort, secure: false, ignoreTLS: true });
  return {
    usesCatcher: !opts.smtpUrl,
    async send(mail) {
      await transport.sendMail({
        from: opts.from,
        to: mail.to,
        subject: mail.subject,
        text: mail.text,
        html: mail.html,
        headers: mail.agencyId ? { [AGENCY_HEADER]: mail.agencyId } : undefined,
      });
    },
    close: () => transport.close(),
  };
}

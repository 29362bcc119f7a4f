import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { Db } from '../db/client';
import { caughtMail } from '../db/schema';

export const AGENCY_HEADER = 'x-wearcourse-agency';

export type MailCatcher = { port: number; close: () => Promise<void> };

// A local SMTP server on loopback that keeps every message in SQLite, so a
// desk install can show invitations and reset links without a real mail host.
export async function startMailCatcher(db: Db, port: number, log = true): Promise<MailCatcher> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    size: 2 * 1024 * 1024,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const to = Array.isArray(parsed.to) ? parsed.to.map((a) => a.text).join(', ') : (parsed.to?.text ?? '');
          const agencyHeader = parsed.headers.get(AGENCY_HEADER);
          db.insert(caughtMail)
            .values({
              agencyId: typeof agencyHeader === 'string' ? agencyHeader : null,
              fromAddress: parsed.from?.text ?? '',
              toAddress: to,
              subject: parsed.subject ?? '(no subject)',
              textBody: parsed.text ?? '',
              htmlBody: typeof parsed.html === 'string' ? parsed.html : null,
            })
            .run();
          if (log) console.log(`[mail catcher] "${parsed.subject}" to ${to}`);
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const address = server.server.address();
  const actualPort = typeof address === 'object' && address ? address.port : port;
  return {
    port: actualPort,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

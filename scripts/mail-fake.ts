/**
 * A local SMTP fake for development, the demo and the tests: listens on 127.0.0.1:SMTP_PORT
 * (default 2525), accepts every message (no TLS, no authentication: loopback only) and stores it in
 * MariaDB's captured_mail table, so the app stays stateless and tests read mail with SQL.
 *   tsx scripts/mail-fake.ts
 */
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../lib/platform/db';
import { env } from '../lib/platform/env';

const MAX_BYTES = 5 * 1024 * 1024;

const addressText = (value: AddressObject | AddressObject[] | undefined) =>
  (Array.isArray(value) ? value : value ? [value] : []).map((a) => a.text).join(', ');

const server = new SMTPServer({
  secure: false,
  disabledCommands: ['STARTTLS', 'AUTH'],
  authOptional: true,
  size: MAX_BYTES,
  banner: 'Evenload mail fake',
  onData(stream, session, callback) {
    const chunks: Buffer[] = [];
    stream.on('data', (chunk: Buffer) => chunks.push(chunk));
    stream.on('end', async () => {
      try {
        const raw = Buffer.concat(chunks).toString('utf8');
        const parsed = await simpleParser(raw);
        const envelopeTo = session.envelope.rcptTo.map((r) => r.address.toLowerCase()).join(',');
        const envelopeFrom = session.envelope.mailFrom ? session.envelope.mailFrom.address : null;
        await sequelize.query(
          'INSERT INTO captured_mail (message_id, envelope_from, envelope_to, subject, text_body, html_body, raw, received_at) VALUES (?,?,?,?,?,?,?,?)',
          {
            type: QueryTypes.INSERT,
            replacements: [parsed.messageId ?? null, envelopeFrom, envelopeTo, parsed.subject ?? null, parsed.text ?? null, typeof parsed.html === 'string' ? parsed.html : null, raw, new Date()],
          },
        );
        console.log(`[mail-fake] ${new Date().toISOString()} to ${envelopeTo || addressText(parsed.to)}: ${parsed.subject ?? '(no subject)'}`);
        callback();
      } catch (error) {
        console.error('[mail-fake] could not store a message', error);
        callback(new Error('The mail fake could not store the message'));
      }
    });
  },
});

server.on('error', (error) => console.error('[mail-fake] error', error));
server.listen(env.SMTP_PORT, '127.0.0.1', () => {
  console.log(`[mail-fake] listening on 127.0.0.1:${env.SMTP_PORT}, storing into ${env.DB_NAME} on port ${env.DB_PORT}`);
});

const stop = () => server.close(() => void sequelize.close().finally(() => process.exit(0)));
process.on('SIGTERM', stop);
process.on('SIGINT', stop);

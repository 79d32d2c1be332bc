#!/usr/bin/env node
// A local stand-in for a mail server: accepts every message over SMTP (no TLS, no sign-in) and
// writes each one as JSON into a folder, nothing else. For development (npm start) and tests.
//   node scripts/smtp-fake.mjs --port 2525 --dir .data/mail/dev
// Prints "smtp-fake listening on <port>" once it accepts connections (port 0 picks a free one).
import { mkdirSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { createRequire } from 'node:module';

const require = createRequire(new URL('../server/package.json', import.meta.url));
const { SMTPServer } = require('smtp-server');
const { simpleParser } = require('mailparser');

const arg = (name, fallback) => {
  const i = process.argv.indexOf(`--${name}`);
  return i > 0 ? process.argv[i + 1] : fallback;
};
const port = Number(arg('port', process.env.SMTP_PORT ?? '2525'));
const dir = resolve(arg('dir', process.env.MAIL_DIR ?? '.data/mail/dev'));
mkdirSync(dir, { recursive: true });
let count = 0;

const server = new SMTPServer({
  authOptional: true,
  disabledCommands: ['STARTTLS', 'AUTH'],
  size: 5 * 1024 * 1024,
  onData(stream, session, done) {
    simpleParser(stream)
      .then((mail) => {
        const name = `${new Date().toISOString().replace(/[:.]/g, '-')}-${process.pid}-${++count}.json`;
        const record = {
          receivedAt: new Date().toISOString(),
          envelope: { from: session.envelope.mailFrom?.address ?? null, to: session.envelope.rcptTo.map((r) => r.address) },
          from: mail.from?.text ?? null,
          to: mail.to ? [].concat(mail.to).map((a) => a.text) : [],
          subject: mail.subject ?? '',
          text: mail.text ?? '',
          html: mail.html || null,
        };
        writeFileSync(join(dir, name), JSON.stringify(record, null, 2));
        done();
      })
      .catch(done);
  },
});
server.on('error', (err) => console.error(`smtp-fake: ${err.message}`));
server.listen(port, '127.0.0.1', () => console.log(`smtp-fake listening on ${server.server.address().port}, writing to ${dir}`));
const stop = () => server.close(() => process.exit(0));
process.on('SIGTERM', stop);
process.on('SIGINT', stop);

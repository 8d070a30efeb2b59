// The local fake SMTP server for development and tests: accepts every message on loopback and
// stores it in PostgreSQL, where /dev/mailbox shows it. Never used when SMTP_URL points elsewhere.
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';
import postgres from 'postgres';

if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set');
const port = Number(process.env.MAIL_FAKE_PORT ?? 2526);
const sql = postgres(process.env.DATABASE_URL, { max: 2, onnotice: () => {} });

const server = new SMTPServer({
	authOptional: true,
	disabledCommands: ['STARTTLS'],
	banner: 'Stakeline local mail catcher',
	onData(stream, session, callback) {
		simpleParser(stream)
			.then(async (mail) => {
				const to = session.envelope.rcptTo.map((r) => r.address.toLowerCase()).join(', ');
				// The List-* headers as sent (unfolded), so tests can read a message's unsubscribe headers.
				const list = Object.fromEntries(
					mail.headerLines
						.filter((h) => h.key.startsWith('list-'))
						.map((h) => [
							h.key,
							h.line
								.slice(h.line.indexOf(':') + 1)
								.replace(/\r?\n[ \t]+/g, ' ')
								.trim()
						])
				);
				await sql`
					INSERT INTO dev_mail ("from", "to", subject, text, html, headers)
					VALUES (${session.envelope.mailFrom ? session.envelope.mailFrom.address : ''}, ${to},
						${mail.subject ?? ''}, ${mail.text ?? ''}, ${typeof mail.html === 'string' ? mail.html : null},
						${Object.keys(list).length ? sql.json(list) : null})`;
				callback();
			})
			.catch((err) => callback(err));
	}
});

server.on('error', (err) => console.error('mail fake:', err.message));
server.listen(port, '127.0.0.1', () => console.log(`Fake SMTP server on 127.0.0.1:${port}`));

const shutdown = () => server.close(() => sql.end().then(() => process.exit(0)));
process.on('SIGTERM', shutdown);
process.on('SIGINT', shutdown);

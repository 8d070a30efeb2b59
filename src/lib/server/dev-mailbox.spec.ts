import { describe, expect, it } from 'vitest';
import { mailboxOpen } from './dev-mailbox';

const local = new URL('http://127.0.0.1:3000/dev/mailbox');
const dev = { MAIL_FAKE: '1', NODE_ENV: 'development' };

describe('the development mailbox', () => {
	it('answers a local client of a local run with the fake mail server', () => {
		expect(mailboxOpen(local, '127.0.0.1', dev, true)).toBe(true);
		expect(mailboxOpen(new URL('http://localhost:5173/dev/mailbox'), '::1', {}, true)).toBe(false); // no fake mail server
	});

	it('does not exist in a build made without it, in production, or behind a proxy', () => {
		expect(mailboxOpen(local, '127.0.0.1', dev, false)).toBe(false); // npm run build
		expect(mailboxOpen(local, '127.0.0.1', { ...dev, NODE_ENV: 'production' }, true)).toBe(false);
		// A reverse proxy on the same host connects from loopback, but ORIGIN names the public address.
		expect(mailboxOpen(new URL('https://stakeline.example/dev/mailbox'), '127.0.0.1', dev, true)).toBe(false);
		expect(mailboxOpen(local, '192.168.1.20', dev, true)).toBe(false);
	});
});

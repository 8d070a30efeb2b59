const LOOPBACK_CLIENT = /^(127\.|::1$|::ffff:127\.)/;
const LOOPBACK_HOST = /^(127\.\d+\.\d+\.\d+|localhost|\[::1\])$/;

type MailboxEnv = { MAIL_FAKE?: string; NODE_ENV?: string };

/**
 * Whether /dev/mailbox may answer. It holds working sign-in links, so it exists only where nothing
 * but this machine can reach it: compiled in only for the dev server and the builds npm start /
 * npm test make with the fake mail server (`compiledIn`, vite.config.ts); then only while that
 * server runs (MAIL_FAKE=1), outside NODE_ENV=production, for an app whose public address (ORIGIN,
 * hence `url`) is loopback — a proxy in front means a public ORIGIN — and a loopback client.
 */
export function mailboxOpen(url: URL, client: string, env: MailboxEnv, compiledIn: boolean): boolean {
	return compiledIn && env.MAIL_FAKE === '1' && env.NODE_ENV !== 'production' && LOOPBACK_HOST.test(url.hostname) && LOOPBACK_CLIENT.test(client);
}

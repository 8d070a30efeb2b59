import type { Handle, ServerInit } from '@sveltejs/kit';
import { requestHandle, serverErrorHandler } from '$lib/server/requests';
import { sequence } from '@sveltejs/kit/hooks';
import { readerLocale, TIME_ZONE_COOKIE, validTimeZone } from '$lib/reader';
import { building } from '$app/environment';
import { env } from '$env/dynamic/private';
import * as auth from '$lib/server/auth';
import { startWorker, SWEEP_ON_START } from '$lib/server/jobs';
import { ensureAdmin } from '$lib/server/users';
import { client, db } from '$lib/server/db';
import { csrfHandle } from '$lib/server/csrf';

export const init: ServerInit = async () => {
	if (building) return;
	await ensureAdmin(env.ADMIN_EMAIL, env.ADMIN_PASSWORD);
	// The job worker (mail, curing reminders, the hourly credential and respond-by sweep, link purge)
	// runs in every app server; each job is taken by one of them (src/lib/server/jobs).
	const worker = await startWorker({ origin: env.ORIGIN ?? `http://${env.HOST ?? '127.0.0.1'}:${env.PORT ?? '3000'}` });
	await db.execute(SWEEP_ON_START);
	// Let jobs already running finish before the pool closes.
	process.on('sveltekit:shutdown', () => void worker.stop().finally(() => client.end({ timeout: 5 })));
};

/** The reader's locale (Accept-Language) and time zone (the browser's cookie, else UTC), for dates. */
const handleReader: Handle = ({ event, resolve }) => {
	event.locals.reader = {
		locale: readerLocale(event.request.headers.get('accept-language')),
		timeZone: validTimeZone(event.cookies.get(TIME_ZONE_COOKIE))
	};
	return resolve(event);
};

const handleAuth: Handle = async ({ event, resolve }) => {
	const token = event.cookies.get(auth.sessionCookieName);
	if (!token) {
		event.locals.user = null;
		event.locals.session = null;
		return resolve(event);
	}
	const { session, user } = await auth.validateSessionToken(token);
	if (session) auth.setSessionTokenCookie(event, token, session.expiresAt);
	else auth.deleteSessionTokenCookie(event);
	event.locals.user = user;
	event.locals.session = session;
	return resolve(event);
};

const securityHeaders: Handle = async ({ event, resolve }) => {
	// Fonts preloaded with the page's scripts and styles (SvelteKit's default leaves them out), so the
	// text is set in Nunito from the first paint instead of reflowing when it arrives. Only the woff2
	// files: every browser that reads preload headers takes those, so the woff fallbacks would be fetched for nothing.
	const response = await resolve(event, { preload: ({ type, path }) => type === 'js' || type === 'css' || (type === 'font' && path.endsWith('.woff2')) });
	// Only over HTTPS, or a plain-HTTP local run would be told to use HTTPS it does not have.
	if (event.url.protocol === 'https:') response.headers.set('Strict-Transport-Security', 'max-age=31536000; includeSubDomains');
	response.headers.set('X-Content-Type-Options', 'nosniff');
	response.headers.set('Referrer-Policy', 'strict-origin-when-cross-origin');
	response.headers.set('X-Frame-Options', 'DENY');
	response.headers.set('Permissions-Policy', 'camera=(), microphone=(), geolocation=()');
	return response;
};

// Request log and the database-down 503 come first, so they see every other hook's outcome.
export const handle = sequence(requestHandle(), csrfHandle, handleReader, handleAuth, securityHeaders);
export const handleError = serverErrorHandler();

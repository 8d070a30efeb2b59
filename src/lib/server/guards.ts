import { error, redirect, type RequestEvent } from '@sveltejs/kit';
import { roleHome, type Role } from '$lib/roles';
import type { SessionUser } from './auth';

export const homeFor = (role: Role) => roleHome[role].href;

const BASE = 'http://stakeline.invalid';

/**
 * Only same-site paths may be redirected to after sign-in. The target is normalised the way a
 * browser would read it (dot segments, percent-decoding by the query parser) and the result must
 * still be a plain path: "/.//evil.example" normalises to "//evil.example", another site.
 */
export function safeRedirect(target: string | null | undefined, fallback: string): string {
	// Browsers drop tabs and newlines and read "\" as "/", so "/\t/evil.example" would leave the site.
	// eslint-disable-next-line no-control-regex -- refusing control characters is this test's job
	if (!target || !target.startsWith('/') || /[\s\\\u0000-\u001f\u007f]/.test(target)) return fallback;
	let url: URL;
	try {
		url = new URL(target, BASE);
	} catch {
		return fallback;
	}
	const path = url.pathname + url.search + url.hash;
	if (url.origin !== BASE || path.startsWith('//') || new URL(path, BASE).origin !== BASE) return fallback;
	return path;
}

/** Signed-out visitors go to sign in and come back here afterwards. */
export function requireUser(event: Pick<RequestEvent, 'locals' | 'url'>): SessionUser {
	const user = event.locals.user;
	if (!user) {
		const back = event.url.pathname + event.url.search;
		redirect(303, `/signin?redirectTo=${encodeURIComponent(back)}`);
	}
	return user;
}

export function requireRole(event: Pick<RequestEvent, 'locals' | 'url'>, role: Role): SessionUser {
	const user = requireUser(event);
	if (user.role !== role) error(403, `This part of Stakeline is for ${role === 'admin' ? 'administrators' : `${role}s`}.`);
	return user;
}

import { error, redirect, type RequestEvent } from '@sveltejs/kit';
import { roleHome, type Role } from '$lib/roles';
import type { SessionUser } from './auth';

export const homeFor = (role: Role) => roleHome[role].href;

/** Only same-site paths may be redirected to after sign-in. */
export function safeRedirect(target: string | null | undefined, fallback: string): string {
	// Browsers drop tabs and newlines and read "\\" as "/", so "/\t/evil.example" would leave the site.
	if (!target || !target.startsWith('/') || /[\s\\]/.test(target)) return fallback;
	const url = new URL(target, 'http://stakeline.invalid');
	return url.origin === 'http://stakeline.invalid' ? url.pathname + url.search + url.hash : fallback;
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

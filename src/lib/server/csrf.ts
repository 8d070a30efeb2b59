// The same-origin check for form posts, done here instead of by SvelteKit (svelte.config.js sets
// csrf.trustedOrigins to ['*'] to hand it over) for one reason: a mail program's one-click
// unsubscribe (RFC 8058) POSTs to the stop link from no page at all, without an Origin header, and
// SvelteKit's own check refuses that. Every other form post is checked exactly as SvelteKit does.
import { json, text, type Handle } from '@sveltejs/kit';

/**
 * Paths that take a form post from anywhere: they read no cookie and act only on a signed token in
 * the address, so a cross-site post can do nothing the link's holder could not.
 */
export const CROSS_SITE_POSTS = new Set(['/reminders/stop']);

// SvelteKit's list, with its own binary form encoding (what a remote form function sends).
const FORM_TYPES = ['application/x-www-form-urlencoded', 'multipart/form-data', 'text/plain', 'application/x-sveltekit-formdata'];
const WRITES = ['POST', 'PUT', 'PATCH', 'DELETE'];

/** Whether SvelteKit would call this a form submission (its is_form_content_type). */
export function isFormContentType(request: Request): boolean {
	// No content type (a DELETE without a body) is no form: no browser form can send one.
	const type = request.headers.get('content-type')?.split(';', 1)[0].trim().toLowerCase() ?? '';
	return FORM_TYPES.includes(type);
}

/** The refusal for a cross-site form post, or null when the request may go on. */
export function crossSiteRefusal(request: Request, url: URL): Response | null {
	if (!WRITES.includes(request.method) || !isFormContentType(request)) return null;
	if (request.headers.get('origin') === url.origin || CROSS_SITE_POSTS.has(url.pathname)) return null;
	const message = `Cross-site ${request.method} form submissions are forbidden`;
	return request.headers.get('accept') === 'application/json' ? json({ message }, { status: 403 }) : text(message, { status: 403 });
}

export const csrfHandle: Handle = ({ event, resolve }) => crossSiteRefusal(event.request, event.url) ?? resolve(event);

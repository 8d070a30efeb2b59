import { error, json } from '@sveltejs/kit';
import type { z } from 'zod';
import type { Role } from '$lib/roles';
import type { SessionUser } from './auth';

export type ApiError = { path: string; message: string };

/** 400 with the same `{ errors: [{ path, message }] }` body every JSON route uses. */
export const badRequest = (errors: ApiError[]) => json({ errors }, { status: 400 });

/** JSON routes answer 401 rather than redirecting to the sign-in page. */
export function requireApiRole(locals: App.Locals, role: Role): SessionUser {
	if (!locals.user) error(401, 'Sign in first.');
	if (locals.user.role !== role) error(403, `Only ${role}s can do this.`);
	return locals.user;
}

/** Reads and validates a JSON body; returns the parsed data or the 400 response to send. */
export async function readBody<S extends z.ZodType>(request: Request, schema: S): Promise<{ data: z.output<S> } | { response: Response }> {
	let raw: unknown;
	try {
		raw = await request.json();
	} catch {
		return { response: badRequest([{ path: '', message: 'The body must be JSON.' }]) };
	}
	const bad = unsafeText(raw);
	if (bad) return { response: badRequest([bad]) };
	const parsed = schema.safeParse(raw);
	if (!parsed.success) return { response: badRequest(parsed.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message }))) };
	return { data: parsed.data };
}

/** A NUL or a lone UTF-16 surrogate: PostgreSQL cannot store either, and no person types them. */
// eslint-disable-next-line no-control-regex -- finding NUL is this pattern's job
export const UNSAFE_CHAR = /\u0000|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;
const UNSAFE_MESSAGE = 'Text must not contain NUL characters or unpaired surrogates.';

/**
 * The first string (or key) in a parsed body holding such a character, as the 400 error to send;
 * walked without recursion, so a deeply nested body cannot overflow the stack.
 */
export function unsafeText(value: unknown): ApiError | null {
	const stack: [unknown, string][] = [[value, '']];
	while (stack.length) {
		const [v, path] = stack.pop()!;
		if (typeof v === 'string') {
			if (UNSAFE_CHAR.test(v)) return { path, message: UNSAFE_MESSAGE };
		} else if (v && typeof v === 'object') {
			for (const [k, child] of Object.entries(v)) {
				const at = path ? `${path}.${k}` : k;
				if (UNSAFE_CHAR.test(k)) return { path: at, message: UNSAFE_MESSAGE };
				stack.push([child, at]);
			}
		}
	}
	return null;
}

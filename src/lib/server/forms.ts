import { fail } from '@sveltejs/kit';
import { z } from 'zod';
import type { FieldErrors } from '$lib/form-failure';
import { unsafeText } from './api';

export type { FieldErrors };

/** Fields never echoed back into a re-rendered form. */
const SECRET = /password|current|token/i;

/**
 * Validates a submitted form with the shared zod schema. On bad input, returns the `fail(400)`
 * the action should return: a message per field, the typed values minus passwords.
 */
export async function parseForm<S extends z.ZodType>(request: Request, schema: S) {
	return validateForm(await request.formData(), schema);
}

/**
 * The same for form data already read (a multipart form whose files the action needs too).
 * Keys in `lists` (checkbox groups) reach the schema as arrays and are echoed back joined by spaces.
 */
export function validateForm<S extends z.ZodType>(form: FormData, schema: S, lists: string[] = []) {
	const raw: Record<string, string | string[]> = Object.fromEntries(
		[...form.entries()].filter(([k, v]) => typeof v === 'string' && !lists.includes(k))
	) as Record<string, string>;
	for (const key of lists) raw[key] = form.getAll(key).filter((v): v is string => typeof v === 'string');
	const values = Object.fromEntries(
		Object.entries(raw)
			.filter(([k]) => !SECRET.test(k))
			.map(([k, v]) => [k, Array.isArray(v) ? v.join(' ') : v])
	) as Record<string, string>;
	// NUL and lone surrogates never reach a schema or the database (both would fail deep inside).
	const bad = unsafeText(raw);
	if (bad) return { data: null, values, failure: fail(400, { errors: { [bad.path.split('.')[0] || 'form']: bad.message }, values, message: bad.message }) };
	const parsed = schema.safeParse(raw);
	if (parsed.success) return { data: parsed.data as z.output<S>, values, failure: null };
	const errors: FieldErrors = {};
	for (const issue of parsed.error.issues) {
		const key = String(issue.path[0] ?? 'form');
		errors[key] ??= issue.message;
	}
	return { data: null, values, failure: fail(400, { errors, values, message: 'Please correct the fields marked below.' }) };
}

/** A 400 with one message, the values kept. */
export function formError(values: Record<string, string>, message: string, errors: FieldErrors = {}, status = 400) {
	return fail(status, { errors, values, message });
}

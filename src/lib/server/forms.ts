import { fail } from '@sveltejs/kit';
import { z } from 'zod';

export type FieldErrors = Record<string, string | undefined>;

/** Fields never echoed back into a re-rendered form. */
const SECRET = /password|current|token/i;

/**
 * Validates a submitted form with the shared zod schema. On bad input, returns the `fail(400)`
 * the action should return: a message per field, the typed values minus passwords.
 */
export async function parseForm<S extends z.ZodType>(request: Request, schema: S) {
	const form = await request.formData();
	const raw = Object.fromEntries([...form.entries()].filter(([, v]) => typeof v === 'string')) as Record<string, string>;
	const values = Object.fromEntries(Object.entries(raw).filter(([k]) => !SECRET.test(k)));
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

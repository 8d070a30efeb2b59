import { describe, expect, it } from 'vitest';
import { signUpSchema } from '$lib/schemas/account';
import { parseForm } from './forms';

const post = (fields: Record<string, string>) => new Request('http://x/', { method: 'POST', body: new URLSearchParams(fields) });

describe('parseForm', () => {
	it('returns the parsed data for good input', async () => {
		const r = await parseForm(post({ name: ' Ana ', email: 'Ana@Example.org ', password: 'ten-chars-ok', role: 'homeowner' }), signUpSchema);
		expect(r.failure).toBeNull();
		expect(r.data).toEqual({ name: 'Ana', email: 'Ana@Example.org', password: 'ten-chars-ok', role: 'homeowner' });
	});

	it('fails with status 400, a message per field and the values minus the password', async () => {
		const r = await parseForm(post({ name: '', email: 'nope', password: 'short', role: 'landlord' }), signUpSchema);
		expect(r.data).toBeNull();
		expect(r.failure?.status).toBe(400);
		const body = r.failure!.data;
		expect(body.errors).toEqual({
			name: 'Enter your name.',
			email: 'That does not look like an e-mail address.',
			password: 'Use at least 10 characters.',
			role: 'Choose how you will use Stakeline.'
		});
		expect(body.values).toEqual({ name: '', email: 'nope', role: 'landlord' });
	});
});

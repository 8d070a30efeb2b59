import { describe, expect, it } from 'vitest';
import { hashPassword, verifyPassword } from './password';

describe('passwords', () => {
	it('hash with argon2id and verify only the right password', async () => {
		const hash = await hashPassword('patio-before-june');
		expect(hash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/); // PHC string format, RFC 9106 argon2id
		expect(hash).not.toContain('patio-before-june');
		expect(await verifyPassword(hash, 'patio-before-june')).toBe(true);
		expect(await verifyPassword(hash, 'patio-before-July')).toBe(false);
	});

	it('salt every hash', async () => {
		expect(await hashPassword('same')).not.toBe(await hashPassword('same'));
	});

	it('treat a malformed stored hash as a failed check, not a crash', async () => {
		expect(await verifyPassword('not-a-hash', 'anything')).toBe(false);
	});
});

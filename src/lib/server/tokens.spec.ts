import { describe, expect, it } from 'vitest';
import { generateToken, hashToken } from './tokens';

describe('tokens', () => {
	it('are 160 random bits in URL-safe base64, never repeating', () => {
		const tokens = new Set(Array.from({ length: 200 }, generateToken));
		expect(tokens.size).toBe(200);
		for (const t of tokens) expect(t).toMatch(/^[A-Za-z0-9_-]{27}=?$/); // 20 bytes → 27 chars (RFC 4648 §5)
	});

	it('are stored as their SHA-256 in hex', () => {
		// FIPS 180-2 Appendix B.1 test vector: SHA-256("abc")
		expect(hashToken('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
		expect(hashToken(generateToken())).toMatch(/^[0-9a-f]{64}$/);
	});
});

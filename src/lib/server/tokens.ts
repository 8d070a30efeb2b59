import { sha256 } from '@oslojs/crypto/sha2';
import { encodeBase64url, encodeHexLowerCase } from '@oslojs/encoding';

/** 160 random bits, URL-safe: for cookies and one-time links alike. */
export function generateToken(): string {
	return encodeBase64url(crypto.getRandomValues(new Uint8Array(20)));
}

/** What the database keeps instead of a token: its SHA-256, hex. */
export function hashToken(token: string): string {
	return encodeHexLowerCase(sha256(new TextEncoder().encode(token)));
}

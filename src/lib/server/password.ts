import { hash, verify } from '@node-rs/argon2';

// argon2id with the OWASP-recommended minimum (19 MiB, 2 passes). No $lib imports: scripts/seed.ts uses it too.
const options = { memoryCost: 19456, timeCost: 2, outputLen: 32, parallelism: 1 };

export function hashPassword(password: string): Promise<string> {
	return hash(password, options);
}

let dummy: Promise<string> | undefined;
/** A hash of nothing anyone knows, made once, for checks against accounts that do not exist. */
export const dummyHash = () => (dummy ??= hashPassword(crypto.randomUUID()));

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
	try {
		return await verify(passwordHash, password);
	} catch {
		return false; // a malformed stored hash is a failed sign-in, not a crash
	}
}

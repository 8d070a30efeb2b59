import { and, eq, gt, isNull, sql } from 'drizzle-orm';
import { db } from '$lib/server/db';
import { emailToken, type TokenPurpose } from '$lib/server/db/schema';
import { generateToken, hashToken } from './tokens';

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

const HOUR_MS = 60 * 60 * 1000;
export const TOKEN_LIFETIME_MS: Record<TokenPurpose, number> = {
	verify_email: 48 * HOUR_MS,
	reset_password: HOUR_MS,
	sign_in: HOUR_MS / 4,
	change_email: 48 * HOUR_MS
};

/** A new one-time link token; earlier unused ones of the same purpose stop working. */
export async function createEmailToken(userId: string, purpose: TokenPurpose, { tx: inTx, newEmail }: { tx?: Tx; newEmail?: string } = {}): Promise<string> {
	const token = generateToken();
	const run = (fn: (tx: Tx) => Promise<void>) => (inTx ? fn(inTx) : db.transaction(fn));
	await run(async (tx) => {
		await tx
			.update(emailToken)
			.set({ usedAt: new Date() })
			.where(and(eq(emailToken.userId, userId), eq(emailToken.purpose, purpose), isNull(emailToken.usedAt)));
		await tx.insert(emailToken).values({
			id: hashToken(token),
			userId,
			purpose,
			newEmail: newEmail ?? null,
			expiresAt: new Date(Date.now() + TOKEN_LIFETIME_MS[purpose])
		});
	});
	return token;
}

function usable(token: string, purpose: TokenPurpose) {
	return and(eq(emailToken.id, hashToken(token)), eq(emailToken.purpose, purpose), isNull(emailToken.usedAt), gt(emailToken.expiresAt, new Date()));
}

/** The user a still-valid token belongs to, without using it up (to show the reset form). */
export async function peekEmailToken(token: string, purpose: TokenPurpose): Promise<string | null> {
	const [row] = await db.select({ userId: emailToken.userId }).from(emailToken).where(usable(token, purpose));
	return row?.userId ?? null;
}

/** Uses the token up in one statement, so two clicks cannot both succeed. */
export async function consumeEmailToken(token: string, purpose: TokenPurpose): Promise<string | null> {
	const [row] = await db.update(emailToken).set({ usedAt: new Date() }).where(usable(token, purpose)).returning({ userId: emailToken.userId });
	return row?.userId ?? null;
}

/** Uses up a change-of-address token: the account and the address it moves to. */
export async function consumeEmailChangeToken(token: string): Promise<{ userId: string; newEmail: string } | null> {
	const [row] = await db
		.update(emailToken)
		.set({ usedAt: new Date() })
		.where(usable(token, 'change_email'))
		.returning({ userId: emailToken.userId, newEmail: emailToken.newEmail });
	return row?.newEmail ? { userId: row.userId, newEmail: row.newEmail } : null;
}

/** Open links of one purpose stop working (a new password ends a pending change of address). */
export async function expireEmailTokens(userId: string, purpose: TokenPurpose) {
	await db
		.update(emailToken)
		.set({ usedAt: new Date() })
		.where(and(eq(emailToken.userId, userId), eq(emailToken.purpose, purpose), isNull(emailToken.usedAt)));
}

/**
 * One-time links do not outlive their sending: once a message has left the outbox (sent, or given
 * up), its `token=` values are blanked, so the table and its backups hold no working link.
 */
export async function purgeSentLinks(): Promise<number> {
	const rows = await db.execute(sql`
		UPDATE mail_outbox
		SET text = regexp_replace(text, 'token=[A-Za-z0-9_-]+', 'token=removed', 'g'),
			html = regexp_replace(html, 'token=[A-Za-z0-9_-]+', 'token=removed', 'g')
		WHERE status <> 'pending' AND text ~ 'token=[A-Za-z0-9_-]{10,}'
		RETURNING id`);
	return rows.length;
}

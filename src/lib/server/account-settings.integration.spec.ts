// Integration tests on the real PostgreSQL test database (npm test creates it fresh).
import { describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { mailKinds, mailKindsFor } from '$lib/mail-kinds';
import { db } from './db';
import { auditLog, devMail, mailOutbox, session, user } from './db/schema';
import { AccessRefused, setAccountDisabled } from './account-access';
import { createSession, generateSessionToken, validateSessionToken } from './auth';
import { queueMail } from './mail';
import { newMessageMail, newBidMail } from './mail/pro-notices';
import { resetPasswordMail } from './mail/templates';
import { confirmEmailChange, createUser, EmailChangeRefused, requestEmailChange, setMailOptOut, setPassword } from './users';
import { uniqueEmail as unique, useTestDatabase } from './integration-setup';

const origin = 'http://stakeline.test';
/** The link's token as the fake mailbox received it (the outbox copy is blanked once sent). */
async function tokenSentTo(to: string) {
	let text = '';
	// The mail worker sends within a second or so; a loaded machine can take longer.
	await expect.poll(async () => (text = (await db.select().from(devMail).where(eq(devMail.to, to)))[0]?.text ?? ''), { timeout: 15_000 }).toMatch(/token=/);
	return /token=([A-Za-z0-9_=-]+)/.exec(text)![1];
}
const outboxTo = (to: string) =>
	db.select({ subject: mailOutbox.subject, text: mailOutbox.text }).from(mailOutbox).where(eq(mailOutbox.to, to)).orderBy(mailOutbox.createdAt);

useTestDatabase({ worker: true });

describe('mail kinds', () => {
	it('each role sees only its own switches', () => {
		expect(mailKindsFor('homeowner')).toEqual(['bid_update', 'message', 'curing']);
		expect(mailKindsFor('contractor')).toEqual(['new_lead', 'billing', 'bid_result', 'message']);
		expect(mailKindsFor('admin')).toEqual(['review_queue']);
		for (const k of Object.keys(mailKinds)) expect(mailKinds[k as keyof typeof mailKinds].label.length).toBeGreaterThan(3);
	});

	it('a kind turned off is not written to the outbox; other kinds and security mail still are', async () => {
		const u = await createUser({ name: 'Quiet', email: unique('quiet'), password: 'quiet-please-1', role: 'homeowner', verified: true });
		await setMailOptOut(u.id, ['message']);
		expect(await queueMail(u.email, newMessageMail(u.name, 'Ridge Co', `${origin}/messages`))).toBeNull();
		expect(await queueMail(u.email, newBidMail(u.name, 'Ridge Co', 'Patio', false, `${origin}/plans/x/bids`))).toBeTruthy();
		expect(await queueMail(u.email, resetPasswordMail(u.name, `${origin}/reset-password?token=abc`))).toBeTruthy();
		expect((await outboxTo(u.email)).map((m) => m.subject).sort()).toEqual(['Choose a new Stakeline password', 'New bid from Ridge Co']);
	});
});

describe('change of address', () => {
	it('moves the account only when the link at the new address is used, telling the old address twice', async () => {
		const u = await createUser({ name: 'Mover', email: unique('old'), password: 'moving-house-2', role: 'homeowner', verified: true });
		const to = unique('new');
		await requestEmailChange(u, to.toUpperCase(), origin);
		expect((await db.select().from(user).where(eq(user.id, u.id)))[0].email).toBe(u.email);
		const [confirm] = await outboxTo(to);
		expect(confirm.subject).toBe('Confirm your new e-mail for Stakeline');
		const token = await tokenSentTo(to);
		const after = await confirmEmailChange(token, origin);
		expect(after.email).toBe(to);
		expect(after.emailVerifiedAt).not.toBeNull();
		expect((await outboxTo(u.email)).map((m) => m.subject)).toEqual(['A change of your Stakeline e-mail was asked for', 'Your Stakeline e-mail was changed']);
		await expect(confirmEmailChange(token, origin)).rejects.toBeInstanceOf(EmailChangeRefused); // once only
	});

	it('is refused for a taken address, and a new password ends a pending change', async () => {
		const a = await createUser({ name: 'A', email: unique('a'), password: 'first-account-3', role: 'homeowner' });
		const b = await createUser({ name: 'B', email: unique('b'), password: 'second-account-4', role: 'homeowner' });
		await expect(requestEmailChange(a, b.email, origin)).rejects.toThrow(/already exists/);
		const to = unique('c');
		await requestEmailChange(a, to, origin);
		const token = await tokenSentTo(to);
		await setPassword(a.id, 'changed-after-theft-5');
		await expect(confirmEmailChange(token, origin)).rejects.toBeInstanceOf(EmailChangeRefused);
	});
});

describe('disabling an account', () => {
	it('ends its sessions, writes the audit row and tells the owner; enabling lets a new session work', async () => {
		const admin = await createUser({ name: 'Admin Ida', email: unique('admin'), password: 'admin-pass-66', role: 'admin', verified: true });
		const u = await createUser({ name: 'Owner', email: unique('owner'), password: 'owner-pass-77', role: 'homeowner', verified: true });
		const token = generateSessionToken();
		await createSession(token, u.id);
		expect((await validateSessionToken(token)).user?.id).toBe(u.id);

		expect(await setAccountDisabled(admin, u.id, true, 'Spam in plan notes', origin)).toBe(true);
		expect(await db.select().from(session).where(eq(session.userId, u.id))).toEqual([]);
		expect((await validateSessionToken(token)).user).toBeNull();
		await expect(setAccountDisabled(admin, u.id, true, 'again', origin)).rejects.toBeInstanceOf(AccessRefused);
		await expect(setAccountDisabled(admin, admin.id, true, 'self', origin)).rejects.toBeInstanceOf(AccessRefused);
		// A session created in a race with the decision is ended on its first use.
		const raced = generateSessionToken();
		await createSession(raced, u.id);
		expect((await validateSessionToken(raced)).user).toBeNull();

		expect(await setAccountDisabled(admin, u.id, false, 'Cleaned up', origin)).toBe(true);
		const fresh = generateSessionToken();
		await createSession(fresh, u.id);
		expect((await validateSessionToken(fresh)).user?.id).toBe(u.id);
		const audit = await db
			.select()
			.from(auditLog)
			.where(and(eq(auditLog.subjectId, u.id)));
		expect(audit.map((a) => [a.action, a.reason, a.actorName]).sort()).toEqual([
			['disable_account', 'Spam in plan notes', 'Admin Ida'],
			['enable_account', 'Cleaned up', 'Admin Ida']
		]);
		expect((await outboxTo(u.email)).map((m) => m.subject).sort()).toEqual(['Your Stakeline account is disabled', 'Your Stakeline account is enabled again']);
		expect(await setAccountDisabled(admin, crypto.randomUUID(), true, 'nobody', origin)).toBe(false);
	});
});

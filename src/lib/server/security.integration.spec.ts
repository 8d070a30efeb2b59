// Attacks from issue review, replayed against the real actions and the real PostgreSQL test database.
import { deflateSync } from 'node:zlib';
import { isRedirect, type RequestEvent } from '@sveltejs/kit';
import { and, eq, like, sql } from 'drizzle-orm';
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { actions as signInActions } from '../../routes/(auth)/signin/+page.server';
import { actions as linkActions, load as linkLoad } from '../../routes/(auth)/signin/link/+page.server';
import { actions as forgotActions } from '../../routes/(auth)/forgot-password/+page.server';
import { actions as plansActions } from '../../routes/(app)/plans/+page.server';
import { createSession, generateSessionToken, validateSessionToken } from './auth';
import { db } from './db';
import { mailOutbox, planPhoto, session, throttleCounter } from './db/schema';
import { purgeSentLinks } from './email-tokens';
import { addPhoto, MAX_PHOTOS_PER_PLAN, PhotoRejected } from './photos';
import { createPlan, findOwnPlan } from './plans';
import { hashToken } from './tokens';
import { createUser, sendPasswordResetMail, sendVerificationMail } from './users';
import { uniqueEmail as unique, useTestDatabase } from './integration-setup';
import { smallPatio } from '$lib/plan/test-plans';

useTestDatabase();

const DAY = 86_400_000;
// Addresses from the RFC 5737 documentation ranges, fresh per test so counters do not mix.
const address = () => `198.51.100.${Math.floor(Math.random() * 250)}-${crypto.randomUUID().slice(0, 8)}`;
const PASSWORD = 'right-password-42';

type Outcome = { status: number; data?: Record<string, unknown>; location?: string; cookies: Map<string, string> };

/** Runs a form action as SvelteKit would for one browser: its form fields, its address, its cookies. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- each route types its own event
async function submit(action: (e: any) => unknown, path: string, fields: Record<string, string>, ip: string, user: unknown = null): Promise<Outcome> {
	const cookies = new Map<string, string>();
	const url = new URL(`http://127.0.0.1:3100${path}`);
	const event = {
		request: new Request(url, { method: 'POST', body: new URLSearchParams(fields) }),
		url,
		getClientAddress: () => ip,
		locals: { user, session: null },
		cookies: { set: (n: string, v: string) => cookies.set(n, v), get: (n: string) => cookies.get(n), delete: (n: string) => cookies.delete(n) }
	} as unknown as RequestEvent;
	try {
		const result = (await action(event)) as { status?: number; data?: Record<string, unknown> } | Record<string, unknown>;
		if (result && 'status' in result && typeof result.status === 'number')
			return { status: result.status, data: result.data as Record<string, unknown>, cookies };
		return { status: 200, data: result as Record<string, unknown>, cookies };
	} catch (err) {
		if (isRedirect(err)) return { status: err.status, location: err.location, cookies };
		throw err;
	}
}

const signIn = (email: string, password: string, ip: string) => submit(signInActions.default, '/signin', { email, password, redirectTo: '' }, ip);
const homeowner = (email = unique('owner')) => createUser({ name: 'Maren Test', email, password: PASSWORD, role: 'homeowner', verified: true });

/** The link in the newest outbox message to `to` that contains `needle`, polled until it is queued. */
async function linkIn(to: string, needle: string): Promise<string> {
	let text = '';
	await expect
		.poll(async () => {
			const rows = await db
				.select()
				.from(mailOutbox)
				.where(and(eq(mailOutbox.to, to), like(mailOutbox.text, `%${needle}%`)));
			text = rows[0]?.text ?? '';
			return rows.length;
		})
		.toBe(1);
	return new URL(text.match(/https?:\/\/\S+/)![0]).searchParams.get('token')!;
}

describe('sign-in throttle', () => {
	it('checks at most 5 of 30 parallel wrong passwords for one account', async () => {
		const u = await homeowner();
		const ip = address();
		const results = await Promise.all(Array.from({ length: 30 }, () => signIn(u.email, 'wrong-password-1', ip)));
		const checked = results.filter((r) => r.status === 400).length;
		const refused = results.filter((r) => r.status === 429).length;
		expect(checked).toBe(5);
		expect(refused).toBe(25);
		// The pause holds even for the right password from the same address…
		expect((await signIn(u.email, PASSWORD, ip)).status).toBe(429);
		// …but the owner elsewhere is not locked out.
		const owner = await signIn(u.email, PASSWORD, address());
		expect(owner.status).toBe(303);
		expect(owner.cookies.has('stakeline_session')).toBe(true);
	}, 30_000);

	it('doubles the pause each time the same pair comes back', async () => {
		const u = await homeowner();
		const ip = address();
		for (let i = 0; i < 5; i++) expect((await signIn(u.email, 'wrong-password-2', ip)).status).toBe(400);
		const first = await signIn(u.email, 'wrong-password-2', ip);
		expect(first.status).toBe(429);
		expect(first.data?.message).toMatch(/wait 15 minutes/);
		// Let the first pause run out, as 15 minutes would.
		await db
			.update(throttleCounter)
			.set({ expire: new Date(Date.now() - 1000) })
			.where(eq(throttleCounter.key, `signin-pair:${u.email}|${ip}`));
		for (let i = 0; i < 5; i++) expect((await signIn(u.email, 'wrong-password-2', ip)).status).toBe(400);
		const second = await signIn(u.email, 'wrong-password-2', ip);
		expect(second.data?.message).toMatch(/wait 30 minutes/);
	}, 30_000);

	it('lets the owner in by an e-mailed link while password sign-in of the account is paused', async () => {
		const u = await homeowner();
		// Guessing spread over 31 addresses, one try each: the account's own limit (30 an hour) is reached.
		for (let i = 0; i < 30; i++) await signIn(u.email, `spray-${i}-password`, address());
		const paused = await signIn(u.email, PASSWORD, address());
		expect(paused.status).toBe(429);
		expect(paused.data?.message).toMatch(/on this account.*sign-in link/);

		const ip = address();
		const sent = await submit(linkActions.send, '/signin/link', { email: u.email.toUpperCase() }, ip);
		expect(sent).toMatchObject({ status: 200, data: { sent: true } });
		const token = await linkIn(u.email, '/signin/link?token=');
		const shown = (await linkLoad({ url: new URL(`http://127.0.0.1/signin/link?token=${token}`), locals: { user: null } } as never)) as { valid: boolean };
		expect(shown.valid).toBe(true); // opening the link does not use it up
		const used = await submit(linkActions.use, '/signin/link', { token }, ip);
		expect(used.data).toBeUndefined();
		expect(used.status).toBe(303);
		expect(used.location).toBe('/plans');
		const { user } = await validateSessionToken(used.cookies.get('stakeline_session')!);
		expect(user?.id).toBe(u.id);
		expect((await submit(linkActions.use, '/signin/link', { token }, ip)).status).toBe(400); // once only
	}, 60_000);

	it('answers a link request for an unknown address the same way, sending nothing', async () => {
		const to = unique('nobody');
		expect(await submit(linkActions.send, '/signin/link', { email: to }, address())).toMatchObject({ status: 200, data: { sent: true } });
		await new Promise((r) => setTimeout(r, 300));
		expect(await db.select().from(mailOutbox).where(eq(mailOutbox.to, to))).toEqual([]);
	});
});

describe('mail a visitor can trigger', () => {
	it('sends at most 3 of 30 parallel password resets for one address', async () => {
		const u = await homeowner();
		const results = await Promise.all(
			Array.from({ length: 30 }, (_, i) => submit(forgotActions.default, '/forgot-password', { email: u.email }, `${address()}-${i}`))
		);
		expect(results.filter((r) => r.status === 200).length).toBe(3);
		expect(results.filter((r) => r.status === 429).length).toBe(27);
		await expect.poll(async () => (await db.select().from(mailOutbox).where(eq(mailOutbox.to, u.email))).length).toBe(3);
	});

	it('refuses a client asking for mail to more than 10 addresses an hour', async () => {
		const ip = address();
		for (let i = 0; i < 10; i++) expect((await submit(forgotActions.default, '/forgot-password', { email: unique(`c${i}`) }, ip)).status).toBe(200);
		const eleventh = await submit(forgotActions.default, '/forgot-password', { email: unique('c10') }, ip);
		expect(eleventh.status).toBe(429);
		expect(eleventh.data?.message).toMatch(/Too many e-mails/);
	});

	it('keeps the name a sign-up chose out of mail to an unconfirmed address', async () => {
		const spam = 'WIN A PRIZE at spam.example';
		const u = await createUser({ name: spam, email: unique('unconfirmed'), password: PASSWORD, role: 'homeowner' });
		await sendVerificationMail(u, 'http://127.0.0.1:3100');
		await sendPasswordResetMail(u, 'http://127.0.0.1:3100');
		const mails = await db.select().from(mailOutbox).where(eq(mailOutbox.to, u.email));
		expect(mails).toHaveLength(2);
		for (const m of mails) {
			expect(m.text.split('\n')[0]).toBe('Hello,');
			expect(m.text + m.html + m.subject).not.toContain('PRIZE');
		}
	});

	it('blanks one-time links in the outbox once sent', async () => {
		const u = await homeowner();
		await sendPasswordResetMail(u, 'http://127.0.0.1:3100');
		const token = await linkIn(u.email, 'token=');
		await db.update(mailOutbox).set({ status: 'sent' }).where(eq(mailOutbox.to, u.email));
		expect(await purgeSentLinks()).toBeGreaterThanOrEqual(1);
		const [m] = await db.select().from(mailOutbox).where(eq(mailOutbox.to, u.email));
		expect(m.text + m.html).not.toContain(token);
		expect(m.text).toContain('token=removed');
	});
});

describe('sessions', () => {
	it('end 90 days after sign-in, however recently used', async () => {
		const u = await homeowner();
		const token = generateSessionToken();
		await createSession(token, u.id);
		// Signed in 91 days ago and renewed yesterday: still within its 30-day expiry.
		await db
			.update(session)
			.set({ createdAt: new Date(Date.now() - 91 * DAY), expiresAt: new Date(Date.now() + 29 * DAY) })
			.where(eq(session.id, hashToken(token)));
		expect((await validateSessionToken(token)).session).toBeNull();
	});

	it('renew only up to the absolute lifetime', async () => {
		const u = await homeowner();
		const token = generateSessionToken();
		await createSession(token, u.id);
		const signedIn = Date.now() - 80 * DAY;
		await db
			.update(session)
			.set({ createdAt: new Date(signedIn), expiresAt: new Date(Date.now() + DAY) })
			.where(eq(session.id, hashToken(token)));
		const { session: s } = await validateSessionToken(token);
		expect(s?.expiresAt.getTime()).toBe(signedIn + 90 * DAY);
	});
});

describe('plans and photos', () => {
	const input = smallPatio();

	it('answer 404 to deleting someone else’s plan, and keep it', async () => {
		const owner = await homeowner();
		const other = await homeowner();
		const p = await createPlan(owner.id, { name: 'Not yours', input });
		const result = await submit(plansActions.delete, '/plans?/delete', { id: p.id }, address(), { id: other.id, role: 'homeowner' });
		expect(result.status).toBe(404);
		expect(await findOwnPlan(p.id, owner.id)).toBeDefined();
	});

	it(`keep at most ${MAX_PHOTOS_PER_PLAN} photos when 25 arrive at once`, async () => {
		const owner = await homeowner();
		const p = await createPlan(owner.id, { name: 'Many photos', input });
		const png = await sharp({ create: { width: 40, height: 30, channels: 3, background: '#6b8f71' } })
			.png()
			.toBuffer();
		const results = await Promise.allSettled(Array.from({ length: 25 }, (_, i) => addPhoto(p.id, png, `site-${i}.png`)));
		expect(results.filter((r) => r.status === 'fulfilled').length).toBe(MAX_PHOTOS_PER_PLAN);
		for (const r of results.filter((r) => r.status === 'rejected')) expect((r as PromiseRejectedResult).reason).toBeInstanceOf(PhotoRejected);
		const [{ n }] = await db
			.select({ n: sql<number>`count(*)::int` })
			.from(planPhoto)
			.where(eq(planPhoto.planId, p.id));
		expect(n).toBe(MAX_PHOTOS_PER_PLAN);
	});

	it('refuse a decompression bomb (16383 × 16383 PNG) from its header, naming the limit', async () => {
		const owner = await homeowner();
		const p = await createPlan(owner.id, { name: 'Bomb', input });
		const bomb = hugeBlankPng(16383, 16383);
		expect(bomb.byteLength).toBeLessThan(1024 * 1024);
		const err = await addPhoto(p.id, bomb, 'bomb.png').catch((e) => e);
		expect(err).toBeInstanceOf(PhotoRejected);
		expect((err as Error).message).toBe('That image is 16383 × 16383 pixels; the limit is 40 megapixels. Please send a smaller photo.');
	});
});

/** A valid 1-bit greyscale PNG of the given size, all black: tiny on disk, huge once decoded. */
function hugeBlankPng(width: number, height: number): Buffer {
	const crcTable = Array.from({ length: 256 }, (_, n) => {
		let c = n;
		for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
		return c >>> 0;
	});
	const crc = (buf: Buffer) => {
		let c = 0xffffffff;
		for (const b of buf) c = crcTable[(c ^ b) & 0xff] ^ (c >>> 8);
		return (c ^ 0xffffffff) >>> 0;
	};
	const chunk = (type: string, data: Buffer) => {
		const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
		const out = Buffer.alloc(body.length + 8);
		out.writeUInt32BE(data.length, 0);
		body.copy(out, 4);
		out.writeUInt32BE(crc(body), body.length + 4);
		return out;
	};
	const ihdr = Buffer.alloc(13);
	ihdr.writeUInt32BE(width, 0);
	ihdr.writeUInt32BE(height, 4);
	ihdr[8] = 1; // bit depth
	ihdr[9] = 0; // greyscale
	const rows = Buffer.alloc((1 + Math.ceil(width / 8)) * height); // filter byte 0 and zero pixels per row
	return Buffer.concat([
		Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
		chunk('IHDR', ihdr),
		chunk('IDAT', deflateSync(rows, { level: 9 })),
		chunk('IEND', Buffer.alloc(0))
	]);
}

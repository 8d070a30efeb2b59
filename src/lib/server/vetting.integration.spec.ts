// Integration tests on the real PostgreSQL test database: profile saves, vetting decisions, audit rows.
import { afterAll, describe, expect, it } from 'vitest';
import { desc, eq } from 'drizzle-orm';
import { client, db } from './db';
import { mailIdle } from './mail';
import { auditLog, contractor, contractorDocument, mailOutbox } from './db/schema';
import { findContractor, saveContractorProfile } from './contractors';
import { storage } from './storage';
import type { SniffedUpload } from './uploads';
import { createUser } from './users';
import { decide, VettingRefused } from './vetting';

afterAll(async () => {
	await mailIdle();
	await client.end();
});

const origin = 'http://127.0.0.1:3000';
const unique = (label: string) => `${label}-${crypto.randomUUID()}@it.stakeline.test`;
const pdf = (label: string): SniffedUpload => ({ bytes: new TextEncoder().encode(`%PDF-1.4 ${label}`), mime: 'application/pdf', ext: 'pdf', name: `${label}.pdf` });
const profile = {
	businessName: 'Cinderbank Pours',
	contactName: 'Ola Frett',
	phone: '(541) 555-0101',
	description: 'Walks and pads.',
	yearsInTrade: 5,
	services: ['pour_finish' as const],
	licenceNumber: 'FH-1',
	licenceAuthority: 'Fernhollow County Contractors Board',
	servicePostcode: '97321',
	serviceRadius: 20,
	serviceRadiusUnit: 'mi' as const
};
const centroid = { lat: 44.6, lon: -123.1 };

async function onboarded() {
	const u = await createUser({ name: 'Ola Frett', email: unique('pro'), password: 'contractor-pass', role: 'contractor' });
	await saveContractorProfile(u.id, profile, centroid, { licence: pdf('licence'), insurance: pdf('insurance') });
	return u;
}
const admin = async () => createUser({ name: 'Vera Admin', email: unique('admin'), password: 'admin-password', role: 'admin' });
const status = async (id: string) => (await db.select().from(contractor).where(eq(contractor.userId, id)))[0];
const audits = (id: string) => db.select().from(auditLog).where(eq(auditLog.subjectId, id)).orderBy(desc(auditLog.createdAt));

describe('contractor profile', () => {
	it('is sent for review on first save, with both documents stored through the storage module', async () => {
		const u = await onboarded();
		const c = await findContractor(u.id);
		expect(c?.status).toBe('awaiting_review');
		expect(c?.submittedAt).toBeInstanceOf(Date);
		expect(c?.documents.map((d) => d.kind).sort()).toEqual(['insurance', 'licence']);
		expect(c?.documents[0]).not.toHaveProperty('storageKey');
		const [row] = await db.select().from(contractorDocument).where(eq(contractorDocument.contractorId, u.id)).limit(1);
		expect(new TextDecoder().decode((await storage().get(row.storageKey))!)).toMatch(/^%PDF-1.4/);
	});

	it('goes back to review when an approved contractor changes the licence or uploads a new certificate', async () => {
		const u = await onboarded();
		const a = await admin();
		await decide(a, u.id, 'approve', null, origin);
		expect((await status(u.id)).status).toBe('approved');

		// A new phone number changes nothing about the vetting.
		await saveContractorProfile(u.id, { ...profile, phone: '(541) 555-0199' }, centroid, {});
		expect((await status(u.id)).status).toBe('approved');

		await saveContractorProfile(u.id, { ...profile, licenceNumber: 'FH-2' }, centroid, {});
		expect((await status(u.id)).status).toBe('awaiting_review');
		await decide(a, u.id, 'approve', null, origin);

		const [oldInsurance] = await db.select().from(contractorDocument).where(eq(contractorDocument.contractorId, u.id));
		const before = Date.now();
		await saveContractorProfile(u.id, { ...profile, licenceNumber: 'FH-2' }, centroid, { insurance: pdf('new-insurance'), licence: pdf('new-licence') });
		const after = await status(u.id);
		expect(after.status).toBe('awaiting_review');
		expect(after.reviewRequestedAt.getTime()).toBeGreaterThanOrEqual(before - 1000);
		// The replaced file is gone from storage; the new one replaced the row.
		expect(await storage().get(oldInsurance.storageKey)).toBeNull();
		expect((await db.select().from(contractorDocument).where(eq(contractorDocument.contractorId, u.id))).map((d) => d.originalName).sort()).toEqual([
			'new-insurance.pdf',
			'new-licence.pdf'
		]);
	});
});

describe('vetting decisions', () => {
	it('move the status, keep the reason, write an audit row and queue an e-mail each', async () => {
		const u = await onboarded();
		const a = await admin();
		await decide(a, u.id, 'request_changes', 'The insurance certificate has expired.', origin);
		let c = await status(u.id);
		expect([c.status, c.statusReason]).toEqual(['changes_requested', 'The insurance certificate has expired.']);

		// Answering the request sends the profile back to the queue.
		await saveContractorProfile(u.id, profile, centroid, { insurance: pdf('renewed') });
		c = await status(u.id);
		expect([c.status, c.statusReason]).toEqual(['awaiting_review', null]);

		await decide(a, u.id, 'approve', null, origin);
		await decide(a, u.id, 'suspend', 'Complaints about unfinished work.', origin);
		expect((await status(u.id)).status).toBe('suspended');
		await decide(a, u.id, 'reinstate', 'Resolved with the homeowner.', origin);
		c = await status(u.id);
		expect([c.status, c.statusReason]).toEqual(['approved', null]);

		const log = await audits(u.id);
		expect(log.map((e) => [e.action, e.reason, e.actorId, e.actorName])).toEqual([
			['reinstate', 'Resolved with the homeowner.', a.id, 'Vera Admin'],
			['suspend', 'Complaints about unfinished work.', a.id, 'Vera Admin'],
			['approve', null, a.id, 'Vera Admin'],
			['request_changes', 'The insurance certificate has expired.', a.id, 'Vera Admin']
		]);
		expect(log[0].subjectName).toBe('Cinderbank Pours (Ola Frett)');

		const mails = await db.select().from(mailOutbox).where(eq(mailOutbox.to, u.email)).orderBy(mailOutbox.createdAt);
		const vetting = mails.filter((m) => !/Confirm/.test(m.subject));
		expect(vetting.map((m) => m.subject)).toEqual([
			'Your Stakeline profile needs a change',
			'Your Stakeline pro account is approved',
			'Your Stakeline pro account is suspended',
			'Your Stakeline pro account is active again'
		]);
		expect(vetting[0].text).toContain('Note from the reviewer: The insurance certificate has expired.');
		expect(vetting[0].text).toContain(`${origin}/pro/profile`);
		expect(vetting[0].html).toContain(`href="${origin}/pro/profile"`);
	});

	it('refuse a decision that does not fit the state, a missing reason, and an incomplete profile, writing nothing', async () => {
		const a = await admin();
		const u = await onboarded();
		await expect(decide(a, u.id, 'reinstate', null, origin)).rejects.toBeInstanceOf(VettingRefused);
		await expect(decide(a, u.id, 'request_changes', null, origin)).rejects.toThrow('A reason is required.');

		const fresh = await createUser({ name: 'Half Done', email: unique('half'), password: 'contractor-pass', role: 'contractor' });
		await expect(decide(a, fresh.id, 'approve', null, origin)).rejects.toThrow(/not complete/);
		expect((await status(fresh.id)).status).toBe('awaiting_review');
		expect(await audits(u.id)).toHaveLength(0);
		expect(await audits(fresh.id)).toHaveLength(0);
		expect(await decide(a, crypto.randomUUID(), 'approve', null, origin)).toBe(false);
	});

	it('let only one of two admins deciding at once win', async () => {
		const u = await onboarded();
		const [a, b] = await Promise.all([admin(), admin()]);
		const results = await Promise.allSettled([decide(a, u.id, 'approve', null, origin), decide(b, u.id, 'approve', null, origin)]);
		expect(results.map((r) => r.status).sort()).toEqual(['fulfilled', 'rejected']);
		expect(await audits(u.id)).toHaveLength(1);
	});
});

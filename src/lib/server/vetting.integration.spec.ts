// Integration tests on the real PostgreSQL test database: profile saves, vetting decisions, audit rows.
import { describe, expect, it } from 'vitest';
import { desc, eq } from 'drizzle-orm';
import { db } from './db';
import { auditLog, contractor, contractorDocument, mailOutbox } from './db/schema';
import { changesSinceReview, findContractor, saveContractorProfile } from './contractors';
import { storage } from './storage';
import type { SniffedUpload } from './uploads';
import { createUser } from './users';
import { decide, VettingRefused } from './vetting';
import { uniqueEmail as unique, useTestDatabase } from './integration-setup';

useTestDatabase();

const origin = 'http://127.0.0.1:3000';
const pdf = (label: string): SniffedUpload => ({
	bytes: new TextEncoder().encode(`%PDF-1.4 ${label}`),
	mime: 'application/pdf',
	ext: 'pdf',
	name: `${label}.pdf`
});
const profile = {
	businessName: 'Cinderbank Pours',
	contactName: 'Ola Frett',
	phone: '(541) 555-0101',
	description: 'Walks and pads.',
	yearsInTrade: 5,
	services: ['pour_finish' as const],
	licenceNumber: 'FH-1',
	licenceAuthority: 'Fernhollow County Contractors Board',
	licenceExpiresOn: new Date(Date.now() + 400 * 86_400_000).toISOString().slice(0, 10),
	insuranceExpiresOn: new Date(Date.now() + 200 * 86_400_000).toISOString().slice(0, 10),
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
		// The replaced file is kept as history, no longer current; the new ones are current.
		expect(await storage().get(oldInsurance.storageKey)).not.toBeNull();
		const c = (await findContractor(u.id))!;
		expect(c.documents.map((d) => d.originalName).sort()).toEqual(['new-insurance.pdf', 'new-licence.pdf']);
		expect(c.earlierDocuments.map((d) => d.originalName).sort()).toEqual(['insurance.pdf', 'licence.pdf']);
		// The admin sees what changed since the last decision (the approval of FH-2).
		expect(changesSinceReview(c)).toEqual({ fields: [], documents: ['licence', 'insurance'] });
	});
});

describe('vetting decisions', () => {
	it('move the status, keep the reason, write an audit row and queue an e-mail each', async () => {
		const u = await onboarded();
		const a = await admin();
		await decide(a, u.id, 'send_back', 'The insurance certificate has expired.', origin);
		let c = await status(u.id);
		expect([c.status, c.statusReason]).toEqual(['sent_back', 'The insurance certificate has expired.']);

		// Answering the send-back returns the profile to the queue; the admin sees what changed.
		await saveContractorProfile(u.id, { ...profile, licenceAuthority: 'Fernhollow Licensing Office' }, centroid, { insurance: pdf('renewed') });
		c = await status(u.id);
		expect([c.status, c.statusReason]).toEqual(['awaiting_review', null]);
		expect(changesSinceReview((await findContractor(u.id))!)).toEqual({ fields: ['Licence issued by'], documents: ['insurance'] });

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
			['send_back', 'The insurance certificate has expired.', a.id, 'Vera Admin']
		]);
		expect(log[0].subjectName).toBe('Cinderbank Pours (Ola Frett)');

		const mails = await db.select().from(mailOutbox).where(eq(mailOutbox.to, u.email)).orderBy(mailOutbox.createdAt);
		const vetting = mails.filter((m) => !/Confirm/.test(m.subject));
		expect(vetting.map((m) => m.subject)).toEqual([
			'Your Stakeline profile was sent back',
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
		await expect(decide(a, u.id, 'send_back', null, origin)).rejects.toThrow('A reason is required.');

		const fresh = await createUser({ name: 'Half Done', email: unique('half'), password: 'contractor-pass', role: 'contractor' });
		await expect(decide(a, fresh.id, 'approve', null, origin)).rejects.toThrow(/it cannot get “Approve” now/);
		expect((await status(fresh.id)).status).toBe('draft');
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

describe('suspend and reinstate', () => {
	it('return a never-submitted account to not submitted, never to approved', async () => {
		const a = await admin();
		const fresh = await createUser({ name: 'Never Sent', email: unique('never'), password: 'contractor-pass', role: 'contractor' });
		expect((await status(fresh.id)).status).toBe('draft');
		await decide(a, fresh.id, 'suspend', 'Suspicious sign-up pattern.', origin);
		expect((await status(fresh.id)).status).toBe('suspended');
		await decide(a, fresh.id, 'reinstate', null, origin);
		const c = await status(fresh.id);
		expect([c.status, c.suspendedFrom, c.statusReason]).toEqual(['draft', null, null]);
		// Nor can it be approved from there: only a submitted profile in the queue can.
		await expect(decide(a, fresh.id, 'approve', null, origin)).rejects.toBeInstanceOf(VettingRefused);
	});

	it('return an account awaiting review to the queue, where it still needs an approval', async () => {
		const a = await admin();
		const u = await onboarded();
		await decide(a, u.id, 'suspend', 'Checking a complaint first.', origin);
		await decide(a, u.id, 'reinstate', null, origin);
		expect((await status(u.id)).status).toBe('awaiting_review');
		const queued = await db.select().from(contractor).where(eq(contractor.userId, u.id));
		expect(queued[0].reviewRequestedAt).toBeInstanceOf(Date);
		const mails = await db.select().from(mailOutbox).where(eq(mailOutbox.to, u.email)).orderBy(desc(mailOutbox.createdAt)).limit(1);
		expect(mails[0].text).toContain('The suspension is lifted.');
		expect(mails[0].text).not.toContain('can send you their plans again');
	});

	it('send an approved account to review when its credentials changed during the suspension, and a first submission during it too', async () => {
		const a = await admin();
		const u = await onboarded();
		await decide(a, u.id, 'approve', null, origin);
		await decide(a, u.id, 'suspend', 'Insurance lapsed.', origin);
		await saveContractorProfile(u.id, profile, centroid, { insurance: pdf('renewed-insurance') });
		expect((await status(u.id)).status).toBe('suspended');
		await decide(a, u.id, 'reinstate', null, origin);
		expect((await status(u.id)).status).toBe('awaiting_review');

		const fresh = await createUser({ name: 'Late Sender', email: unique('late'), password: 'contractor-pass', role: 'contractor' });
		await decide(a, fresh.id, 'suspend', 'Checking identity.', origin);
		await saveContractorProfile(fresh.id, profile, centroid, { licence: pdf('licence'), insurance: pdf('insurance') });
		await decide(a, fresh.id, 'reinstate', null, origin);
		expect((await status(fresh.id)).status).toBe('awaiting_review');
	});

	it('return an approved account untouched to approved, and a sent-back one to sent back with its reason', async () => {
		const a = await admin();
		const u = await onboarded();
		await decide(a, u.id, 'approve', null, origin);
		await decide(a, u.id, 'suspend', 'Complaint under review.', origin);
		await saveContractorProfile(u.id, { ...profile, phone: '(541) 555-0111' }, centroid, {});
		await decide(a, u.id, 'reinstate', null, origin);
		expect((await status(u.id)).status).toBe('approved');

		const v = await onboarded();
		await decide(a, v.id, 'send_back', 'The licence scan is unreadable.', origin);
		await decide(a, v.id, 'suspend', 'Complaint under review.', origin);
		await decide(a, v.id, 'reinstate', null, origin);
		const c = await status(v.id);
		expect([c.status, c.statusReason]).toEqual(['sent_back', 'The licence scan is unreadable.']);
	});
});

describe('submission', () => {
	it('tells every admin, in the same transaction as the submission, and only when the profile enters the queue', async () => {
		const a = await admin();
		const u = await createUser({ name: 'Queue Entrant', email: unique('entrant'), password: 'contractor-pass', role: 'contractor' });
		await saveContractorProfile(
			u.id,
			{ ...profile, businessName: `Entrant ${u.id}` },
			centroid,
			{ licence: pdf('licence'), insurance: pdf('insurance') },
			origin
		);
		const toAdmin = async () => (await db.select().from(mailOutbox).where(eq(mailOutbox.to, a.email))).filter((m) => m.subject.includes(`Entrant ${u.id}`));
		expect(await toAdmin()).toHaveLength(1);
		expect((await toAdmin())[0].text).toContain(`${origin}/admin/contractors/${u.id}`);
		// A correction while in the queue keeps its place and sends nothing new.
		await saveContractorProfile(u.id, { ...profile, businessName: `Entrant ${u.id}`, phone: '(541) 555-0122' }, centroid, {}, origin);
		expect(await toAdmin()).toHaveLength(1);
	});
});

// Integration tests on the real PostgreSQL test database: credential expiry and reminders, lead
// respond-by dates, closing a request, marking a job done, and who sees the site address.
// The clock is set per test; sweeps are scoped to this file's own rows except where the lock is
// tested, which runs at the real time (nothing anyone else made lapses then).
import { afterEach, describe, expect, it, vi } from 'vitest';
import { and, eq, like } from 'drizzle-orm';
import { db } from './db';
import { bid, contractor, credentialReminder, lead, mailOutbox, user } from './db/schema';
import { sweep, sweepContractor } from './credentials';
import { closeRequest, completeJob, contractorLead, expireLeadsNow, LeadRefused, sendLeads } from './leads';
import { acceptBid, saveBid } from './bids';
import { matchContractors, placeOf } from './matching';
import { createUser } from './users';
import { homeownerWithPlan } from './integration-fixtures';
import { uniqueEmail as unique, useTestDatabase } from './integration-setup';

useTestDatabase();
afterEach(() => {
	vi.useRealTimers();
});

const origin = 'http://127.0.0.1:3000';
const DAY = 86_400_000;
const iso = (d: Date) => d.toISOString().slice(0, 10);
const at = (isoDay: string) => new Date(`${isoDay}T12:00:00Z`);
const plus = (isoDay: string, days: number) => iso(new Date(at(isoDay).getTime() + days * DAY));
/** Sets the clock that matching, bids and the page-load checks read. */
const setClock = (isoDay: string) => {
	vi.useFakeTimers({ toFake: ['Date'] });
	vi.setSystemTime(at(isoDay));
};
// A real ZIP code (Ottumwa, Iowa) away from the demo firms and the other test files, used only for its centroid.
const HOME_ZIP = '52501';
const home = placeOf(HOME_ZIP)!;
const site = { siteAddress: '27 Larchmere Lane, Ottumwa', phone: '(641) 555-0147' };

async function firm(name: string, dates: { licence: string | null; insurance: string | null }) {
	const u = await createUser({ name, email: unique('pro'), password: 'contractor-pass', role: 'contractor' });
	await db
		.update(contractor)
		.set({
			businessName: `${name} ${crypto.randomUUID().slice(0, 6)}`,
			status: 'approved',
			services: ['whole_job'],
			servicePostcode: HOME_ZIP,
			serviceRadius: 10,
			serviceRadiusUnit: 'mi',
			serviceLat: home.lat,
			serviceLon: home.lon,
			licenceExpiresOn: dates.licence,
			insuranceExpiresOn: dates.insurance,
			submittedAt: new Date()
		})
		.where(eq(contractor.userId, u.id));
	const [{ email }] = await db.select({ email: user.email }).from(user).where(eq(user.id, u.id));
	return { id: u.id, name, email };
}

async function homeowner() {
	const { owner, plan: p } = await homeownerWithPlan('Wynn Harrow', {
		name: 'Back step pad',
		postcode: HOME_ZIP,
		figures: { area: { squareFeet: 40, squareMeters: 3.7 } }
	});
	const [{ email }] = await db.select({ email: user.email }).from(user).where(eq(user.id, owner.id));
	return { owner, plan: p, email };
}

const subjects = async (to: string, pattern = '%') =>
	(
		await db
			.select({ s: mailOutbox.subject })
			.from(mailOutbox)
			.where(and(eq(mailOutbox.to, to), like(mailOutbox.subject, pattern)))
	)
		.map((r) => r.s)
		.sort();
const statusOf = async (id: string) => (await db.select({ s: contractor.status }).from(contractor).where(eq(contractor.userId, id)))[0].s;
const leadStatus = async (id: string) => (await db.select({ s: lead.status }).from(lead).where(eq(lead.id, id)))[0].s;
const bidInput = (validUntil: string, earliestStart: string) => ({
	totalCents: 240000,
	lineItems: [],
	earliestStart,
	durationDays: 2,
	validUntil,
	inclusions: '',
	exclusions: '',
	notes: ''
});

describe('credential expiry', () => {
	it('stops leads the day after the licence expires, lapses the account once, and tells the homeowner with its bid', async () => {
		const today = iso(new Date());
		const expiresOn = plus(today, 40);
		const f = await firm('Rookwood Flatwork', { licence: expiresOn, insurance: plus(today, 300) });
		const h = await homeowner();
		await sendLeads(h.owner, h.plan.id, { scope: 'whole_job', timeframe: 'flexible', notes: '', contractors: [f.id] }, origin);
		const [l] = await db.select().from(lead).where(eq(lead.planId, h.plan.id));
		await saveBid(f.id, l.id, bidInput(plus(today, 90), plus(today, 5)), origin);

		// On the expiry day itself the licence is still good.
		setClock(expiresOn);
		expect((await matchContractors(home, 'whole_job')).map((m) => m.id)).toContain(f.id);
		await sweepContractor(f.id, new Date(), origin);
		expect(await statusOf(f.id)).toBe('approved');

		// The next day: out of matching at once, even before any sweep, and bids refused.
		setClock(plus(expiresOn, 1));
		expect((await matchContractors(home, 'whole_job')).map((m) => m.id)).not.toContain(f.id);
		await expect(acceptBid(h.owner.id, h.plan.id, (await db.select().from(bid).where(eq(bid.leadId, l.id)))[0].id, origin, site)).rejects.toThrow(/expired/);

		const first = await sweepContractor(f.id, new Date(), origin);
		expect(first.lapsed).toBe(1);
		expect(await statusOf(f.id)).toBe('lapsed');
		const [row] = await db.select({ reason: contractor.statusReason }).from(contractor).where(eq(contractor.userId, f.id));
		expect(row.reason).toMatch(/licence expired/);
		await sweepContractor(f.id, new Date(), origin);
		expect(await subjects(f.email, '%has expired')).toEqual(['Your licence on Stakeline has expired']);
		expect(await subjects(h.email, '%expired')).toEqual([
			`${(await db.select({ b: contractor.businessName }).from(contractor).where(eq(contractor.userId, f.id)))[0].b}: licence or insurance expired`
		]);
		await expect(saveBid(f.id, l.id, bidInput(plus(expiresOn, 60), plus(expiresOn, 5)), origin)).rejects.toBeInstanceOf(LeadRefused);
	});

	it('sends the 30- and 7-day reminders once each, even when several servers sweep at the same moment', async () => {
		const today = iso(new Date());
		const f = await firm('Tansy Forms', { licence: plus(today, 500), insurance: plus(today, 20) });
		// Three sweeps at once, as three app servers would: two global ones (advisory lock) and a page load.
		const runs = await Promise.all([sweep(new Date(), origin), sweep(new Date(), origin), sweepContractor(f.id, new Date(), origin)]);
		expect(runs.filter((r) => r === null).length).toBeLessThanOrEqual(1);
		expect(await subjects(f.email, '%expires in%')).toEqual(['Your insurance on Stakeline expires in 20 days']);
		await sweepContractor(f.id, new Date(), origin);
		expect(await subjects(f.email, '%expires in%')).toHaveLength(1);

		// A week out: the 7-day reminder, once, with the same concurrency.
		setClock(plus(today, 14));
		await Promise.all([sweepContractor(f.id, new Date(), origin), sweepContractor(f.id, new Date(), origin)]);
		expect(await subjects(f.email, '%expires in%')).toEqual([
			'Your insurance on Stakeline expires in 20 days',
			'Your insurance on Stakeline expires in 6 days'
		]);
		const rows = await db.select({ d: credentialReminder.daysBefore }).from(credentialReminder).where(eq(credentialReminder.contractorId, f.id));
		expect(rows.map((r) => r.d).sort()).toEqual([30, 7]);
	});
});

describe('lead life cycle', () => {
	it('expires unanswered leads after the respond-by date and tells both sides once; a bid in time is not touched', async () => {
		const today = iso(new Date());
		const fast = await firm('Quillfield Pours', { licence: null, insurance: null });
		const silent = await firm('Hushgate Slabs', { licence: null, insurance: null });
		const h = await homeowner();
		await sendLeads(h.owner, h.plan.id, { scope: 'whole_job', timeframe: 'within_month', notes: '', contractors: [fast.id, silent.id] }, origin);
		const leads = await db.select().from(lead).where(eq(lead.planId, h.plan.id));
		expect(leads.map((l) => l.respondBy)).toEqual([plus(today, 7), plus(today, 7)]);
		const lf = leads.find((l) => l.contractorId === fast.id)!;
		const ls = leads.find((l) => l.contractorId === silent.id)!;
		await saveBid(fast.id, lf.id, bidInput(plus(today, 60), plus(today, 10)), origin);
		expect((await contractorLead(fast.id, lf.id))!.asked).toBe(2);

		expect(await expireLeadsNow({ planId: h.plan.id }, origin, at(plus(today, 7)))).toBe(0);
		expect(await expireLeadsNow({ planId: h.plan.id }, origin, at(plus(today, 8)))).toBe(1);
		expect(await expireLeadsNow({ planId: h.plan.id }, origin, at(plus(today, 9)))).toBe(0);
		expect(await leadStatus(ls.id)).toBe('expired');
		expect(await leadStatus(lf.id)).toBe('bid_sent');
		expect(await subjects(silent.email, 'A lead near%')).toEqual(['A lead near Ottumwa, IA expired']);
		expect((await subjects(h.email, '%did not reply in time')).length).toBe(1);
		// Past its respond-by date a lead takes no first bid.
		setClock(plus(today, 8));
		await expect(saveBid(silent.id, ls.id, bidInput(plus(today, 60), plus(today, 10)), origin)).rejects.toBeInstanceOf(LeadRefused);
	});

	it('closes a request without hiring: open leads and bids close, each firm is told, and nothing is left to mark done', async () => {
		const a = await firm('Brackenridge Concrete', { licence: null, insurance: null });
		const b = await firm('Wick Lane Forms', { licence: null, insurance: null });
		const h = await homeowner();
		const today = iso(new Date());
		await sendLeads(h.owner, h.plan.id, { scope: 'whole_job', timeframe: 'soon', notes: '', contractors: [a.id, b.id] }, origin);
		const [la] = await db
			.select()
			.from(lead)
			.where(and(eq(lead.planId, h.plan.id), eq(lead.contractorId, a.id)));
		await saveBid(a.id, la.id, bidInput(plus(today, 30), plus(today, 4)), origin);

		await expect(completeJob(h.owner.id, h.plan.id, origin)).rejects.toThrow(/Accept a bid first/);
		expect(await closeRequest(h.owner.id, h.plan.id, origin)).toEqual({ closed: 2 });
		expect((await db.select({ s: lead.status }).from(lead).where(eq(lead.planId, h.plan.id))).map((r) => r.s)).toEqual(['closed', 'closed']);
		expect((await db.select({ s: bid.status }).from(bid).where(eq(bid.leadId, la.id)))[0].s).toBe('closed');
		expect(await subjects(a.email, 'A request near%')).toHaveLength(1);
		expect(await subjects(b.email, 'A request near%')).toHaveLength(1);
		await expect(closeRequest(h.owner.id, h.plan.id, origin)).rejects.toThrow(/no open request/);
		// Another homeowner cannot close it.
		const other = await homeowner();
		expect(await closeRequest(other.owner.id, h.plan.id, origin)).toBeNull();
	});

	it('gives the site address and phone to the hired firm only, from acceptance on; marks the job done once', async () => {
		const win = await firm('Sorrel Yard Slabs', { licence: null, insurance: null });
		const lose = await firm('Pennyroyal Works', { licence: null, insurance: null });
		const h = await homeowner();
		const today = iso(new Date());
		await sendLeads(
			h.owner,
			h.plan.id,
			{
				scope: 'whole_job',
				timeframe: 'soon',
				notes: '',
				contractors: [win.id, lose.id],
				contact: { siteAddress: '9 Old Road, Ottumwa', phone: '641 555 0100' }
			},
			origin
		);
		const leads = await db.select().from(lead).where(eq(lead.planId, h.plan.id));
		const lw = leads.find((l) => l.contractorId === win.id)!;
		const ll = leads.find((l) => l.contractorId === lose.id)!;
		await saveBid(win.id, lw.id, bidInput(plus(today, 30), plus(today, 4)), origin);
		await saveBid(lose.id, ll.id, bidInput(plus(today, 30), plus(today, 4)), origin);
		expect((await contractorLead(win.id, lw.id))!.homeowner).toBeNull();

		const [wb] = await db.select().from(bid).where(eq(bid.leadId, lw.id));
		// The address given on accepting replaces the one given when sending.
		expect(await acceptBid(h.owner.id, h.plan.id, wb.id, origin, site)).toBe(true);
		const seen = (await contractorLead(win.id, lw.id))!;
		expect(seen.homeowner).toMatchObject({ name: 'Wynn Harrow', siteAddress: site.siteAddress, phone: site.phone });
		expect((await contractorLead(lose.id, ll.id))!.homeowner).toBeNull();
		await expect(closeRequest(h.owner.id, h.plan.id, origin)).rejects.toThrow(/mark the job done/);

		expect(await completeJob(h.owner.id, h.plan.id, origin)).toBe(true);
		expect(await leadStatus(lw.id)).toBe('done');
		expect(await leadStatus(ll.id)).toBe('not_selected');
		expect(await subjects(win.email, 'The job near%')).toHaveLength(1);
		await expect(completeJob(h.owner.id, h.plan.id, origin)).rejects.toThrow(/done already/);
		// Still the hired firm after the job: the address stays on their lead.
		expect((await contractorLead(win.id, lw.id))!.homeowner?.siteAddress).toBe(site.siteAddress);
	});
});

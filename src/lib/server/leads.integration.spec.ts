// Integration tests on the real PostgreSQL test database: matching, the revision freeze, bids, accept.
import { describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { haversineKm } from '$lib/geo';
import { db } from './db';
import { bid, contractor, lead, mailOutbox, plan, planPhoto } from './db/schema';
import {
	announceRevision,
	tellHomeownersOfContractorChange,
	contractorLead,
	declineLead,
	LeadRefused,
	leadsForPlan,
	leadPhotoPlan,
	markLeadSeen,
	sendLeads
} from './leads';
import { acceptBid, reopenBidding, saveBid, withdrawBid } from './bids';
import { postMessage, unreadMessageCount } from './messages';
import { matchContractors, placeOf } from './matching';
import { deletePlan, PlanHasLeads } from './plans';
import { createUser } from './users';
import { setAccountDisabled } from './account-access';
import { decide } from './vetting';
import { homeownerWithPlan as seedHomeownerWithPlan } from './integration-fixtures';
import { uniqueEmail as unique, useTestDatabase } from './integration-setup';

useTestDatabase();

const origin = 'http://127.0.0.1:3000';
const future = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
// A real ZIP code (Keokuk, Iowa) far from the demo firms, used here only for its centroid.
const HOME_ZIP = '52632';
const home = placeOf(HOME_ZIP)!;

async function approvedContractor(
	name: string,
	o: {
		postcode: string;
		radius: number;
		unit: 'mi' | 'km';
		services?: ('layout_forms' | 'base_prep' | 'pour_finish' | 'whole_job')[];
		status?: 'approved' | 'awaiting_review' | 'suspended';
	}
) {
	const u = await createUser({ name, email: unique('pro'), password: 'contractor-pass', role: 'contractor' });
	const at = placeOf(o.postcode)!;
	await db
		.update(contractor)
		.set({
			businessName: `${name} Co ${crypto.randomUUID().slice(0, 6)}`,
			status: o.status ?? 'approved',
			services: o.services ?? ['whole_job'],
			servicePostcode: o.postcode,
			serviceRadius: o.radius,
			serviceRadiusUnit: o.unit,
			serviceLat: at.lat,
			serviceLon: at.lon,
			submittedAt: new Date()
		})
		.where(eq(contractor.userId, u.id));
	return u;
}

const homeownerWithPlan = (postcode = HOME_ZIP) =>
	seedHomeownerWithPlan('Hale Owner', {
		name: 'Side walk',
		postcode,
		input: { units: 'imperial', note: 'first' },
		figures: { area: { squareFeet: 60, squareMeters: 5.57 } }
	});

const bidInput = (dollars: number) => ({
	totalCents: dollars * 100,
	lineItems: [],
	earliestStart: future(5),
	durationDays: 2,
	validUntil: future(30),
	inclusions: '',
	exclusions: '',
	notes: ''
});
const site = { siteAddress: '14 Alder Row, Keokuk', phone: '(319) 555-0190' };
const ids = (rows: { id: string }[]) => rows.map((r) => r.id);
const status = async (id: string) => (await db.select({ s: contractor.status }).from(contractor).where(eq(contractor.userId, id)))[0].s;

describe('matching', () => {
	it('finds approved contractors whose radius covers the plan, nearest first, in miles or km, for the chosen work', async () => {
		// Fort Madison (52627) is about 30 km from Keokuk; Burlington (52601) about 60 km.
		const near = await approvedContractor('Near', { postcode: '52627', radius: 25, unit: 'mi' });
		const kmTooShort = await approvedContractor('Short', { postcode: '52627', radius: 20, unit: 'km' });
		const far = await approvedContractor('Far', { postcode: '52601', radius: 70, unit: 'km' });
		const pending = await approvedContractor('Pending', { postcode: HOME_ZIP, radius: 50, unit: 'mi', status: 'awaiting_review' });
		const formsOnly = await approvedContractor('Forms', { postcode: HOME_ZIP, radius: 50, unit: 'mi', services: ['layout_forms'] });

		const whole = await matchContractors(home, 'whole_job');
		const found = ids(whole);
		expect(found.indexOf(near.id)).toBeGreaterThanOrEqual(0);
		expect(found.indexOf(far.id)).toBeGreaterThan(found.indexOf(near.id));
		expect(found).not.toContain(kmTooShort.id);
		expect(found).not.toContain(pending.id);
		expect(found).not.toContain(formsOnly.id);
		expect(ids(await matchContractors(home, 'layout_forms'))).toContain(formsOnly.id);

		// The SQL distance is the same haversine as the one in $lib/geo.
		const n = whole.find((m) => m.id === near.id)!;
		expect(n.distanceKm).toBeCloseTo(haversineKm(home, placeOf('52627')!), 6);
		expect(n.distanceKm).toBeGreaterThan(20);
		expect(n.distanceKm).toBeLessThan(40);
		expect(n).not.toHaveProperty('phone');
	});
});

describe('leads', () => {
	it('freeze the plan revision they were sent with; a re-send only flags the newer revision', async () => {
		const c = await approvedContractor('Freeze', { postcode: HOME_ZIP, radius: 10, unit: 'mi' });
		const { owner, plan: p } = await homeownerWithPlan();
		const sent = await sendLeads(owner, p.id, { scope: 'whole_job', timeframe: 'flexible', notes: 'Gate is on the left.', contractors: [c.id] }, origin);
		expect(sent).toEqual({ created: 1 });

		await db
			.update(plan)
			.set({ input: { units: 'metric', note: 'second' }, revision: 2 })
			.where(eq(plan.id, p.id));
		const [l] = await db
			.select()
			.from(lead)
			.where(and(eq(lead.planId, p.id), eq(lead.contractorId, c.id)));
		expect(l.planRevision).toBe(1);
		expect(l.snapshot.input).toEqual({ units: 'imperial', note: 'first' });

		// Sending to the same contractor again adds nothing; announcing the revision flags it once.
		expect(await sendLeads(owner, p.id, { scope: 'whole_job', timeframe: 'flexible', notes: 'changed', contractors: [c.id] }, origin)).toEqual({ created: 0 });
		expect(await announceRevision(owner, p.id, origin)).toBe(1);
		expect(await announceRevision(owner, p.id, origin)).toBe(0);
		const seen = await contractorLead(c.id, l.id);
		expect(seen?.lead.snapshot.input).toEqual({ units: 'imperial', note: 'first' });
		expect([seen?.lead.planRevision, seen?.lead.latestRevision]).toEqual([1, 2]);
		expect(seen?.lead.notes).toBe('Gate is on the left.');
		const mails = await db.select().from(mailOutbox).where(eq(mailOutbox.to, c.email)).orderBy(mailOutbox.createdAt);
		expect(mails.map((m) => m.subject).filter((s) => !s.startsWith('Confirm'))).toEqual([
			expect.stringMatching(/^New lead near Keokuk, IA$/),
			expect.stringMatching(/newer plan revision/)
		]);
	});

	it('refuse contractors outside the match and plans of someone else', async () => {
		const outside = await approvedContractor('Outside', { postcode: '52601', radius: 5, unit: 'mi' });
		const { owner, plan: p } = await homeownerWithPlan();
		await expect(sendLeads(owner, p.id, { scope: 'whole_job', timeframe: 'soon', notes: '', contractors: [outside.id] }, origin)).rejects.toBeInstanceOf(
			LeadRefused
		);
		const other = await homeownerWithPlan();
		expect(await sendLeads(other.owner, p.id, { scope: 'whole_job', timeframe: 'soon', notes: '', contractors: [outside.id] }, origin)).toBeNull();
		expect(await db.select().from(lead).where(eq(lead.planId, p.id))).toHaveLength(0);
	});

	it('hide the homeowner until the bid is accepted; accepting closes every other bid', async () => {
		const [a, b, c] = await Promise.all(['Alder', 'Birch', 'Cedar'].map((n) => approvedContractor(n, { postcode: HOME_ZIP, radius: 10, unit: 'mi' })));
		const { owner, plan: p } = await homeownerWithPlan();
		await sendLeads(owner, p.id, { scope: 'whole_job', timeframe: 'within_month', notes: '', contractors: [a.id, b.id, c.id] }, origin);
		const leads = await db.select().from(lead).where(eq(lead.planId, p.id));
		const leadOf = (id: string) => leads.find((l) => l.contractorId === id)!.id;

		await markLeadSeen(a.id, leadOf(a.id));
		expect((await contractorLead(a.id, leadOf(a.id)))?.lead.status).toBe('viewed');
		expect(await saveBid(a.id, leadOf(a.id), bidInput(2400), origin)).toBe(true);
		expect(await saveBid(b.id, leadOf(b.id), bidInput(2100), origin)).toBe(true);
		await declineLead(c.id, leadOf(c.id), 'Booked until autumn.');
		// Another contractor cannot touch a's lead at all.
		expect(await saveBid(b.id, leadOf(a.id), bidInput(1), origin)).toBe(false);
		expect(await contractorLead(b.id, leadOf(a.id))).toBeNull();

		const before = await contractorLead(a.id, leadOf(a.id));
		expect(before?.homeowner).toBeNull();
		expect(JSON.stringify(before)).not.toContain(owner.email);

		const [bidA] = await db
			.select()
			.from(bid)
			.where(eq(bid.leadId, leadOf(a.id)));
		expect(await acceptBid(owner.id, p.id, bidA.id, origin, site)).toBe(true);
		const after = await contractorLead(a.id, leadOf(a.id));
		expect(after?.homeowner).toEqual({ name: 'Hale Owner', email: owner.email, ...site });
		expect(after?.bid?.status).toBe('accepted');
		const statuses = Object.fromEntries((await db.select().from(lead).where(eq(lead.planId, p.id))).map((l) => [l.contractorId, l.status]));
		expect(statuses).toEqual({ [a.id]: 'won', [b.id]: 'not_selected', [c.id]: 'declined' });
		expect(
			(
				await db
					.select()
					.from(bid)
					.where(eq(bid.leadId, leadOf(b.id)))
			)[0].status
		).toBe('not_selected');
		await expect(saveBid(a.id, leadOf(a.id), bidInput(9999), origin)).rejects.toThrow(/closed/);
		const mails = await db.select().from(mailOutbox).where(eq(mailOutbox.to, b.email));
		expect(mails.some((m) => /was not selected/.test(m.subject))).toBe(true);
	});

	it('tell a firm that never bid that another firm was hired, not that its bid lost', async () => {
		const [a, quiet] = await Promise.all(['Hazel', 'Quince'].map((n) => approvedContractor(n, { postcode: HOME_ZIP, radius: 10, unit: 'mi' })));
		const { owner, plan: p } = await homeownerWithPlan();
		await sendLeads(owner, p.id, { scope: 'whole_job', timeframe: 'within_month', notes: '', contractors: [a.id, quiet.id] }, origin);
		const leads = await db.select().from(lead).where(eq(lead.planId, p.id));
		const leadOf = (id: string) => leads.find((l) => l.contractorId === id)!.id;
		expect(await saveBid(a.id, leadOf(a.id), bidInput(2400), origin)).toBe(true);
		const [bidA] = await db
			.select()
			.from(bid)
			.where(eq(bid.leadId, leadOf(a.id)));
		expect(await acceptBid(owner.id, p.id, bidA.id, origin, site)).toBe(true);
		const subjects = (await db.select().from(mailOutbox).where(eq(mailOutbox.to, quiet.email))).map((m) => m.subject);
		expect(subjects.some((t) => /another firm was hired/.test(t))).toBe(true);
		expect(subjects.some((t) => /bid .* not selected/.test(t))).toBe(false);
	});

	it('take a disabled firm out of matching, refuse its bids, and tell the homeowners waiting on it', async () => {
		const firm = await approvedContractor('Juniper', { postcode: HOME_ZIP, radius: 10, unit: 'mi' });
		const { owner, plan: p } = await homeownerWithPlan();
		await sendLeads(owner, p.id, { scope: 'whole_job', timeframe: 'within_month', notes: '', contractors: [firm.id] }, origin);
		const [l] = await db.select().from(lead).where(eq(lead.planId, p.id));
		expect(await saveBid(firm.id, l.id, bidInput(2400), origin)).toBe(true);
		const admin = await createUser({
			name: 'Desk Admin',
			email: `desk-${Date.now()}@example.test`,
			password: 'long-enough-pass',
			role: 'admin',
			verified: true
		});
		expect(await setAccountDisabled(admin, firm.id, true, 'Complaints under review.', origin)).toBe(true);
		const told = (await db.select().from(mailOutbox).where(eq(mailOutbox.to, owner.email))).map((m) => m.subject);
		expect(told.some((t) => /Juniper.* is suspended for now/.test(t))).toBe(true);
		// The bids page says the same: the firm's account reads as suspended, not as a lead awaiting a reply.
		expect((await leadsForPlan(p.id))[0].contractor.status).toBe('suspended');
		expect((await matchContractors(placeOf(HOME_ZIP)!, 'whole_job')).map((c) => c.id)).not.toContain(firm.id);
		const [b] = await db.select().from(bid).where(eq(bid.leadId, l.id));
		await expect(acceptBid(owner.id, p.id, b.id, origin, site)).rejects.toBeInstanceOf(LeadRefused);
	});

	it('let exactly one of two concurrent accepts win', async () => {
		const [a, b] = await Promise.all(['Elm', 'Fir'].map((n) => approvedContractor(n, { postcode: HOME_ZIP, radius: 10, unit: 'mi' })));
		const { owner, plan: p } = await homeownerWithPlan();
		await sendLeads(owner, p.id, { scope: 'whole_job', timeframe: 'soon', notes: '', contractors: [a.id, b.id] }, origin);
		const leads = await db.select().from(lead).where(eq(lead.planId, p.id));
		for (const l of leads) await saveBid(l.contractorId, l.id, bidInput(2000), origin);
		const bids = await db.select().from(bid).where(eq(bid.planId, p.id));
		expect(bids).toHaveLength(2);

		const results = await Promise.allSettled(bids.map((x) => acceptBid(owner.id, p.id, x.id, origin, site)));
		expect(results.map((r) => r.status).sort()).toEqual(['fulfilled', 'rejected']);
		const rejected = results.find((r) => r.status === 'rejected') as PromiseRejectedResult;
		expect(rejected.reason).toBeInstanceOf(LeadRefused);
		const after = await db.select().from(bid).where(eq(bid.planId, p.id));
		expect(after.map((x) => x.status).sort()).toEqual(['accepted', 'not_selected']);
		expect((await db.select().from(lead).where(eq(lead.planId, p.id))).map((l) => l.status).sort()).toEqual(['not_selected', 'won']);
	});

	it('refuse a bid from a contractor sent back to review, and keep a plan that contractors have', async () => {
		const a = await approvedContractor('Juniper', { postcode: HOME_ZIP, radius: 10, unit: 'mi' });
		const { owner, plan: p } = await homeownerWithPlan();
		await sendLeads(owner, p.id, { scope: 'whole_job', timeframe: 'soon', notes: '', contractors: [a.id] }, origin);
		const [l] = await db.select().from(lead).where(eq(lead.planId, p.id));
		await saveBid(a.id, l.id, bidInput(1900), origin);
		const [open] = await db.select().from(bid).where(eq(bid.leadId, l.id));
		await db.update(contractor).set({ status: 'awaiting_review' }).where(eq(contractor.userId, a.id));
		await expect(acceptBid(owner.id, p.id, open.id, origin, site)).rejects.toThrow(/not approved/);
		expect((await db.select().from(bid).where(eq(bid.id, open.id)))[0].status).toBe('open');
		expect(await unreadMessageCount({ id: a.id, role: 'contractor' })).toBe(0);
		await expect(deletePlan(p.id, owner.id)).rejects.toBeInstanceOf(PlanHasLeads);
		expect(await db.select().from(plan).where(eq(plan.id, p.id))).toHaveLength(1);
	});

	it('refuse an expired or withdrawn bid; withdrawing tells the homeowner and closes the thread', async () => {
		const [a, b] = await Promise.all(['Gale', 'Hazel'].map((n) => approvedContractor(n, { postcode: HOME_ZIP, radius: 10, unit: 'mi' })));
		const { owner, plan: p } = await homeownerWithPlan();
		await sendLeads(owner, p.id, { scope: 'whole_job', timeframe: 'soon', notes: '', contractors: [a.id, b.id] }, origin);
		const leads = await db.select().from(lead).where(eq(lead.planId, p.id));
		const la = leads.find((l) => l.contractorId === a.id)!;
		const lb = leads.find((l) => l.contractorId === b.id)!;
		await saveBid(a.id, la.id, bidInput(1500), origin);
		await db.update(bid).set({ validUntil: '2020-01-01' }).where(eq(bid.leadId, la.id));
		const [expired] = await db.select().from(bid).where(eq(bid.leadId, la.id));
		await expect(acceptBid(owner.id, p.id, expired.id, origin, site)).rejects.toThrow(/valid until 2020-01-01/);

		await saveBid(b.id, lb.id, bidInput(1700), origin);
		expect(await withdrawBid(b.id, lb.id, origin)).toBe(true);
		expect((await db.select().from(bid).where(eq(bid.leadId, lb.id)))[0].status).toBe('withdrawn');
		expect((await db.select().from(lead).where(eq(lead.id, lb.id)))[0].status).toBe('withdrawn');
		const told = await mailsTo(owner.email);
		expect(told.filter((m) => /withdrew their bid/.test(m.subject))).toHaveLength(1);
		await expect(withdrawBid(b.id, lb.id, origin)).rejects.toThrow(/no open bid/);
		await expect(saveBid(b.id, lb.id, bidInput(1700), origin)).rejects.toThrow(/closed/);
		// The thread stays readable but takes no new messages from either side.
		await expect(postMessage({ ...b, role: 'contractor' }, lb.id, 'One more thing', origin)).rejects.toThrow(/read|closed/);
		await expect(postMessage({ ...owner, role: 'homeowner' }, lb.id, 'Why?', origin)).rejects.toBeInstanceOf(LeadRefused);
	});
});

const mailsTo = (to: string) => db.select().from(mailOutbox).where(eq(mailOutbox.to, to)).orderBy(mailOutbox.createdAt);

describe('suspension and reinstatement', () => {
	it('tell each homeowner with an open or accepted bid that Stakeline suspended the contractor, withdraw nothing, and restore open leads on reinstatement', async () => {
		const admin = await createUser({ name: 'Ivy Admin', email: unique('admin'), password: 'admin-password', role: 'admin' });
		const c = await approvedContractor('Quill', { postcode: HOME_ZIP, radius: 10, unit: 'mi' });
		const other = await approvedContractor('Rook', { postcode: HOME_ZIP, radius: 10, unit: 'mi' });
		// Homeowner A: an open bid from c. Homeowner B: c's bid accepted, Rook not selected. Homeowner C: a lead c declined.
		const a = await homeownerWithPlan();
		const b = await homeownerWithPlan();
		const d = await homeownerWithPlan();
		await sendLeads(a.owner, a.plan.id, { scope: 'whole_job', timeframe: 'soon', notes: '', contractors: [c.id] }, origin);
		await sendLeads(b.owner, b.plan.id, { scope: 'whole_job', timeframe: 'soon', notes: '', contractors: [c.id, other.id] }, origin);
		await sendLeads(d.owner, d.plan.id, { scope: 'whole_job', timeframe: 'soon', notes: '', contractors: [c.id] }, origin);
		const leadOf = async (planId: string, who: string) =>
			(
				await db
					.select()
					.from(lead)
					.where(and(eq(lead.planId, planId), eq(lead.contractorId, who)))
			)[0];
		const la = await leadOf(a.plan.id, c.id);
		const lb = await leadOf(b.plan.id, c.id);
		const lbOther = await leadOf(b.plan.id, other.id);
		await saveBid(c.id, la.id, bidInput(1800), origin);
		await saveBid(c.id, lb.id, bidInput(2100), origin);
		await saveBid(other.id, lbOther.id, bidInput(2300), origin);
		await declineLead(c.id, (await leadOf(d.plan.id, c.id)).id, 'Too far for us.');
		const [won] = await db.select().from(bid).where(eq(bid.leadId, lb.id));
		await acceptBid(b.owner.id, b.plan.id, won.id, origin, site);

		await decide(admin, c.id, 'suspend', 'A complaint to look into.', origin);
		// Nothing is withdrawn: the bids keep their state, and the open one simply cannot be accepted.
		expect((await db.select().from(bid).where(eq(bid.leadId, la.id)))[0].status).toBe('open');
		expect((await leadOf(a.plan.id, c.id)).status).toBe('bid_sent');
		expect((await db.select().from(bid).where(eq(bid.leadId, lb.id)))[0].status).toBe('accepted');
		const [openBid] = await db.select().from(bid).where(eq(bid.leadId, la.id));
		await expect(acceptBid(a.owner.id, a.plan.id, openBid.id, origin, site)).rejects.toThrow(/not approved/);

		const toA = (await mailsTo(a.owner.email)).filter((m) => /suspended for now/.test(m.subject));
		const toB = (await mailsTo(b.owner.email)).filter((m) => /suspended for now/.test(m.subject));
		expect(toA).toHaveLength(1);
		expect(toB).toHaveLength(1);
		expect(toA[0].text).toContain('the contractor did not withdraw');
		expect(toA[0].text).not.toMatch(/withdrew/);
		expect(toA[0].text).toContain('cannot be accepted until the account is active again');
		expect(toB[0].text).toContain('the job is on hold');
		expect(toB[0].text).toContain('reopen bidding');
		expect(toA[0].text).toContain(`${origin}/plans/${a.plan.id}/bids`);
		// The declined lead's homeowner has nothing at stake and hears nothing.
		expect((await mailsTo(d.owner.email)).filter((m) => /suspended/.test(m.subject))).toHaveLength(0);

		await decide(admin, c.id, 'reinstate', null, origin);
		expect(await status(c.id)).toBe('approved');
		expect((await leadOf(a.plan.id, c.id)).status).toBe('bid_sent');
		expect(await acceptBid(a.owner.id, a.plan.id, openBid.id, origin, site)).toBe(true);
		for (const who of [a.owner.email, b.owner.email]) expect((await mailsTo(who)).filter((m) => /is active again/.test(m.subject))).toHaveLength(1);
		const toContractor = (await mailsTo(c.email)).filter((m) => /active again/.test(m.subject));
		expect(toContractor[0].text).toContain('your leads that are still open are back on your desk');
	});

	it('let the homeowner of an accepted job reopen bidding while the contractor is suspended, and tell both contractors', async () => {
		const admin = await createUser({ name: 'Ivy Admin', email: unique('admin'), password: 'admin-password', role: 'admin' });
		const c = await approvedContractor('Sable', { postcode: HOME_ZIP, radius: 10, unit: 'mi' });
		const other = await approvedContractor('Teal', { postcode: HOME_ZIP, radius: 10, unit: 'mi' });
		const { owner, plan: p } = await homeownerWithPlan();
		await sendLeads(owner, p.id, { scope: 'whole_job', timeframe: 'soon', notes: '', contractors: [c.id, other.id] }, origin);
		const leads = await db.select().from(lead).where(eq(lead.planId, p.id));
		const lc = leads.find((l) => l.contractorId === c.id)!;
		const lo = leads.find((l) => l.contractorId === other.id)!;
		await saveBid(c.id, lc.id, bidInput(2000), origin);
		await saveBid(other.id, lo.id, bidInput(2200), origin);
		await acceptBid(owner.id, p.id, (await db.select().from(bid).where(eq(bid.leadId, lc.id)))[0].id, origin, site);
		await expect(reopenBidding(owner.id, p.id, origin)).rejects.toThrow(/good standing/);

		await decide(admin, c.id, 'suspend', 'A complaint to look into.', origin);
		expect(await reopenBidding(owner.id, p.id, origin)).toEqual({ reopened: 1 });
		const byLead = async (id: string) => [
			(await db.select().from(bid).where(eq(bid.leadId, id)))[0].status,
			(await db.select().from(lead).where(eq(lead.id, id)))[0].status
		];
		expect(await byLead(lc.id)).toEqual(['released', 'released']);
		expect(await byLead(lo.id)).toEqual(['open', 'bid_sent']);
		expect((await mailsTo(c.email)).filter((m) => /was released/.test(m.subject))).toHaveLength(1);
		expect((await mailsTo(other.email)).filter((m) => /Bidding reopened/.test(m.subject))).toHaveLength(1);
		// The reopened bid can now be accepted.
		expect(await acceptBid(owner.id, p.id, (await db.select().from(bid).where(eq(bid.leadId, lo.id)))[0].id, origin, site)).toBe(true);
	});
});

describe('notices', () => {
	it('are written in the transaction of the change they report: rolled back with it, kept with its commit', async () => {
		const c = await approvedContractor('Umber', { postcode: HOME_ZIP, radius: 10, unit: 'mi' });
		const { owner, plan: p } = await homeownerWithPlan();
		await sendLeads(owner, p.id, { scope: 'whole_job', timeframe: 'soon', notes: '', contractors: [c.id] }, origin);
		const [l] = await db.select().from(lead).where(eq(lead.planId, p.id));
		await saveBid(c.id, l.id, bidInput(1500), origin);
		const before = (await mailsTo(owner.email)).length;
		// A crash after the notices were written and before the commit: neither change nor notice survives.
		await expect(
			db.transaction(async (tx) => {
				await tx.update(contractor).set({ status: 'suspended' }).where(eq(contractor.userId, c.id));
				expect(await tellHomeownersOfContractorChange(tx, c.id, 'Umber', 'suspended', origin)).toBe(1);
				throw new Error('crash before commit');
			})
		).rejects.toThrow('crash before commit');
		expect(await mailsTo(owner.email)).toHaveLength(before);
		expect(await status(c.id)).toBe('approved');
		await db.transaction(async (tx) => {
			await tellHomeownersOfContractorChange(tx, c.id, 'Umber', 'suspended', origin);
		});
		expect(await mailsTo(owner.email)).toHaveLength(before + 1);
	});
});

describe('messages', () => {
	it('go only between the two sides of a lead and count as unread until the thread is opened', async () => {
		const c = await approvedContractor('Juniper', { postcode: HOME_ZIP, radius: 10, unit: 'mi' });
		const stranger = await approvedContractor('Kestrel', { postcode: HOME_ZIP, radius: 10, unit: 'mi' });
		const { owner, plan: p } = await homeownerWithPlan();
		await sendLeads(owner, p.id, { scope: 'whole_job', timeframe: 'soon', notes: '', contractors: [c.id] }, origin);
		const [l] = await db.select().from(lead).where(eq(lead.planId, p.id));

		expect(await postMessage({ ...owner, role: 'homeowner' }, l.id, 'Can you start on a Saturday?', origin)).toBe(true);
		expect(await postMessage({ ...stranger, role: 'contractor' }, l.id, 'Pick me instead', origin)).toBe(false);
		expect(await unreadMessageCount({ id: c.id, role: 'contractor' })).toBe(1);
		expect(await unreadMessageCount({ id: owner.id, role: 'homeowner' })).toBe(0);
		await markLeadSeen(c.id, l.id);
		expect(await unreadMessageCount({ id: c.id, role: 'contractor' })).toBe(0);
		await postMessage({ ...c, role: 'contractor' }, l.id, 'Yes, Saturdays work.', origin);
		expect(await unreadMessageCount({ id: owner.id, role: 'homeowner' })).toBe(1);
	});
});

describe('lead photos', () => {
	it('are the plan photos at the time of sending, for that lead’s contractor only', async () => {
		const c = await approvedContractor('Lumen', { postcode: HOME_ZIP, radius: 10, unit: 'mi' });
		const other = await approvedContractor('Moth', { postcode: HOME_ZIP, radius: 10, unit: 'mi' });
		const { owner, plan: p } = await homeownerWithPlan();
		const photo = { storageKey: 'k', thumbKey: 't', contentType: 'image/jpeg', bytes: 3, originalName: 'yard.jpg' };
		const [before] = await db
			.insert(planPhoto)
			.values({ planId: p.id, ...photo })
			.returning();
		await sendLeads(owner, p.id, { scope: 'whole_job', timeframe: 'soon', notes: '', contractors: [c.id, other.id] }, origin);
		const [after] = await db
			.insert(planPhoto)
			.values({ planId: p.id, ...photo })
			.returning();
		const [l] = await db
			.select()
			.from(lead)
			.where(and(eq(lead.planId, p.id), eq(lead.contractorId, c.id)));

		expect(l.snapshot.photoIds).toEqual([before.id]);
		expect(await leadPhotoPlan(c.id, l.id, before.id)).toBe(p.id);
		expect(await leadPhotoPlan(c.id, l.id, after.id)).toBeNull(); // added after sending
		expect(await leadPhotoPlan(other.id, l.id, before.id)).toBeNull(); // not their lead
	});
});

// Billing against the real PostgreSQL test database and the local fake payment provider that
// npm test starts (scripts/payments-fake.mjs): the SDK calls the fake, the fake posts signed events
// to a small webhook receiver here, which checks them with the SDK helper and applies them.
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { env } from '$env/dynamic/private';
import { extraLead, monthlyPlan, leadPack } from '$lib/billing-plans';
import { db } from '../db';
import { billingAccount, billingEvent, contractor, lead, leadCharge, mailOutbox, user } from '../db/schema';
import { saveBid } from '../bids';
import { closeRequest, expireLeadsNow, sendLeads } from '../leads';
import { matchContractors, placeOf } from '../matching';
import { createUser } from '../users';
import { billingAccountOf, extraLeadsThisPeriod, openLeadFor } from './accounts';
import { syncExtraLead } from './extra-leads';
import { invoicesOf, setCancelAtPeriodEnd, startCardUpdate, startPackCheckout, startPlanCheckout } from './checkout';
import { payments } from './client';
import { applyEvent, BadSignature, verifyEvent } from './webhooks';
import { homeownerWithPlan } from '../integration-fixtures';
import { uniqueEmail as unique, useTestDatabase } from '../integration-setup';

const origin = 'http://127.0.0.1:3000';
const fake = `http://127.0.0.1:${env.PAYMENTS_FAKE_PORT}`;
const future = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
// A real ZIP code (Oskaloosa, Iowa) used only for its centroid.
const ZIP = '52577';
const place = placeOf(ZIP)!;

/** Every event the fake delivered, raw, with the receiver's answer. */
const delivered: { payload: string; signature: string; status: number; result?: string }[] = [];
let receiver: http.Server;
let previousWebhookUrl = '';

async function fakeControl(path: string, body: Record<string, string>) {
	const res = await fetch(`${fake}${path}`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
	expect(res.ok, `${path}: ${await res.clone().text()}`).toBe(true);
	return res.json();
}

useTestDatabase();
beforeAll(async () => {
	receiver = http.createServer((req, res) => {
		const chunks: Buffer[] = [];
		req.on('data', (c) => chunks.push(c));
		req.on('end', async () => {
			const payload = Buffer.concat(chunks).toString('utf8');
			const signature = String(req.headers['stripe-signature'] ?? '');
			try {
				const out = await applyEvent(verifyEvent(payload, signature), origin);
				delivered.push({ payload, signature, status: 200, result: out.result });
				res.writeHead(200).end('{}');
			} catch (err) {
				delivered.push({ payload, signature, status: err instanceof BadSignature ? 400 : 500 });
				res.writeHead(err instanceof BadSignature ? 400 : 500).end();
			}
		});
	});
	await new Promise<void>((r) => receiver.listen(0, '127.0.0.1', r));
	const { port } = receiver.address() as AddressInfo;
	previousWebhookUrl = (await fakeControl('/_fake/config', { webhookUrl: `http://127.0.0.1:${port}/hook` })).previous;
});

afterAll(async () => {
	await fakeControl('/_fake/config', { webhookUrl: previousWebhookUrl });
	await new Promise((r) => receiver.close(r));
});

async function approvedContractor(name: string) {
	const email = unique('pro');
	const u = await createUser({ name, email, password: 'contractor-pass', role: 'contractor' });
	await db
		.update(contractor)
		.set({
			businessName: `${name} Co ${crypto.randomUUID().slice(0, 6)}`,
			status: 'approved',
			services: ['whole_job'],
			servicePostcode: ZIP,
			serviceRadius: 10,
			serviceRadiusUnit: 'mi',
			serviceLat: place.lat,
			serviceLon: place.lon,
			submittedAt: new Date()
		})
		.where(eq(contractor.userId, u.id));
	return { id: u.id, email, name };
}

/** A homeowner's plan sent to the contractor; returns the lead and the plan. */
async function leadFor(contractorId: string) {
	const { owner, plan: p } = await homeownerWithPlan('Ines Owner', {
		name: 'Back walk',
		postcode: ZIP,
		figures: { area: { squareFeet: 80, squareMeters: 7.43 } }
	});
	await sendLeads(owner, p.id, { scope: 'whole_job', timeframe: 'flexible', notes: '', contractors: [contractorId] }, origin);
	const [l] = await db
		.select()
		.from(lead)
		.where(and(eq(lead.planId, p.id), eq(lead.contractorId, contractorId)));
	return { lead: l, owner, planId: p.id };
}

/** Pays (or cancels) a checkout on the fake's own page, as the browser's form would. */
async function onFakePage(url: string, button: 'complete' | 'cancel', card = 'good') {
	const page = await fetch(url);
	expect(page.status).toBe(200);
	expect(await page.text()).toContain('nothing is charged');
	const res = await fetch(`${url}/${button}`, {
		method: 'POST',
		headers: { 'content-type': 'application/x-www-form-urlencoded' },
		body: `card=${card}`,
		redirect: 'manual'
	});
	expect(res.status).toBe(303);
	return res.headers.get('location')!;
}

const account = (id: string) => billingAccountOf(id);
const eventsOf = (type: string) => delivered.filter((d) => JSON.parse(d.payload).type === type);

describe('webhook signatures (the SDK helper)', () => {
	const body = JSON.stringify({ id: 'evt_sig_test', object: 'event', type: 'invoice.paid', data: { object: { object: 'invoice', customer: 'cus_nobody' } } });
	const header = (payload: string, o: { timestamp?: number; secret?: string } = {}) =>
		payments().webhooks.generateTestHeaderString({ payload, secret: o.secret ?? env.PAYMENTS_WEBHOOK_SECRET!, timestamp: o.timestamp });

	it('accepts an event signed with our secret', () => {
		expect(verifyEvent(body, header(body)).id).toBe('evt_sig_test');
	});
	it('rejects a tampered body, another secret, a stale timestamp and a missing header', () => {
		const h = header(body);
		expect(() => verifyEvent(body.replace('invoice.paid', 'invoice.payment_failed'), h)).toThrow(BadSignature);
		expect(() => verifyEvent(body, header(body, { secret: 'whsec_someone_else' }))).toThrow(BadSignature);
		expect(() => verifyEvent(body, header(body, { timestamp: Math.floor(Date.now() / 1000) - 3600 }))).toThrow(BadSignature);
		expect(() => verifyEvent(body, null)).toThrow(BadSignature);
	});
});

describe('checkout through the fake', () => {
	it('activates the plan on the completed checkout, lists the paid invoice, and ignores a replayed event', async () => {
		const c = await approvedContractor('Checkout');
		const url = await startPlanCheckout(c, origin);
		expect(url.startsWith(`${fake}/pay/`)).toBe(true);
		const before = delivered.length;
		const back = await onFakePage(url, 'complete');
		expect(back).toMatch(/^http:\/\/127\.0\.0\.1:3000\/pro\/billing\?checkout=done&session=cs_test_/);
		const mine = delivered.slice(before);
		expect(mine.map((d) => JSON.parse(d.payload).type)).toEqual(['checkout.session.completed', 'invoice.paid']);
		expect(mine.every((d) => d.status === 200 && d.result === 'applied')).toBe(true);

		const a = await account(c.id);
		expect(a.status).toBe('active');
		expect(a.subscriptionId).toMatch(/^sub_/);
		expect(a.periodEnd!.getTime() - a.periodStart!.getTime()).toBe(30 * 86_400_000);
		const inv = await invoicesOf(c.id);
		expect(inv).toHaveLength(1);
		expect(inv[0]).toMatchObject({ status: 'paid', amountCents: monthlyPlan.monthlyCents });
		const [mail] = await db
			.select()
			.from(mailOutbox)
			.where(and(eq(mailOutbox.to, c.email), eq(mailOutbox.subject, `Your ${monthlyPlan.name} plan is active`)));
		expect(mail).toBeTruthy();

		// The provider delivering the same event again (same id, signed again) changes nothing.
		const { l } = { l: (await leadFor(c.id)).lead };
		expect(await openLeadFor(c.id, l.id)).toBe('open');
		const used = (await account(c.id)).leadsUsed;
		expect(used).toBe(1);
		for (const d of mine) {
			const out = await applyEvent(
				verifyEvent(d.payload, payments().webhooks.generateTestHeaderString({ payload: d.payload, secret: env.PAYMENTS_WEBHOOK_SECRET! })),
				origin
			);
			expect(out.result).toBe('replayed');
		}
		expect((await account(c.id)).leadsUsed).toBe(used);
		const stored = await db.select().from(billingEvent).where(eq(billingEvent.contractorId, c.id));
		expect(stored).toHaveLength(2);
	});

	it('leaves everything as it was when the contractor cancels on the payment page', async () => {
		const c = await approvedContractor('Cancelled');
		const before = delivered.length;
		const back = await onFakePage(await startPlanCheckout(c, origin), 'cancel');
		expect(back).toBe(`${origin}/pro/billing?checkout=cancelled`);
		expect(delivered.length).toBe(before);
		expect((await account(c.id)).status).toBe('none');
	});

	it('adds credits for a paid lead pack', async () => {
		const c = await approvedContractor('Pack');
		await onFakePage(await startPackCheckout(c, origin), 'complete');
		const a = await account(c.id);
		expect(a.credits).toBe(leadPack.leads);
		expect(a.status).toBe('none');
		// A credit opens one lead; the credit is used.
		const { lead: l } = await leadFor(c.id);
		expect(await openLeadFor(c.id, l.id)).toBe('open');
		expect((await account(c.id)).credits).toBe(leadPack.leads - 1);
	});
});

describe('enforcement', () => {
	it('shows no details without a plan or credit', async () => {
		const c = await approvedContractor('NoPlan');
		const { lead: l } = await leadFor(c.id);
		expect(await openLeadFor(c.id, l.id)).toBe('locked');
		expect(await db.select().from(leadCharge).where(eq(leadCharge.leadId, l.id))).toHaveLength(0);
		// Someone else's lead is not there at all.
		const other = await approvedContractor('Other');
		expect(await openLeadFor(other.id, l.id)).toBeNull();
	});

	it('a failed payment makes the account past due and pauses delivery; a new card pays it and lifts the pause', async () => {
		const c = await approvedContractor('Overdue');
		await onFakePage(await startPlanCheckout(c, origin), 'complete', 'declines');
		const opened = (await leadFor(c.id)).lead;
		expect(await openLeadFor(c.id, opened.id)).toBe('open');
		const a = await account(c.id);
		expect((await matchContractors(place, 'whole_job')).map((m) => m.id)).toContain(c.id);

		await fakeControl('/_fake/renew', { subscription: a.subscriptionId! });
		expect((await account(c.id)).status).toBe('past_due');
		expect(eventsOf('invoice.payment_failed').length).toBeGreaterThan(0);
		expect((await matchContractors(place, 'whole_job')).map((m) => m.id)).not.toContain(c.id);
		const [failedMail] = await db
			.select()
			.from(mailOutbox)
			.where(and(eq(mailOutbox.to, c.email), eq(mailOutbox.subject, 'Your Stakeline payment did not go through')));
		expect(failedMail).toBeTruthy();
		// The lead opened before stays open; a new one does not open while overdue.
		expect(await openLeadFor(c.id, opened.id)).toBe('open');
		await db.update(billingAccount).set({ status: 'active' }).where(eq(billingAccount.contractorId, c.id));
		const fresh = (await leadFor(c.id)).lead;
		await db.update(billingAccount).set({ status: 'past_due' }).where(eq(billingAccount.contractorId, c.id));
		expect(await openLeadFor(c.id, fresh.id)).toBe('locked');

		// Saving a card that pays retries the overdue invoice: the account is active, the new period counts from zero.
		await onFakePage(await startCardUpdate(c, origin), 'complete', 'good');
		const after = await account(c.id);
		expect(after.status).toBe('active');
		expect(after.leadsUsed).toBe(0);
		expect(after.periodStart!.getTime()).toBe(a.periodEnd!.getTime());
		expect(await openLeadFor(c.id, fresh.id)).toBe('open');
		expect((await invoicesOf(c.id)).map((i) => i.status)).toEqual(['paid', 'paid']);
	});

	it('cancelling at period end keeps the plan until the provider ends it', async () => {
		const c = await approvedContractor('Leaving');
		await onFakePage(await startPlanCheckout(c, origin), 'complete');
		expect(await setCancelAtPeriodEnd(c.id, true)).toBe(true);
		const a = await account(c.id);
		expect(a).toMatchObject({ status: 'active', cancelAtPeriodEnd: true });
		await fakeControl('/_fake/renew', { subscription: a.subscriptionId! });
		expect(await account(c.id)).toMatchObject({ status: 'cancelled', cancelAtPeriodEnd: false });
		const { lead: l } = await leadFor(c.id);
		expect(await openLeadFor(c.id, l.id)).toBe('locked');
	});
});

describe('credits given back', () => {
	async function activeWithLead() {
		const c = await approvedContractor('Refund');
		await onFakePage(await startPlanCheckout(c, origin), 'complete');
		const sent = await leadFor(c.id);
		expect(await openLeadFor(c.id, sent.lead.id)).toBe('open');
		expect((await account(c.id)).leadsUsed).toBe(1);
		return { c, ...sent };
	}

	it('a lead that expires unanswered gives its included lead back, once', async () => {
		const { c, lead: l } = await activeWithLead();
		await db
			.update(lead)
			.set({ respondBy: future(-2) })
			.where(eq(lead.id, l.id));
		expect(await expireLeadsNow({ contractorId: c.id }, origin)).toBe(1);
		expect((await account(c.id)).leadsUsed).toBe(0);
		const [charge] = await db.select().from(leadCharge).where(eq(leadCharge.leadId, l.id));
		expect(charge.refundReason).toBe('expired');
		expect(await expireLeadsNow({ contractorId: c.id }, origin)).toBe(0);
		expect((await account(c.id)).leadsUsed).toBe(0);
		// The details stay open to the contractor who opened them.
		expect(await openLeadFor(c.id, l.id)).toBe('open');
	});

	it('a request closed before any bid gives the lead back; one closed after a bid does not', async () => {
		const first = await activeWithLead();
		await closeRequest(first.owner.id, first.planId, origin);
		expect((await account(first.c.id)).leadsUsed).toBe(0);

		const second = await activeWithLead();
		await saveBid(
			second.c.id,
			second.lead.id,
			{ totalCents: 240000, lineItems: [], earliestStart: future(5), durationDays: 2, validUntil: future(30), inclusions: '', exclusions: '', notes: '' },
			origin
		);
		await closeRequest(second.owner.id, second.planId, origin);
		expect((await account(second.c.id)).leadsUsed).toBe(1);
		const [charge] = await db.select().from(leadCharge).where(eq(leadCharge.leadId, second.lead.id));
		expect(charge.refundedAt).toBeNull();
	});

	it('a lead charged in an earlier period comes back as a credit', async () => {
		const { c, lead: l } = await activeWithLead();
		const a = await account(c.id);
		await fakeControl('/_fake/renew', { subscription: a.subscriptionId!, outcome: 'paid' });
		expect((await account(c.id)).leadsUsed).toBe(0);
		await db
			.update(lead)
			.set({ respondBy: future(-1) })
			.where(eq(lead.id, l.id));
		await expireLeadsNow({ contractorId: c.id }, origin);
		expect(await account(c.id)).toMatchObject({ leadsUsed: 0, credits: 1 });
	});
});

describe('extra leads beyond the plan', () => {
	/** The customer's invoice items at the fake that wait for the next invoice. */
	async function pendingItems(customerId: string) {
		const res = await fetch(`${fake}/v1/invoiceitems?customer=${customerId}&pending=true`, { headers: { authorization: `Bearer ${env.PAYMENTS_SECRET_KEY}` } });
		expect(res.ok).toBe(true);
		return ((await res.json()) as { data: { id: string; amount: number; metadata: Record<string, string> }[] }).data;
	}
	const chargeOf = async (leadId: string) => (await db.select().from(leadCharge).where(eq(leadCharge.leadId, leadId)))[0];
	const mailsTo = (email: string) => db.select().from(mailOutbox).where(eq(mailOutbox.to, email));

	it('asks first, bills an extra lead on the next invoice once, takes a given-back one off, and credits one given back after invoicing', async () => {
		const c = await approvedContractor('Extra');
		await onFakePage(await startPlanCheckout(c, origin), 'complete');
		await db.update(billingAccount).set({ leadsUsed: monthlyPlan.leadsIncluded }).where(eq(billingAccount.contractorId, c.id));
		const a = await account(c.id);

		// All included leads used, no credit: following the lead's link charges nothing, it asks.
		const first = await leadFor(c.id);
		expect(await openLeadFor(c.id, first.lead.id)).toBe('extra');
		expect(await chargeOf(first.lead.id)).toBeUndefined();
		// Agreed: the lead opens now and its charge waits for the job that bills it.
		expect(await openLeadFor(c.id, first.lead.id, { agreeExtra: true })).toBe('open');
		expect(await chargeOf(first.lead.id)).toMatchObject({ kind: 'extra', extraState: 'pending', invoiceItemId: null });
		expect(await syncExtraLead(first.lead.id)).toBe('billed');
		expect(await syncExtraLead(first.lead.id)).toBe('billed');
		let items = await pendingItems(a.customerId!);
		expect(items).toHaveLength(1);
		expect(items[0]).toMatchObject({ amount: extraLead.cents, metadata: { leadId: first.lead.id } });
		expect(await extraLeadsThisPeriod(await account(c.id))).toEqual({ count: 1, cents: extraLead.cents });
		// Opened once, charged once: opening again costs nothing.
		expect(await openLeadFor(c.id, first.lead.id, { agreeExtra: true })).toBe('open');
		expect(await extraLeadsThisPeriod(await account(c.id))).toEqual({ count: 1, cents: extraLead.cents });

		// A second extra lead the homeowner closes before any bid: its item comes off the next invoice.
		const second = await leadFor(c.id);
		expect(await openLeadFor(c.id, second.lead.id, { agreeExtra: true })).toBe('open');
		expect(await syncExtraLead(second.lead.id)).toBe('billed');
		expect(await pendingItems(a.customerId!)).toHaveLength(2);
		await closeRequest(second.owner.id, second.planId, origin);
		expect(await syncExtraLead(second.lead.id)).toBe('removed');
		items = await pendingItems(a.customerId!);
		expect(items.map((i) => i.metadata.leadId)).toEqual([first.lead.id]);
		expect(await extraLeadsThisPeriod(await account(c.id))).toEqual({ count: 1, cents: extraLead.cents });

		// The next month's invoice carries the plan and the one extra lead; the receipt says so.
		await fakeControl('/_fake/renew', { subscription: a.subscriptionId!, outcome: 'paid' });
		const [latest] = await invoicesOf(c.id);
		expect(latest).toMatchObject({ status: 'paid', amountCents: monthlyPlan.monthlyCents + extraLead.cents });
		expect(latest.lines.map((l) => l.amountCents)).toEqual([monthlyPlan.monthlyCents, extraLead.cents]);
		expect(await pendingItems(a.customerId!)).toHaveLength(0);
		const receipt = (await mailsTo(c.email)).find((m) => m.subject === 'Your Stakeline payment was received');
		expect(receipt?.text).toContain(`We received $${(monthlyPlan.monthlyCents + extraLead.cents) / 100} for ${monthlyPlan.name} and 1 extra lead.`);
		expect(await account(c.id)).toMatchObject({ leadsUsed: 0, credits: 0 });

		// Given back after it was invoiced (it expired unanswered): a credit, once.
		await db
			.update(lead)
			.set({ respondBy: future(-1) })
			.where(eq(lead.id, first.lead.id));
		await expireLeadsNow({ contractorId: c.id }, origin);
		expect(await syncExtraLead(first.lead.id)).toBe('credited');
		expect(await syncExtraLead(first.lead.id)).toBe('credited');
		expect((await account(c.id)).credits).toBe(1);
	});

	it('opens no extra lead without a subscription to bill, or while a payment is overdue', async () => {
		const c = await approvedContractor('NoSub');
		await db.insert(billingAccount).values({ contractorId: c.id, status: 'active', periodStart: new Date(), leadsUsed: monthlyPlan.leadsIncluded });
		const { lead: l } = await leadFor(c.id);
		expect(await openLeadFor(c.id, l.id, { agreeExtra: true })).toBe('locked');
		await db
			.update(billingAccount)
			.set({ status: 'past_due', customerId: `cus_x_${c.id}`, subscriptionId: 'sub_x' })
			.where(eq(billingAccount.contractorId, c.id));
		expect(await openLeadFor(c.id, l.id, { agreeExtra: true })).toBe('locked');
		expect(await chargeOf(l.id)).toBeUndefined();
	});

	it('bills extra leads still owed on a final invoice when the plan ends', async () => {
		const c = await approvedContractor('Final');
		await onFakePage(await startPlanCheckout(c, origin), 'complete');
		await db.update(billingAccount).set({ leadsUsed: monthlyPlan.leadsIncluded }).where(eq(billingAccount.contractorId, c.id));
		const { lead: l } = await leadFor(c.id);
		expect(await openLeadFor(c.id, l.id, { agreeExtra: true })).toBe('open');
		await syncExtraLead(l.id);
		await setCancelAtPeriodEnd(c.id, true);
		await fakeControl('/_fake/renew', { subscription: (await account(c.id)).subscriptionId! });
		expect((await account(c.id)).status).toBe('cancelled');
		const [final] = await invoicesOf(c.id);
		expect(final).toMatchObject({ status: 'paid', amountCents: extraLead.cents });
		const subjects = (await mailsTo(c.email)).map((m) => m.subject);
		expect(subjects).toContain('Your Stakeline plan has ended');
		expect(subjects).toContain('Your final Stakeline invoice was paid');
	});
});

describe('money notices and the mail settings', () => {
	it('leaves out the receipts a contractor turned off, never the notices that limit the account', async () => {
		const c = await approvedContractor('Quiet');
		await db
			.update(user)
			.set({ mailOptOut: ['billing'] })
			.where(eq(user.id, c.id));
		await onFakePage(await startPlanCheckout(c, origin), 'complete', 'declines');
		await onFakePage(await startPackCheckout(c, origin), 'complete', 'declines');
		const a = await account(c.id);
		expect(a).toMatchObject({ status: 'active', credits: leadPack.leads });
		await fakeControl('/_fake/renew', { subscription: a.subscriptionId! });
		expect((await account(c.id)).status).toBe('past_due');
		await onFakePage(await startCardUpdate(c, origin), 'complete', 'good');
		expect((await account(c.id)).status).toBe('active');
		await fakeControl('/_fake/renew', { subscription: a.subscriptionId!, outcome: 'paid' });
		const subjects = (await db.select().from(mailOutbox).where(eq(mailOutbox.to, c.email))).map((m) => m.subject).sort();
		// No plan-active, credits-added or payment-received receipts; the failure and the recovery do go.
		expect(subjects).toEqual(['Your Stakeline payment did not go through', 'Your Stakeline payment went through: leads resume']);
		const [failed] = await db
			.select()
			.from(mailOutbox)
			.where(and(eq(mailOutbox.to, c.email), eq(mailOutbox.subject, 'Your Stakeline payment did not go through')));
		expect(failed.text).toContain(`The payment of $${monthlyPlan.monthlyCents / 100} for ${monthlyPlan.name} failed.`);

		// Someone who keeps receipts gets them.
		const d = await approvedContractor('Receipts');
		await onFakePage(await startPlanCheckout(d, origin), 'complete');
		await onFakePage(await startPackCheckout(d, origin), 'complete');
		const got = (await db.select().from(mailOutbox).where(eq(mailOutbox.to, d.email))).map((m) => m.subject);
		expect(got).toEqual(expect.arrayContaining([`Your ${monthlyPlan.name} plan is active`, `${leadPack.leads} lead credits added`]));
	});
});

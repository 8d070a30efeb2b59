import { and, eq, inArray, ne, sql } from 'drizzle-orm';
import { isExpired } from '$lib/leads';
import { leadTarget, openLeadStatuses, statusesMovedBy } from '$lib/lead-status';
import { formatDate } from '$lib/plan-view';
import type { BidInput } from '$lib/schemas/leads';
import { db } from '$lib/server/db';
import { bid, contractor, lead } from '$lib/server/db/schema';
import { queueMail } from './mail';
import { bidDecisionMail, biddingReopenedMail, bidWithdrawnMail, jobReleasedMail, newBidMail } from './mail/pro-notices';
import {
	accountDisabledSql,
	bidsUrl,
	credentialsCurrentSql,
	homeownerOf,
	leadContractors,
	LeadRefused,
	leadUrl,
	lockOwnLead,
	lockOwnPlan,
	saveJobContact,
	step,
	today,
	type JobContactInput,
	type Tx
} from './lead-shared';

// Bids: a contractor's bid, its withdrawal, and the homeowner accepting one or reopening bidding.

/**
 * Accepts one bid in one transaction. The plan row is locked first, so two accepts for the same
 * plan run one after the other and the second finds the first's accepted bid and is refused.
 * Every other open bid becomes not selected and the leads follow.
 */
export async function acceptBid(ownerId: string, planId: string, bidId: string, origin: string, contact: JobContactInput) {
	const out = await db.transaction(async (tx) => {
		if (!(await lockOwnPlan(tx, ownerId, planId))) return null;
		const [b] = await tx
			.select()
			.from(bid)
			.where(and(eq(bid.id, bidId), eq(bid.planId, planId)));
		if (!b) return null;
		const [already] = await tx
			.select({ id: bid.id })
			.from(bid)
			.where(and(eq(bid.planId, planId), eq(bid.status, 'accepted')));
		if (already) throw new LeadRefused('You accepted a bid for this plan already.');
		if (b.status !== 'open') throw new LeadRefused('This bid is no longer open.');
		if (isExpired(b.validUntil)) throw new LeadRefused(`This bid was valid until ${b.validUntil}; ask the contractor to renew it.`);
		const [won] = await tx.select({ status: lead.status }).from(lead).where(eq(lead.id, b.leadId)).for('update');
		const wonTo = step(won.status, 'accept', 'This request is no longer open.');
		// A contractor sent back to review, suspended or with an expired licence or insurance since bidding cannot be hired through Stakeline.
		const [c] = await tx
			.select({ status: contractor.status, current: credentialsCurrentSql(today()), disabled: accountDisabledSql(contractor.userId) })
			.from(contractor)
			.where(eq(contractor.userId, b.contractorId));
		if (c?.status !== 'approved' || c.disabled) throw new LeadRefused('This contractor is not approved at the moment, so the bid cannot be accepted.');
		if (!c.current) throw new LeadRefused('This contractor’s licence or insurance has expired, so the bid cannot be accepted until they renew it.');
		await saveJobContact(tx, planId, contact);
		const now = new Date();
		await tx.update(bid).set({ status: 'accepted', updatedAt: now }).where(eq(bid.id, b.id));
		await tx
			.update(bid)
			.set({ status: 'not_selected', updatedAt: now })
			.where(and(eq(bid.planId, planId), eq(bid.status, 'open'), ne(bid.id, b.id)));
		await tx.update(lead).set({ status: wonTo, updatedAt: now }).where(eq(lead.id, b.leadId));
		// Only the leads the table moves (the open ones); declined, withdrawn and expired ones stay as they are.
		const others = await tx
			.update(lead)
			.set({ status: 'not_selected', updatedAt: now })
			.where(and(eq(lead.planId, planId), ne(lead.id, b.leadId), inArray(lead.status, statusesMovedBy('accept_other', openLeadStatuses))))
			.returning({ id: lead.id });
		// A firm that never bid is told another firm was hired, not that a bid of theirs lost.
		const bidOn = new Set((await tx.select({ leadId: bid.leadId }).from(bid).where(eq(bid.planId, planId))).map((r) => r.leadId));
		for (const to of await leadContractors(tx, [b.leadId, ...others.map((o) => o.id)])) {
			const outcome = to.leadId === b.leadId ? 'won' : bidOn.has(to.leadId) ? 'not_selected' : 'hired_other';
			await queueMail(to.email, bidDecisionMail(to.name, outcome, to.town ?? 'you', leadUrl(origin, to.leadId)), tx);
		}
		return true;
	});
	return !!out;
}

async function requireApproved(tx: Tx, contractorId: string) {
	const [c] = await tx
		.select({ status: contractor.status, businessName: contractor.businessName, current: credentialsCurrentSql(today()) })
		.from(contractor)
		.where(eq(contractor.userId, contractorId));
	if (c?.status !== 'approved') throw new LeadRefused('Only approved contractors can bid.');
	if (!c.current) throw new LeadRefused('Your licence or insurance has expired: renew it on your profile before you bid.');
	return c;
}

/** Creates or edits the contractor's bid; refused once the lead is closed or the bid expired. */
export async function saveBid(contractorId: string, leadId: string, input: BidInput, origin: string) {
	const out = await db.transaction(async (tx) => {
		const c = await requireApproved(tx, contractorId);
		const locked = await lockOwnLead(tx, contractorId, leadId);
		if (!locked) return false;
		const to = step(locked.lead.status, 'bid', 'This lead is closed; the bid cannot change.');
		if (locked.lead.status !== 'bid_sent' && locked.lead.respondBy && locked.lead.respondBy < today())
			throw new LeadRefused(`The respond-by date, ${formatDate(locked.lead.respondBy)}, has passed: this lead is closed.`);
		if (locked.bid && locked.bid.status !== 'open') throw new LeadRefused('This bid is no longer open.');
		if (locked.bid && isExpired(locked.bid.validUntil)) throw new LeadRefused('This bid has expired; it can no longer be changed.');
		const now = new Date();
		if (locked.bid)
			await tx
				.update(bid)
				.set({ ...input, updatedAt: now })
				.where(eq(bid.id, locked.bid.id));
		else await tx.insert(bid).values({ ...input, leadId, planId: locked.lead.planId, contractorId });
		await tx.update(lead).set({ status: to, updatedAt: now }).where(eq(lead.id, leadId));
		const home = await homeownerOf(tx, locked.lead.homeownerId);
		await queueMail(
			home.email,
			newBidMail(home.name, c.businessName ?? 'A contractor', locked.lead.snapshot.name, !!locked.bid, bidsUrl(origin, locked.lead.planId)),
			tx
		);
		return true;
	});
	return out;
}

/** Withdraws the open bid for good (it cannot be sent again) and tells the homeowner. */
export async function withdrawBid(contractorId: string, leadId: string, origin = '') {
	const out = await db.transaction(async (tx) => {
		const c = await requireApproved(tx, contractorId);
		const locked = await lockOwnLead(tx, contractorId, leadId);
		if (!locked) return false;
		if (locked.bid?.status !== 'open') throw new LeadRefused('There is no open bid to withdraw.');
		const to = step(locked.lead.status, 'withdraw', 'There is no open bid to withdraw.');
		await tx.update(bid).set({ status: 'withdrawn', updatedAt: new Date() }).where(eq(bid.id, locked.bid.id));
		await tx.update(lead).set({ status: to, updatedAt: new Date() }).where(eq(lead.id, leadId));
		const home = await homeownerOf(tx, locked.lead.homeownerId);
		await queueMail(
			home.email,
			bidWithdrawnMail(home.name, c.businessName ?? 'A contractor', locked.lead.snapshot.name, bidsUrl(origin, locked.lead.planId)),
			tx
		);
		return true;
	});
	return out;
}

/**
 * The homeowner's way out of an accepted job whose contractor Stakeline suspended or sent back:
 * the accepted bid is released (not "withdrawn": the contractor did not withdraw), the bids that
 * were not selected and are still valid are open again, and every contractor concerned is told.
 */
export async function reopenBidding(ownerId: string, planId: string, origin: string) {
	const out = await db.transaction(async (tx) => {
		if (!(await lockOwnPlan(tx, ownerId, planId))) return null;
		const [won] = await tx
			.select({ bidId: bid.id, leadId: bid.leadId, status: contractor.status })
			.from(bid)
			.innerJoin(contractor, eq(contractor.userId, bid.contractorId))
			.where(and(eq(bid.planId, planId), eq(bid.status, 'accepted')));
		if (!won) throw new LeadRefused('There is no accepted bid to release.');
		if (won.status === 'approved') throw new LeadRefused('The contractor you hired is in good standing; talk to them in the messages first.');
		const now = new Date();
		await tx.update(bid).set({ status: 'released', updatedAt: now }).where(eq(bid.id, won.bidId));
		await tx
			.update(lead)
			.set({ status: step('won', 'release', 'There is no accepted bid to release.'), updatedAt: now })
			.where(eq(lead.id, won.leadId));
		const today = new Date().toISOString().slice(0, 10);
		const reopened = await tx
			.update(bid)
			.set({ status: 'open', updatedAt: now })
			.where(and(eq(bid.planId, planId), eq(bid.status, 'not_selected'), sql`${bid.validUntil} >= ${today}`))
			.returning({ leadId: bid.leadId });
		// The table's reopen step: a not-selected lead with a still-valid bid is bid_sent again.
		if (reopened.length)
			await tx
				.update(lead)
				.set({ status: leadTarget('not_selected', 'reopen')!, updatedAt: now })
				.where(
					inArray(
						lead.id,
						reopened.map((r) => r.leadId)
					)
				);
		for (const to of await leadContractors(tx, [won.leadId, ...reopened.map((r) => r.leadId)])) {
			const url = leadUrl(origin, to.leadId);
			await queueMail(
				to.email,
				to.leadId === won.leadId ? jobReleasedMail(to.name, to.town ?? 'you', url) : biddingReopenedMail(to.name, to.town ?? 'you', url),
				tx
			);
		}
		return { reopened: reopened.length };
	});
	return out;
}

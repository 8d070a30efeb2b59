import { and, asc, count, desc, eq, gt, inArray, ne, sql, type SQL } from 'drizzle-orm';
import { isExpired, respondBy, type LeadStatus } from '$lib/leads';
import type { ContractorStatus } from '$lib/contractor-status';
import { isOpenLead, leadTarget, openLeadStatuses, statusesMovedBy, threadOpen } from '$lib/lead-status';
import { formatDate } from '$lib/components/plan/format';
import type { BidInput } from '$lib/schemas/leads';
import type { ServiceKind } from '$lib/schemas/contractor';
import type { ExistingSurface, Finish, Timeframe } from '$lib/leads';
import { db } from '$lib/server/db';
import { bid, contractor, jobContact, lead, leadMessage, plan, planPhoto, user } from '$lib/server/db/schema';
import { queueMail } from './mail';
import {
	bidDecisionMail,
	biddingReopenedMail,
	bidWithdrawnMail,
	contractorActiveAgainMail,
	contractorPausedMail,
	jobDoneMail,
	jobReleasedMail,
	leadExpiredMail,
	leadsUnansweredMail,
	newBidMail,
	requestClosedMail,
	newerRevisionMail,
	newLeadMail,
	newMessageMail
} from './mail/pro-notices';
import { matchContractors, placeOf } from './matching';

/** A step that does not fit the lead's or bid's state; the message says why. */
export class LeadRefused extends Error {}

type Actor = { id: string; name: string };
type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

const leadUrl = (origin: string, leadId: string) => `${origin}/pro/leads/${leadId}`;
const bidsUrl = (origin: string, planId: string) => `${origin}/plans/${planId}/bids`;

/** The job's site address and phone, as the homeowner gave them. */
export type JobContactInput = { siteAddress: string; phone: string };

async function saveJobContact(tx: Tx, planId: string, c: JobContactInput) {
	const now = new Date();
	await tx
		.insert(jobContact)
		.values({ planId, ...c, updatedAt: now })
		.onConflictDoUpdate({ target: jobContact.planId, set: { ...c, updatedAt: now } });
}

/** The address and phone stored for the plan, for its owner's forms; null when none yet. */
export async function jobContactOf(planId: string) {
	const [c] = await db.select({ siteAddress: jobContact.siteAddress, phone: jobContact.phone }).from(jobContact).where(eq(jobContact.planId, planId));
	return c ?? null;
}

/** Refuses `action` on a lead the table does not allow it for, with the reason in words. */
function step(status: LeadStatus, action: Parameters<typeof leadTarget>[1], refusal: string): LeadStatus {
	const to = leadTarget(status, action);
	if (!to) throw new LeadRefused(refusal);
	return to;
}

const today = () => new Date().toISOString().slice(0, 10);
/** SQL: the contractor's licence and insurance dates have not passed (a missing date is not an expired one). */
const credentialsCurrentSql = (day: string) =>
	sql`(coalesce(${contractor.licenceExpiresOn}, 'infinity'::date) >= ${day}::date and coalesce(${contractor.insuranceExpiresOn}, 'infinity'::date) >= ${day}::date)`;

/** Name and e-mail of each lead's contractor, with the lead's town, in one query. */
const leadContractors = (tx: Tx, leadIds: string[]) =>
	leadIds.length
		? tx.select({ leadId: lead.id, town: lead.town, name: user.name, email: user.email }).from(lead).innerJoin(user, eq(user.id, lead.contractorId)).where(inArray(lead.id, leadIds))
		: Promise.resolve([]);

/**
 * Sends the plan to the chosen contractors. Each lead freezes the plan's current revision and a
 * copy of its input and result. The choice is checked against the matching query again: the
 * browser's list is not trusted. Contractors who have the plan already are skipped.
 */
export async function sendLeads(
	owner: Actor,
	planId: string,
	input: {
		scope: ServiceKind;
		timeframe: Timeframe;
		notes: string;
		finish?: Finish;
		existingSurface?: ExistingSurface;
		siteAccess?: string;
		contractors: string[];
		contact?: JobContactInput | null;
	},
	origin: string
) {
	const out = await db.transaction(async (tx) => {
		const p = await lockOpenPlan(tx, owner.id, planId);
		if (!p) return null;
		const place = placeOf(p.postcode);
		if (!place) throw new LeadRefused('The plan needs a US ZIP code we know before it can go to contractors.');
		const matches = new Map((await matchContractors(place, input.scope, tx)).map((m) => [m.id, m]));
		if (input.contractors.some((id) => !matches.has(id))) throw new LeadRefused('A contractor you chose does not serve this plan’s area for that work.');
		if (input.contact) await saveJobContact(tx, planId, input.contact);
		const due = respondBy(new Date(), input.timeframe);
		const photoIds = (await tx.select({ id: planPhoto.id }).from(planPhoto).where(eq(planPhoto.planId, planId)).orderBy(asc(planPhoto.createdAt))).map((r) => r.id);
		const rows = await tx
			.insert(lead)
			.values(
				input.contractors.map((contractorId) => ({
					planId,
					homeownerId: owner.id,
					contractorId,
					scope: input.scope,
					timeframe: input.timeframe,
					notes: input.notes,
					finish: input.finish,
					existingSurface: input.existingSurface,
					siteAccess: input.siteAccess,
					planRevision: p.revision,
					latestRevision: p.revision,
					snapshot: { name: p.name, postcode: p.postcode, input: p.input, result: p.result, photoIds },
					town: place.town,
					respondBy: due,
					distanceKm: matches.get(contractorId)!.distanceKm
				}))
			)
			.onConflictDoNothing({ target: [lead.planId, lead.contractorId] })
			.returning({ id: lead.id });
		for (const to of await leadContractors(tx, rows.map((r) => r.id)))
			await queueMail(to.email, newLeadMail(to.name, place.town, p.name, formatDate(due), leadUrl(origin, to.leadId)), tx);
		return { created: rows.length };
	});
	return out;
}

/**
 * After the plan changed, tells the contractors who have it (and whose lead is still open) that a
 * newer revision exists. Their lead keeps showing the revision it was sent with.
 */
export async function announceRevision(owner: Actor, planId: string, origin: string) {
	const out = await db.transaction(async (tx) => {
		const p = await lockOpenPlan(tx, owner.id, planId);
		if (!p) return null;
		const rows = await tx
			.update(lead)
			.set({ latestRevision: p.revision, updatedAt: new Date() })
			.where(and(eq(lead.planId, planId), sql`${lead.latestRevision} < ${p.revision}`, inArray(lead.status, [...openLeadStatuses])))
			.returning({ id: lead.id });
		for (const to of await leadContractors(tx, rows.map((r) => r.id)))
			await queueMail(to.email, newerRevisionMail(to.name, to.town ?? 'you', p.revision, leadUrl(origin, to.leadId)), tx);
		return rows.length;
	});
	return out;
}

/** The owner's plan, locked against a concurrent accept; refused once a bid is accepted. */
async function lockOpenPlan(tx: Tx, ownerId: string, planId: string) {
	const [p] = await tx.select().from(plan).where(and(eq(plan.id, planId), eq(plan.ownerId, ownerId))).for('update');
	if (!p) return null;
	const [accepted] = await tx.select({ id: bid.id }).from(bid).where(and(eq(bid.planId, planId), eq(bid.status, 'accepted')));
	if (accepted) throw new LeadRefused('You accepted a bid for this plan already.');
	const [done] = await tx.select({ id: lead.id }).from(lead).where(and(eq(lead.planId, planId), eq(lead.status, 'done')));
	if (done) throw new LeadRefused('You marked the job for this plan done.');
	return p;
}

/** Messages in `leadId`'s thread the viewer has not read: sent by the other side after the viewer last looked. */
const unreadFor = (side: 'homeowner' | 'contractor') =>
	sql<number>`(select count(*)::int from ${leadMessage} m where m.lead_id = ${lead.id}
		and m.sender_id <> ${side === 'homeowner' ? lead.homeownerId : lead.contractorId}
		and m.created_at > coalesce(${side === 'homeowner' ? lead.homeownerReadAt : lead.contractorReadAt}, 'epoch'))`;

/** The homeowner's view of a plan's leads: each contractor's public profile, bid and unread count. */
export async function leadsForPlan(planId: string) {
	return db
		.select({
			lead: {
				id: lead.id,
				contractorId: lead.contractorId,
				status: lead.status,
				scope: lead.scope,
				planRevision: lead.planRevision,
				distanceKm: lead.distanceKm,
				sentAt: lead.sentAt,
				respondBy: lead.respondBy,
				declineReason: lead.declineReason
			},
			contractor: {
				businessName: contractor.businessName,
				yearsInTrade: contractor.yearsInTrade,
				// An account an admin disabled reads as suspended, as its homeowners were told by e-mail.
				status: sql<ContractorStatus>`case when exists (select 1 from ${user} where ${user.id} = ${contractor.userId} and ${user.disabledAt} is not null) then 'suspended' else ${contractor.status} end`
			},
			bid,
			unread: unreadFor('homeowner')
		})
		.from(lead)
		.innerJoin(contractor, eq(contractor.userId, lead.contractorId))
		.leftJoin(bid, eq(bid.leadId, lead.id))
		.where(eq(lead.planId, planId))
		.orderBy(asc(lead.distanceKm));
}

/**
 * Accepts one bid in one transaction. The plan row is locked first, so two accepts for the same
 * plan run one after the other and the second finds the first's accepted bid and is refused.
 * Every other open bid becomes not selected and the leads follow.
 */
export async function acceptBid(ownerId: string, planId: string, bidId: string, origin: string, contact: JobContactInput) {
	const out = await db.transaction(async (tx) => {
		const [p] = await tx.select({ id: plan.id }).from(plan).where(and(eq(plan.id, planId), eq(plan.ownerId, ownerId))).for('update');
		if (!p) return null;
		const [b] = await tx.select().from(bid).where(and(eq(bid.id, bidId), eq(bid.planId, planId)));
		if (!b) return null;
		const [already] = await tx.select({ id: bid.id }).from(bid).where(and(eq(bid.planId, planId), eq(bid.status, 'accepted')));
		if (already) throw new LeadRefused('You accepted a bid for this plan already.');
		if (b.status !== 'open') throw new LeadRefused('This bid is no longer open.');
		if (isExpired(b.validUntil)) throw new LeadRefused(`This bid was valid until ${b.validUntil}; ask the contractor to renew it.`);
		const [won] = await tx.select({ status: lead.status }).from(lead).where(eq(lead.id, b.leadId)).for('update');
		const wonTo = step(won.status, 'accept', 'This request is no longer open.');
		// A contractor sent back to review, suspended or with an expired licence or insurance since bidding cannot be hired through Stakeline.
		const [c] = await tx
			.select({ status: contractor.status, current: credentialsCurrentSql(today()), disabledAt: user.disabledAt })
			.from(contractor)
			.innerJoin(user, eq(user.id, contractor.userId))
			.where(eq(contractor.userId, b.contractorId));
		if (c?.status !== 'approved' || c.disabledAt) throw new LeadRefused('This contractor is not approved at the moment, so the bid cannot be accepted.');
		if (!c.current) throw new LeadRefused('This contractor’s licence or insurance has expired, so the bid cannot be accepted until they renew it.');
		await saveJobContact(tx, planId, contact);
		const now = new Date();
		await tx.update(bid).set({ status: 'accepted', updatedAt: now }).where(eq(bid.id, b.id));
		await tx.update(bid).set({ status: 'not_selected', updatedAt: now }).where(and(eq(bid.planId, planId), eq(bid.status, 'open'), ne(bid.id, b.id)));
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

/** The contractor's inbox: their leads only, optionally of one status, newest first. */
export async function contractorLeads(contractorId: string, o: { status: LeadStatus | null; limit: number; offset: number }) {
	const where = and(eq(lead.contractorId, contractorId), o.status ? eq(lead.status, o.status) : undefined);
	const rows = await db
		.select({
			id: lead.id,
			status: lead.status,
			town: lead.town,
			distanceKm: lead.distanceKm,
			scope: lead.scope,
			timeframe: lead.timeframe,
			sentAt: lead.sentAt,
			respondBy: lead.respondBy,
			planName: sql<string>`${lead.snapshot}->>'name'`,
			newerRevision: sql<boolean>`${lead.latestRevision} > ${lead.planRevision}`,
			unread: unreadFor('contractor')
		})
		.from(lead)
		.where(where)
		.orderBy(desc(lead.sentAt))
		.limit(o.limit)
		.offset(o.offset);
	const [{ n }] = await db.select({ n: count() }).from(lead).where(where);
	return { rows, total: n };
}

/**
 * One lead as its contractor sees it. The homeowner's name and e-mail are included only once the
 * contractor's bid was accepted; before that, the town and distance are all they learn.
 */
export async function contractorLead(contractorId: string, leadId: string) {
	const [row] = await db
		.select({ lead, bid, homeownerName: user.name, homeownerEmail: user.email, unitPref: contractor.serviceRadiusUnit })
		.from(lead)
		.innerJoin(user, eq(user.id, lead.homeownerId))
		.innerJoin(contractor, eq(contractor.userId, lead.contractorId))
		.leftJoin(bid, eq(bid.leadId, lead.id))
		.where(and(eq(lead.id, leadId), eq(lead.contractorId, contractorId)));
	if (!row) return null;
	const { homeownerName, homeownerEmail, ...rest } = row;
	// How many firms the homeowner asked for this plan: a count only, never who.
	const [{ asked }] = await db.select({ asked: count() }).from(lead).where(eq(lead.planId, row.lead.planId));
	const hired = row.lead.status === 'won' || row.lead.status === 'done';
	const site = hired ? await jobContactOf(row.lead.planId) : null;
	return { ...rest, asked, homeowner: hired ? { name: homeownerName, email: homeownerEmail, siteAddress: site?.siteAddress ?? null, phone: site?.phone ?? null } : null };
}

/** Opening a lead marks it viewed and its messages read. */
export async function markLeadSeen(contractorId: string, leadId: string) {
	await db
		.update(lead)
		.set({ contractorReadAt: new Date(), status: sql`case when ${lead.status} = 'new' then 'viewed'::lead_status else ${lead.status} end` })
		.where(and(eq(lead.id, leadId), eq(lead.contractorId, contractorId)));
}

export async function markLeadReadByHomeowner(homeownerId: string, leadId: string) {
	await db.update(lead).set({ homeownerReadAt: new Date() }).where(and(eq(lead.id, leadId), eq(lead.homeownerId, homeownerId)));
}

/**
 * Locks the contractor's lead for a change. The plan is taken FOR KEY SHARE, which waits for an
 * accept in progress (FOR UPDATE) but not for the homeowner's ordinary plan saves.
 */
async function lockOwnLead(tx: Tx, contractorId: string, leadId: string) {
	const [l] = await tx.select().from(lead).where(and(eq(lead.id, leadId), eq(lead.contractorId, contractorId)));
	if (!l) return null;
	await tx.select({ id: plan.id }).from(plan).where(eq(plan.id, l.planId)).for('key share');
	const [fresh] = await tx.select().from(lead).where(eq(lead.id, leadId)).for('update');
	const [b] = await tx.select().from(bid).where(eq(bid.leadId, leadId));
	return { lead: fresh, bid: b ?? null };
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
		if (locked.bid) await tx.update(bid).set({ ...input, updatedAt: now }).where(eq(bid.id, locked.bid.id));
		else await tx.insert(bid).values({ ...input, leadId, planId: locked.lead.planId, contractorId });
		await tx.update(lead).set({ status: to, updatedAt: now }).where(eq(lead.id, leadId));
		const home = await homeownerOf(tx, locked.lead.homeownerId);
		await queueMail(home.email, newBidMail(home.name, c.businessName ?? 'A contractor', locked.lead.snapshot.name, !!locked.bid, bidsUrl(origin, locked.lead.planId)), tx);
		return true;
	});
	return out;
}

const homeownerOf = async (tx: Tx, id: string) => (await tx.select({ name: user.name, email: user.email }).from(user).where(eq(user.id, id)))[0];

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
		await queueMail(home.email, bidWithdrawnMail(home.name, c.businessName ?? 'A contractor', locked.lead.snapshot.name, bidsUrl(origin, locked.lead.planId)), tx);
		return true;
	});
	return out;
}

/** Declining also withdraws an open bid; the homeowner sees the reason. */
export async function declineLead(contractorId: string, leadId: string, reason: string) {
	return db.transaction(async (tx) => {
		const locked = await lockOwnLead(tx, contractorId, leadId);
		if (!locked) return false;
		const to = step(locked.lead.status, 'decline', 'This lead is closed already.');
		if (locked.bid?.status === 'open') await tx.update(bid).set({ status: 'withdrawn', updatedAt: new Date() }).where(eq(bid.id, locked.bid.id));
		await tx.update(lead).set({ status: to, declineReason: reason, updatedAt: new Date() }).where(eq(lead.id, leadId));
		return true;
	});
}

/**
 * Tells each homeowner with an open lead or an accepted bid from this contractor what a vetting
 * decision means for them (inside the decision's transaction). Nothing is withdrawn: while the
 * contractor is not approved their bids simply cannot be accepted, and they are open again after.
 */
export async function tellHomeownersOfContractorChange(tx: Tx, contractorId: string, business: string, change: 'suspended' | 'review' | 'lapsed' | 'active', origin: string) {
	const rows = await tx
		.select({ planId: lead.planId, planName: sql<string>`${lead.snapshot}->>'name'`, accepted: sql<boolean>`${bid.status} = 'accepted'`, name: user.name, email: user.email })
		.from(lead)
		.innerJoin(user, eq(user.id, lead.homeownerId))
		.leftJoin(bid, eq(bid.leadId, lead.id))
		.where(and(eq(lead.contractorId, contractorId), inArray(lead.status, [...openLeadStatuses, 'won'])));
	for (const r of rows) {
		const url = bidsUrl(origin, r.planId);
		const mail = change === 'active' ? contractorActiveAgainMail(r.name, business, r.planName, url) : contractorPausedMail(r.name, business, r.planName, change, !!r.accepted, url);
		await queueMail(r.email, mail, tx);
	}
	return rows.length;
}

/**
 * The homeowner's way out of an accepted job whose contractor Stakeline suspended or sent back:
 * the accepted bid is released (not "withdrawn": the contractor did not withdraw), the bids that
 * were not selected and are still valid are open again, and every contractor concerned is told.
 */
export async function reopenBidding(ownerId: string, planId: string, origin: string) {
	const out = await db.transaction(async (tx) => {
		const [p] = await tx.select({ id: plan.id }).from(plan).where(and(eq(plan.id, planId), eq(plan.ownerId, ownerId))).for('update');
		if (!p) return null;
		const [won] = await tx
			.select({ bidId: bid.id, leadId: bid.leadId, status: contractor.status })
			.from(bid)
			.innerJoin(contractor, eq(contractor.userId, bid.contractorId))
			.where(and(eq(bid.planId, planId), eq(bid.status, 'accepted')));
		if (!won) throw new LeadRefused('There is no accepted bid to release.');
		if (won.status === 'approved') throw new LeadRefused('The contractor you hired is in good standing; talk to them in the messages first.');
		const now = new Date();
		await tx.update(bid).set({ status: 'released', updatedAt: now }).where(eq(bid.id, won.bidId));
		await tx.update(lead).set({ status: step('won', 'release', 'There is no accepted bid to release.'), updatedAt: now }).where(eq(lead.id, won.leadId));
		const today = new Date().toISOString().slice(0, 10);
		const reopened = await tx
			.update(bid)
			.set({ status: 'open', updatedAt: now })
			.where(and(eq(bid.planId, planId), eq(bid.status, 'not_selected'), sql`${bid.validUntil} >= ${today}`))
			.returning({ leadId: bid.leadId });
		// The table's reopen step: a not-selected lead with a still-valid bid is bid_sent again.
		if (reopened.length) await tx.update(lead).set({ status: leadTarget('not_selected', 'reopen')!, updatedAt: now }).where(inArray(lead.id, reopened.map((r) => r.leadId)));
		for (const to of await leadContractors(tx, [won.leadId, ...reopened.map((r) => r.leadId)])) {
			const url = leadUrl(origin, to.leadId);
			await queueMail(to.email, to.leadId === won.leadId ? jobReleasedMail(to.name, to.town ?? 'you', url) : biddingReopenedMail(to.name, to.town ?? 'you', url), tx);
		}
		return { reopened: reopened.length };
	});
	return out;
}

export async function threadOf(leadId: string) {
	return db.select().from(leadMessage).where(eq(leadMessage.leadId, leadId)).orderBy(asc(leadMessage.createdAt), asc(leadMessage.id));
}

/** Who can still write in a lead's thread: open leads, and the hired contractor's. */
export const canWriteThread = threadOpen;

/** Posts to a lead's thread when `sender` is one of its two sides, and tells the other side by e-mail. */
export async function postMessage(sender: Actor & { role: string }, leadId: string, body: string, origin: string) {
	const side: SQL | undefined =
		sender.role === 'homeowner' ? eq(lead.homeownerId, sender.id) : sender.role === 'contractor' ? eq(lead.contractorId, sender.id) : undefined;
	if (!side) return false;
	const homeowner = sender.role === 'homeowner';
	const out = await db.transaction(async (tx) => {
		// The lead, the other side's address and the contractor's business name in one query.
		const [l] = await tx
			.select({ lead, business: contractor.businessName, toName: user.name, toEmail: user.email })
			.from(lead)
			.innerJoin(contractor, eq(contractor.userId, lead.contractorId))
			.innerJoin(user, eq(user.id, homeowner ? lead.contractorId : lead.homeownerId))
			.where(and(eq(lead.id, leadId), side));
		if (!l) return false;
		// Threads of a closed lead stay readable; only the open ones (and the hired contractor's) take new messages.
		if (!canWriteThread(l.lead.status)) throw new LeadRefused('This thread is closed: the lead is no longer open.');
		const now = new Date();
		await tx.insert(leadMessage).values({ leadId, senderId: sender.id, body, createdAt: now });
		// Writing in a thread means having read it.
		await tx
			.update(lead)
			.set(homeowner ? { homeownerReadAt: now } : { contractorReadAt: now })
			.where(eq(lead.id, leadId));
		const mail = homeowner
			? newMessageMail(l.toName, `the homeowner near ${l.lead.town ?? 'you'}`, leadUrl(origin, leadId))
			: newMessageMail(l.toName, l.business ?? sender.name, `${bidsUrl(origin, l.lead.planId)}/${leadId}`);
		await queueMail(l.toEmail, mail, tx);
		return true;
	});
	return out;
}

/** Unread messages across all of a user's threads, for the navigation. */
export async function unreadMessageCount(u: { id: string; role: string }) {
	if (u.role !== 'homeowner' && u.role !== 'contractor') return 0;
	if (u.role === 'contractor') {
		// Contractors who are not approved cannot open their threads, so nothing counts as waiting.
		const [c] = await db.select({ status: contractor.status }).from(contractor).where(eq(contractor.userId, u.id));
		if (c?.status !== 'approved') return 0;
	}
	const mine = u.role === 'homeowner' ? eq(lead.homeownerId, u.id) : eq(lead.contractorId, u.id);
	const readAt = u.role === 'homeowner' ? lead.homeownerReadAt : sql`coalesce(${lead.contractorReadAt}, 'epoch')`;
	const [{ n }] = await db
		.select({ n: count() })
		.from(leadMessage)
		.innerJoin(lead, eq(lead.id, leadMessage.leadId))
		.where(and(mine, ne(leadMessage.senderId, u.id), gt(leadMessage.createdAt, readAt)));
	return n;
}


/**
 * Every thread of a homeowner or an approved contractor, with unread counts, newest activity first.
 * Contractors see the town only, as on their leads.
 */
export async function threadsOf(u: { id: string; role: string }) {
	const side = u.role === 'homeowner' ? 'homeowner' : 'contractor';
	if (side === 'contractor') {
		const [c] = await db.select({ status: contractor.status }).from(contractor).where(eq(contractor.userId, u.id));
		if (c?.status !== 'approved') return [];
	}
	const last = sql<Date | null>`(select max(m.created_at) from ${leadMessage} m where m.lead_id = ${lead.id})`;
	return db
		.select({
			leadId: lead.id,
			planId: lead.planId,
			planName: sql<string>`${lead.snapshot}->>'name'`,
			with: side === 'homeowner' ? sql<string>`coalesce(${contractor.businessName}, 'Contractor')` : sql<string>`coalesce(${lead.town}, 'Homeowner')`,
			unread: unreadFor(side),
			last
		})
		.from(lead)
		.innerJoin(contractor, eq(contractor.userId, lead.contractorId))
		.where(and(side === 'homeowner' ? eq(lead.homeownerId, u.id) : eq(lead.contractorId, u.id), sql`${last} is not null`))
		.orderBy(desc(last));
}

/** The plan of `leadId` when `photoId` was among its photos as sent to `contractorId`; else null. */
export async function leadPhotoPlan(contractorId: string, leadId: string, photoId: string) {
	const [l] = await db.select({ planId: lead.planId, snapshot: lead.snapshot }).from(lead).where(and(eq(lead.id, leadId), eq(lead.contractorId, contractorId)));
	return l?.snapshot.photoIds?.includes(photoId) ? l.planId : null;
}

/**
 * The homeowner closes the request without hiring anyone: every open lead is closed (the table's
 * close step), open bids close with it, and each contractor concerned is told, in one transaction.
 * Refused once a bid was accepted: then the way out is marking the job done, or a release.
 */
export async function closeRequest(ownerId: string, planId: string, origin: string) {
	const out = await db.transaction(async (tx) => {
		const [p] = await tx.select({ id: plan.id }).from(plan).where(and(eq(plan.id, planId), eq(plan.ownerId, ownerId))).for('update');
		if (!p) return null;
		const leads = await tx.select({ id: lead.id, status: lead.status }).from(lead).where(eq(lead.planId, planId)).for('update');
		for (const l of leads) step(l.status, 'close', l.status === 'won' ? 'You accepted a bid already: mark the job done when it is finished.' : 'This job is done already.');
		const moving = leads.filter((l) => isOpenLead(l.status) && leadTarget(l.status, 'close') !== l.status);
		if (!moving.length) throw new LeadRefused('There is no open request to close.');
		const now = new Date();
		const ids = moving.map((l) => l.id);
		await tx.update(lead).set({ status: 'closed', updatedAt: now }).where(inArray(lead.id, ids));
		const closedBids = await tx
			.update(bid)
			.set({ status: 'closed', updatedAt: now })
			.where(and(inArray(bid.leadId, ids), eq(bid.status, 'open')))
			.returning({ leadId: bid.leadId });
		const withBid = new Set(closedBids.map((b) => b.leadId));
		for (const to of await leadContractors(tx, ids)) await queueMail(to.email, requestClosedMail(to.name, to.town ?? 'you', withBid.has(to.leadId), leadUrl(origin, to.leadId)), tx);
		return { closed: ids.length };
	});
	return out;
}

/** The homeowner marks the hired job done (won → done) and the contractor is told. */
export async function completeJob(ownerId: string, planId: string, origin: string) {
	const out = await db.transaction(async (tx) => {
		const [p] = await tx.select({ id: plan.id }).from(plan).where(and(eq(plan.id, planId), eq(plan.ownerId, ownerId))).for('update');
		if (!p) return null;
		const [won] = await tx
			.select({ id: lead.id, status: lead.status })
			.from(lead)
			.where(and(eq(lead.planId, planId), inArray(lead.status, ['won', 'done'])))
			.for('update');
		if (!won) throw new LeadRefused('Accept a bid first: only a hired job can be marked done.');
		const to = step(won.status, 'complete', 'This job is marked done already.');
		await tx.update(lead).set({ status: to, updatedAt: new Date() }).where(eq(lead.id, won.id));
		for (const c of await leadContractors(tx, [won.id])) await queueMail(c.email, jobDoneMail(c.name, c.town ?? 'you', leadUrl(origin, c.leadId)), tx);
		return true;
	});
	return out;
}

/**
 * Leads nobody answered by their respond-by date expire (the table's expire step), in the
 * caller's transaction: each contractor is told, and each homeowner once per plan with the firms
 * that did not reply. The UPDATE takes each row once, so two sweeps cannot both send.
 */
export async function expireLeads(tx: Tx, day: string, origin: string, only: { contractorId?: string; planId?: string } = {}) {
	const rows = await tx
		.update(lead)
		.set({ status: 'expired', updatedAt: new Date() })
		.where(
			and(
				inArray(lead.status, statusesMovedBy('expire', openLeadStatuses)),
				sql`${lead.respondBy} < ${day}::date`,
				only.contractorId ? eq(lead.contractorId, only.contractorId) : undefined,
				only.planId ? eq(lead.planId, only.planId) : undefined
			)
		)
		.returning({ id: lead.id, planId: lead.planId, homeownerId: lead.homeownerId, respondBy: lead.respondBy, planName: sql<string>`${lead.snapshot}->>'name'` });
	if (!rows.length) return 0;
	for (const to of await leadContractors(tx, rows.map((r) => r.id))) {
		const r = rows.find((x) => x.id === to.leadId)!;
		await queueMail(to.email, leadExpiredMail(to.name, to.town ?? 'you', formatDate(r.respondBy!), leadUrl(origin, to.leadId)), tx);
	}
	const names = await tx
		.select({ leadId: lead.id, business: sql<string>`coalesce(${contractor.businessName}, 'A contractor')` })
		.from(lead)
		.innerJoin(contractor, eq(contractor.userId, lead.contractorId))
		.where(inArray(lead.id, rows.map((r) => r.id)));
	for (const planId of new Set(rows.map((r) => r.planId))) {
		const mine = rows.filter((r) => r.planId === planId);
		const home = await homeownerOf(tx, mine[0].homeownerId);
		const firms = mine.map((r) => names.find((n) => n.leadId === r.id)!.business);
		await queueMail(home.email, leadsUnansweredMail(home.name, mine[0].planName, firms, formatDate(mine[0].respondBy!), bidsUrl(origin, planId)), tx);
	}
	return rows.length;
}

/** Expires what is due for one plan or one contractor when their page loads (between sweeps). */
export async function expireLeadsNow(only: { contractorId?: string; planId?: string }, origin: string, now = new Date()) {
	const n = await db.transaction((tx) => expireLeads(tx, now.toISOString().slice(0, 10), origin, only));
	return n;
}

import { and, asc, count, desc, eq, inArray, sql } from 'drizzle-orm';
import { respondBy, type LeadStatus } from '$lib/leads';
import type { ContractorStatus } from '$lib/contractor-status';
import { isOpenLead, leadTarget, openLeadStatuses, statusesMovedBy } from '$lib/lead-status';
import { formatDate } from '$lib/plan-view';
import type { ServiceKind } from '$lib/schemas/contractor';
import type { ExistingSurface, Finish, Timeframe } from '$lib/leads';
import { db } from '$lib/server/db';
import { bid, contractor, lead, planPhoto, user } from '$lib/server/db/schema';
import { queueMail } from './mail';
import {
	contractorActiveAgainMail,
	contractorPausedMail,
	jobDoneMail,
	leadExpiredMail,
	leadsUnansweredMail,
	requestClosedMail,
	newerRevisionMail,
	newLeadMail
} from './mail/pro-notices';
import { matchContractors, placeOf } from './matching';
import {
	accountDisabledSql,
	bidsUrl,
	homeownerOf,
	jobContactOf,
	leadContractors,
	LeadRefused,
	leadUrl,
	lockOpenPlan,
	lockOwnLead,
	lockOwnPlan,
	saveJobContact,
	step,
	type Actor,
	type JobContactInput,
	type Tx
} from './lead-shared';
import { unreadFor } from './messages';
import { refundLeadCharges } from './billing/accounts'; // billing

// Leads: sending a plan to contractors, the inbox, closing and expiring. Bids are in bids.ts,
// threads and unread counts in messages.ts.
export { jobContactOf, LeadRefused, type JobContactInput };

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
		const photoIds = (await tx.select({ id: planPhoto.id }).from(planPhoto).where(eq(planPhoto.planId, planId)).orderBy(asc(planPhoto.createdAt))).map(
			(r) => r.id
		);
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
		for (const to of await leadContractors(
			tx,
			rows.map((r) => r.id)
		))
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
		for (const to of await leadContractors(
			tx,
			rows.map((r) => r.id)
		))
			await queueMail(to.email, newerRevisionMail(to.name, to.town ?? 'you', p.revision, leadUrl(origin, to.leadId)), tx);
		return rows.length;
	});
	return out;
}

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
				status: sql<ContractorStatus>`case when ${accountDisabledSql(contractor.userId)} then 'suspended' else ${contractor.status} end`
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
		.select({ lead, bid, homeownerName: user.name, homeownerEmail: user.email })
		.from(lead)
		.innerJoin(user, eq(user.id, lead.homeownerId))
		.leftJoin(bid, eq(bid.leadId, lead.id))
		.where(and(eq(lead.id, leadId), eq(lead.contractorId, contractorId)));
	if (!row) return null;
	const { homeownerName, homeownerEmail, ...rest } = row;
	// How many firms the homeowner asked for this plan: a count only, never who.
	const [{ asked }] = await db.select({ asked: count() }).from(lead).where(eq(lead.planId, row.lead.planId));
	const hired = row.lead.status === 'won' || row.lead.status === 'done';
	const site = hired ? await jobContactOf(row.lead.planId) : null;
	return {
		...rest,
		asked,
		homeowner: hired ? { name: homeownerName, email: homeownerEmail, siteAddress: site?.siteAddress ?? null, phone: site?.phone ?? null } : null
	};
}

/** Opening a lead marks it viewed and its messages read. */
export async function markLeadSeen(contractorId: string, leadId: string) {
	await db
		.update(lead)
		.set({ contractorReadAt: new Date(), status: sql`case when ${lead.status} = 'new' then 'viewed'::lead_status else ${lead.status} end` })
		.where(and(eq(lead.id, leadId), eq(lead.contractorId, contractorId)));
}

export async function markLeadReadByHomeowner(homeownerId: string, leadId: string) {
	await db
		.update(lead)
		.set({ homeownerReadAt: new Date() })
		.where(and(eq(lead.id, leadId), eq(lead.homeownerId, homeownerId)));
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
export async function tellHomeownersOfContractorChange(
	tx: Tx,
	contractorId: string,
	business: string,
	change: 'suspended' | 'review' | 'lapsed' | 'active',
	origin: string
) {
	const rows = await tx
		.select({
			planId: lead.planId,
			planName: sql<string>`${lead.snapshot}->>'name'`,
			accepted: sql<boolean>`${bid.status} = 'accepted'`,
			name: user.name,
			email: user.email
		})
		.from(lead)
		.innerJoin(user, eq(user.id, lead.homeownerId))
		.leftJoin(bid, eq(bid.leadId, lead.id))
		.where(and(eq(lead.contractorId, contractorId), inArray(lead.status, [...openLeadStatuses, 'won'])));
	for (const r of rows) {
		const url = bidsUrl(origin, r.planId);
		const mail =
			change === 'active'
				? contractorActiveAgainMail(r.name, business, r.planName, url)
				: contractorPausedMail(r.name, business, r.planName, change, !!r.accepted, url);
		await queueMail(r.email, mail, tx);
	}
	return rows.length;
}

/** The plan of `leadId` when `photoId` was among its photos as sent to `contractorId`; else null. */
export async function leadPhotoPlan(contractorId: string, leadId: string, photoId: string) {
	const [l] = await db
		.select({ planId: lead.planId, snapshot: lead.snapshot })
		.from(lead)
		.where(and(eq(lead.id, leadId), eq(lead.contractorId, contractorId)));
	return l?.snapshot.photoIds?.includes(photoId) ? l.planId : null;
}

/**
 * The homeowner closes the request without hiring anyone: every open lead is closed (the table's
 * close step), open bids close with it, and each contractor concerned is told, in one transaction.
 * Refused once a bid was accepted: then the way out is marking the job done, or a release.
 */
export async function closeRequest(ownerId: string, planId: string, origin: string) {
	const out = await db.transaction(async (tx) => {
		if (!(await lockOwnPlan(tx, ownerId, planId))) return null;
		const leads = await tx.select({ id: lead.id, status: lead.status }).from(lead).where(eq(lead.planId, planId)).for('update');
		for (const l of leads)
			step(l.status, 'close', l.status === 'won' ? 'You accepted a bid already: mark the job done when it is finished.' : 'This job is done already.');
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
		// billing: a lead closed before any bid gives back what opening it used.
		await refundLeadCharges(
			tx,
			ids.filter((id) => !withBid.has(id) && moving.find((l) => l.id === id)?.status !== 'bid_sent'),
			'closed'
		);
		for (const to of await leadContractors(tx, ids))
			await queueMail(to.email, requestClosedMail(to.name, to.town ?? 'you', withBid.has(to.leadId), leadUrl(origin, to.leadId)), tx);
		return { closed: ids.length };
	});
	return out;
}

/** The homeowner marks the hired job done (won → done) and the contractor is told. */
export async function completeJob(ownerId: string, planId: string, origin: string) {
	const out = await db.transaction(async (tx) => {
		if (!(await lockOwnPlan(tx, ownerId, planId))) return null;
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
		.returning({
			id: lead.id,
			planId: lead.planId,
			homeownerId: lead.homeownerId,
			respondBy: lead.respondBy,
			planName: sql<string>`${lead.snapshot}->>'name'`
		});
	if (!rows.length) return 0;
	// billing: a lead that expired unanswered gives back what opening it used.
	await refundLeadCharges(
		tx,
		rows.map((r) => r.id),
		'expired'
	);
	for (const to of await leadContractors(
		tx,
		rows.map((r) => r.id)
	)) {
		const r = rows.find((x) => x.id === to.leadId)!;
		await queueMail(to.email, leadExpiredMail(to.name, to.town ?? 'you', formatDate(r.respondBy!), leadUrl(origin, to.leadId)), tx);
	}
	const names = await tx
		.select({ leadId: lead.id, business: sql<string>`coalesce(${contractor.businessName}, 'A contractor')` })
		.from(lead)
		.innerJoin(contractor, eq(contractor.userId, lead.contractorId))
		.where(
			inArray(
				lead.id,
				rows.map((r) => r.id)
			)
		);
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

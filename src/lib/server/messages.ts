import { and, asc, count, desc, eq, gt, ne, sql, type SQL } from 'drizzle-orm';
import { threadOpen } from '$lib/lead-status';
import { db } from '$lib/server/db';
import { contractor, lead, leadMessage, user } from '$lib/server/db/schema';
import { queueMail } from './mail';
import { newMessageMail } from './mail/pro-notices';
import { bidsUrl, LeadRefused, leadUrl, type Actor } from './lead-shared';

// Threads between a homeowner and a contractor, and unread counts. The root layout imports this
// module on every signed-in request: keep it free of the ZIP table (matching.ts) and the engine.

/** Messages in `leadId`'s thread the viewer has not read: sent by the other side after the viewer last looked. */
export const unreadFor = (side: 'homeowner' | 'contractor') =>
	sql<number>`(select count(*)::int from ${leadMessage} m where m.lead_id = ${lead.id}
		and m.sender_id <> ${side === 'homeowner' ? lead.homeownerId : lead.contractorId}
		and m.created_at > coalesce(${side === 'homeowner' ? lead.homeownerReadAt : lead.contractorReadAt}, 'epoch'))`;

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
// The unread count is read on every signed-in page: one prepared statement per side.
const unreadCountOf = (homeowner: boolean) =>
	db
		.select({ n: count() })
		.from(leadMessage)
		.innerJoin(lead, eq(lead.id, leadMessage.leadId))
		.where(
			and(
				homeowner ? eq(lead.homeownerId, sql.placeholder('me')) : eq(lead.contractorId, sql.placeholder('me')),
				ne(leadMessage.senderId, sql.placeholder('me')),
				gt(leadMessage.createdAt, homeowner ? lead.homeownerReadAt : sql`coalesce(${lead.contractorReadAt}, 'epoch')`),
				// Contractors who are not approved cannot open their threads, so nothing counts as waiting
				// (checked in the same query: one round trip on every signed-in page).
				homeowner
					? undefined
					: sql`exists (select 1 from ${contractor} where ${contractor.userId} = ${sql.placeholder('me')} and ${contractor.status} = 'approved')`
			)
		)
		.prepare(homeowner ? 'unread_count_homeowner' : 'unread_count_contractor');
const unreadCount = { homeowner: unreadCountOf(true), contractor: unreadCountOf(false) };

export async function unreadMessageCount(u: { id: string; role: string }) {
	if (u.role !== 'homeowner' && u.role !== 'contractor') return 0;
	const [{ n }] = await unreadCount[u.role].execute({ me: u.id });
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

import { error } from '@sveltejs/kit';
import { and, eq, sql } from 'drizzle-orm';
import { messageSchema } from '$lib/schemas/leads';
import { db } from '$lib/server/db';
import { bid, contractor, lead } from '$lib/server/db/schema';
import { formError, parseForm } from '$lib/server/forms';
import { requireRole } from '$lib/server/guards';
import { LeadRefused, markLeadReadByHomeowner } from '$lib/server/leads';
import { canWriteThread, postMessage, threadOf } from '$lib/server/messages';
import { isUuid } from '$lib/uuid';
import type { Actions, PageServerLoad, RequestEvent } from './$types';

/** The homeowner's own lead on their own plan; a 404 for anything else. */
async function ownLead(event: RequestEvent | Parameters<PageServerLoad>[0]) {
	const user = requireRole(event, 'homeowner');
	const { id, leadId } = event.params;
	if (!isUuid(id) || !isUuid(leadId)) error(404, 'No such lead');
	const [row] = await db
		.select({
			lead: {
				id: lead.id,
				status: lead.status,
				planRevision: lead.planRevision,
				declineReason: lead.declineReason,
				planName: sql<string>`${lead.snapshot}->>'name'`
			},
			contractor: {
				businessName: contractor.businessName,
				description: contractor.description,
				yearsInTrade: contractor.yearsInTrade,
				status: contractor.status,
				contactName: contractor.contactName,
				phone: contractor.phone
			},
			bid
		})
		.from(lead)
		.innerJoin(contractor, eq(contractor.userId, lead.contractorId))
		.leftJoin(bid, eq(bid.leadId, lead.id))
		.where(and(eq(lead.id, leadId), eq(lead.planId, id), eq(lead.homeownerId, user.id)));
	if (!row) error(404, 'No such lead');
	return { user, row };
}

export const load = (async (event) => {
	const { user, row } = await ownLead(event);
	await markLeadReadByHomeowner(user.id, row.lead.id);
	const won = row.lead.status === 'won';
	const { contactName, phone, ...publicProfile } = row.contractor;
	return {
		planId: event.params.id,
		planName: row.lead.planName,
		lead: { id: row.lead.id, status: row.lead.status, planRevision: row.lead.planRevision, declineReason: row.lead.declineReason },
		contractor: { ...publicProfile, contact: won ? { contactName, phone } : null },
		bid: row.bid,
		messages: await threadOf(row.lead.id),
		threadOpen: canWriteThread(row.lead.status),
		viewerId: user.id
	};
}) satisfies PageServerLoad;

export const actions = {
	message: async (event) => {
		const { user, row } = await ownLead(event);
		const { data, values, failure } = await parseForm(event.request, messageSchema);
		if (failure) return failure;
		try {
			if (!(await postMessage(user, row.lead.id, data.body, event.url.origin))) return formError(values, 'This thread is closed.', {}, 404);
		} catch (err) {
			if (err instanceof LeadRefused) return formError(values, err.message, {}, 409);
			throw err;
		}
		return { messageSent: true };
	}
} satisfies Actions;

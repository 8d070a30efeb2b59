import { leadStatuses, type LeadStatus } from '$lib/leads';
import { pageFrom } from '$lib/paging';
import { requireRole } from '$lib/server/guards';
import { contractorLeads } from '$lib/server/leads';
import { contractorDistanceUnit } from '$lib/server/contractors';
import { defaultDistanceUnit } from '$lib/reader';
import { openedLeadIds } from '$lib/server/billing/accounts'; // billing
import type { PageServerLoad } from './$types';

export const load = (async (event) => {
	const user = requireRole(event, 'contractor');
	const { billing } = await event.parent(); // the approved-only check
	const s = event.url.searchParams.get('status') ?? '';
	const status = (leadStatuses as readonly string[]).includes(s) ? (s as LeadStatus) : null;
	const paging = pageFrom(event.url, 20);
	const { rows, total } = await contractorLeads(user.id, { status, limit: paging.size, offset: paging.offset });
	const chosen = await contractorDistanceUnit(user.id);
	// billing: which leads' details are open to the contractor already; the others need a plan or a credit (or, beyond a running plan's included leads, open as an extra lead at its price).
	const opened = await openedLeadIds(
		user.id,
		rows.map((r) => r.id)
	);
	return {
		leads: rows.map((r) => ({ ...r, locked: !billing.canOpen && !opened.has(r.id), extra: billing.extra && !opened.has(r.id) })),
		billing,
		total,
		status: status ?? '',
		unit: chosen ?? defaultDistanceUnit(event.locals.reader.locale),
		...paging
	};
}) satisfies PageServerLoad;

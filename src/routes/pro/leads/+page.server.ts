import { leadStatuses, type LeadStatus } from '$lib/leads';
import { pageFrom } from '$lib/paging';
import { requireRole } from '$lib/server/guards';
import { contractorLeads } from '$lib/server/leads';
import { contractorDistanceUnit } from '$lib/server/contractors';
import { defaultDistanceUnit } from '$lib/reader';
import type { PageServerLoad } from './$types';

export const load = (async (event) => {
	const user = requireRole(event, 'contractor');
	await event.parent(); // the approved-only check
	const s = event.url.searchParams.get('status') ?? '';
	const status = (leadStatuses as readonly string[]).includes(s) ? (s as LeadStatus) : null;
	const paging = pageFrom(event.url, 20);
	const { rows, total } = await contractorLeads(user.id, { status, limit: paging.size, offset: paging.offset });
	const chosen = await contractorDistanceUnit(user.id);
	return { leads: rows, total, status: status ?? '', unit: chosen ?? defaultDistanceUnit(event.locals.reader.locale), ...paging };
}) satisfies PageServerLoad;

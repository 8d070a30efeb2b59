import { fail } from '@sveltejs/kit';
import { reminderPlan, stopCuringReminders, verifyUnsubscribeToken } from '$lib/server/reminders';
import type { Actions, PageServerLoad } from './$types';

const INVALID = 'This stop link is not complete or was changed. Open the plan and untick “E-mail me curing reminders” instead.';

// The link in each curing reminder. Opening it only shows the button (mail scanners that fetch
// links must not stop anything); no sign-in is needed: the signed token names the plan.
export const load = (async ({ url }) => {
	const token = url.searchParams.get('token') ?? '';
	const planId = await verifyUnsubscribeToken(token);
	const found = planId ? await reminderPlan(planId) : null;
	return { token, plan: found ? { name: found.name, on: found.on } : null };
}) satisfies PageServerLoad;

export const actions = {
	// The button's form sends the token; a mail program's one-click post (RFC 8058, body
	// "List-Unsubscribe=One-Click") sends it in the address of the List-Unsubscribe header.
	default: async ({ request, url }) => {
		const token = (await request.formData().catch(() => null))?.get('token') ?? url.searchParams.get('token');
		const planId = await verifyUnsubscribeToken(typeof token === 'string' ? token.slice(0, 200) : '');
		if (!planId) return fail(400, { message: INVALID });
		const found = await reminderPlan(planId);
		if (!found || !(await stopCuringReminders(planId))) return fail(404, { message: 'That plan no longer exists, so no reminders will come for it.' });
		return { stopped: found.name };
	}
} satisfies Actions;

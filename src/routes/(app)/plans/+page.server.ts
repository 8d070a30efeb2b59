import { fail, redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { renamePlanSchema } from '$lib/schemas/plan-record';
import { parseForm } from '$lib/server/forms';
import { requireRole } from '$lib/server/guards';
import { deletePlan, duplicatePlan, findOwnPlan, listPlans, PlanHasLeads, StaleRevision, summarize, updatePlan } from '$lib/server/plans';
import type { Actions, PageServerLoad } from './$types';

const idSchema = z.object({ id: z.uuid() });

export const load = (async (event) => {
	const me = requireRole(event, 'homeowner');
	const plans = (await listPlans(me.id)).map(summarize);
	// Delete and rename open inline by query, so they work without JavaScript too.
	const own = (key: string) => {
		const id = event.url.searchParams.get(key);
		return plans.some((p) => p.id === id) ? id : null;
	};
	return { plans, confirmDelete: own('delete'), renaming: own('rename') };
}) satisfies PageServerLoad;

export const actions = {
	rename: async (event) => {
		const me = requireRole(event, 'homeowner');
		const { data, values, failure } = await parseForm(event.request, renamePlanSchema.extend(idSchema.shape));
		if (failure) return fail(400, { ...failure.data, renaming: values.id });
		const current = await findOwnPlan(data.id, me.id);
		if (!current) return fail(404, { message: 'That plan no longer exists.' });
		try {
			await updatePlan(data.id, me.id, { revision: current.revision, name: data.name });
		} catch (err) {
			if (err instanceof StaleRevision) return fail(409, { message: 'The plan changed while you renamed it; try again.' });
			throw err;
		}
		redirect(303, '/plans');
	},
	duplicate: async (event) => {
		const me = requireRole(event, 'homeowner');
		const { data, failure } = await parseForm(event.request, idSchema);
		if (failure) return failure;
		const copy = await duplicatePlan(data.id, me.id);
		if (!copy) return fail(404, { message: 'That plan no longer exists.' });
		return { duplicated: copy.id };
	},
	delete: async (event) => {
		const me = requireRole(event, 'homeowner');
		const { data, failure } = await parseForm(event.request, idSchema);
		if (failure) return failure;
		try {
			// Someone else's plan answers as missing, never as done.
			if (!(await deletePlan(data.id, me.id))) return fail(404, { message: 'That plan no longer exists.' });
		} catch (err) {
			if (err instanceof PlanHasLeads) return fail(409, { message: err.message });
			throw err;
		}
		redirect(303, '/plans');
	}
} satisfies Actions;

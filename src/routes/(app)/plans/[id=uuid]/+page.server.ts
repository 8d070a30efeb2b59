import { error, fail } from '@sveltejs/kit';
import { z } from 'zod';
import { currentResult } from '$lib/plan-view/currentResult';
import { planPageView, strengthPoints } from '$lib/plan-view/pageView';
import { ENGINE_VERSION, parsePlanInput } from '$lib/plan';
import { requireRole } from '$lib/server/guards';
import { acceptPhotoUpload, deletePhoto, listPhotos, MAX_PHOTO_BYTES } from '$lib/server/photos';
import { findOwnPlan } from '$lib/server/plans';
import { loggedForecastFor } from '$lib/plan/pour-log';
import { listPourRecords } from '$lib/server/pour-records';
import { curingReminderState, curingReminderSummary, setCuringReminders } from '$lib/server/reminders';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	const me = requireRole(event, 'homeowner');
	// The plan, its photos, pour log and reminder state at once; the rest is returned only when the plan is the user's own
	// (the reminder state reads the plan by its owner itself).
	const [found, photos, records, reminderState] = await Promise.all([
		findOwnPlan(event.params.id, me.id),
		listPhotos(event.params.id),
		listPourRecords(event.params.id),
		curingReminderState(event.params.id, me.id)
	]);
	if (!found) error(404, 'No such plan.');
	const result = currentResult(found.input, found.result);
	// The stored result stands for the planned plan when this engine wrote it, so it is not computed again.
	const known = found.engineVersion === ENGINE_VERSION ? result : undefined;
	// Parsed once for both readings of the log: the forecast and the reminders.
	const parsed = parsePlanInput(found.input);
	// The strength timeline and milestones again from the pour log's dates and temperatures.
	const logged = loggedForecastFor(parsed, result, records);
	return {
		photos: photos.map((p) => ({ id: p.id, originalName: p.originalName, width: p.width, height: p.height })),
		maxPhotoMb: MAX_PHOTO_BYTES / 1024 / 1024,
		// Only what the page shows; the long parts come on demand from sheets/ (lib/plan-view/pageView.ts).
		result: planPageView(result),
		logged: logged && { ...logged, strength: strengthPoints(logged.strength) },
		locale: event.locals.reader.locale,
		reminders: reminderState && curingReminderSummary(reminderState, parsed, records, known),
		readerTimeZone: event.locals.reader.timeZone
	};
}) satisfies PageServerLoad;

export const actions = {
	upload: async (event) => {
		const me = requireRole(event, 'homeowner');
		const owned = await findOwnPlan(event.params.id, me.id);
		if (!owned) return fail(404, { message: 'No such plan.' });
		const up = await acceptPhotoUpload(owned.id, (await event.request.formData()).get('photo'));
		return up.ok ? { uploaded: true } : fail(up.status, { message: up.message });
	},
	/** The "E-mail me curing reminders" switch: on schedules a job per curing day, off removes them. */
	reminders: async (event) => {
		const me = requireRole(event, 'homeowner');
		const on = (await event.request.formData()).get('on') === 'on';
		const saved = await setCuringReminders(event.params.id, me.id, on, event.locals.reader.timeZone);
		if (!saved) return fail(404, { message: 'No such plan.' });
		return { remindersSaved: on ? ('on' as const) : ('off' as const) };
	},
	deletePhoto: async (event) => {
		const me = requireRole(event, 'homeowner');
		const owned = await findOwnPlan(event.params.id, me.id);
		const photoId = z.uuid().safeParse((await event.request.formData()).get('photoId'));
		// Only a photo of this very plan: another plan's photo id (anyone's) answers as missing, and stays.
		if (!owned || !photoId.success || !(await deletePhoto(owned.id, photoId.data))) return fail(404, { message: 'No such photo.' });
		return { removed: true };
	}
} satisfies Actions;

import { fail } from '@sveltejs/kit';
import { z } from 'zod';
import { currentResult } from '$lib/components/plan/currentResult';
import { readerLocale } from '$lib/components/plan/format';
import { requireRole } from '$lib/server/guards';
import { acceptPhotoUpload, deletePhoto, listPhotos, MAX_PHOTO_BYTES } from '$lib/server/photos';
import { findOwnPlan } from '$lib/server/plans';
import { curingReminderStatus, setCuringReminders } from '$lib/server/reminders';
import type { Actions, PageServerLoad } from './$types';

export const load = (async ({ parent, request, locals }) => {
	// The layout found the plan among the user's own; only then are its photos listed.
	const { plan } = await parent();
	const photos = (await listPhotos(plan.id)).map((p) => ({ id: p.id, originalName: p.originalName, width: p.width, height: p.height }));
	const reminders = await curingReminderStatus(plan.id, locals.user!.id);
	return {
		photos,
		maxPhotoMb: MAX_PHOTO_BYTES / 1024 / 1024,
		result: currentResult(plan.input, plan.result),
		locale: readerLocale(request.headers.get('accept-language')),
		reminders,
		readerTimeZone: locals.reader.timeZone
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


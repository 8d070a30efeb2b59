import { error, redirect } from '@sveltejs/kit';
import zipcodes from 'zipcodes';
import { contractorProfileSchema, documentKinds, documentLabels, type DocumentKind } from '$lib/schemas/contractor';
import { findContractor, saveContractorProfile } from '$lib/server/contractors';
import { formError, validateForm, type FieldErrors } from '$lib/server/forms';
import { requireRole } from '$lib/server/guards';
import { DOCUMENT_MAX_BYTES, documentTypes, isEmptyUpload, sniffUpload, type SniffedUpload } from '$lib/server/uploads';
import type { Actions, PageServerLoad } from './$types';

export const load = (async (event) => {
	const user = requireRole(event, 'contractor');
	const profile = await findContractor(user.id);
	if (!profile) error(404, 'No contractor record');
	return { profile };
}) satisfies PageServerLoad;

export const actions = {
	default: async (event) => {
		const user = requireRole(event, 'contractor');
		const profile = await findContractor(user.id);
		if (!profile) error(404, 'No contractor record');
		const form = await event.request.formData();
		const { data, values, failure } = validateForm(form, contractorProfileSchema, ['services']);
		const errors: FieldErrors = { ...failure?.data.errors };

		const uploads: Partial<Record<DocumentKind, SniffedUpload>> = {};
		for (const kind of documentKinds) {
			const entry = form.get(kind);
			const what = documentLabels[kind].toLowerCase();
			if (isEmptyUpload(entry)) {
				if (!profile.documents.some((d) => d.kind === kind)) errors[kind] = `Add your ${what}.`;
				continue;
			}
			const checked = await sniffUpload(entry as File, { maxBytes: DOCUMENT_MAX_BYTES, accept: documentTypes, what });
			if (checked.ok) uploads[kind] = checked;
			else errors[kind] = checked.message;
		}
		const place = data ? zipcodes.lookup(data.servicePostcode) : undefined;
		if (data && !place) errors.servicePostcode = 'We do not know this ZIP code. Please check it.';

		if (!data || !place || Object.values(errors).some(Boolean)) {
			// A browser cannot re-fill a file input, so say so when other fields failed.
			const kept = Object.keys(uploads).length ? ' Files you chose were not kept; please choose them again.' : '';
			return formError(values, `Please correct the fields marked below.${kept}`, errors);
		}
		await saveContractorProfile(user.id, data, { lat: place.latitude, lon: place.longitude }, uploads, event.url.origin);
		redirect(303, '/pro');
	}
} satisfies Actions;

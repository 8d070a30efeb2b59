import { error, json } from '@sveltejs/kit';
import { requireApiRole } from '$lib/server/api';
import { currentResult } from '$lib/plan-view/currentResult';
import { readerLocale } from '$lib/reader';
import { PdfRefused, renderPlanPdf } from '$lib/server/pdf/pool';
import { findOwnPlan, planView } from '$lib/server/plans';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ locals, params, request }) => {
	const me = requireApiRole(locals, 'homeowner');
	const found = await findOwnPlan(params.id, me.id);
	if (!found) error(404, 'No such plan.');
	const view = planView(found);
	let bytes: Uint8Array;
	try {
		// Drawn in a worker thread with a time and memory cap, never on the request loop.
		bytes = await renderPlanPdf({
			name: view.name,
			result: currentResult(view.input, view.result),
			createdAt: found.updatedAt,
			locale: readerLocale(request.headers.get('accept-language'))
		});
	} catch (err) {
		if (!(err instanceof PdfRefused)) throw err;
		return json({ message: err.message }, { status: err.status, headers: err.status === 503 ? { 'retry-after': '5' } : {} });
	}
	const file =
		view.name
			.replace(/[^A-Za-z0-9 _-]/g, '')
			.trim()
			.replace(/\s+/g, '-') || 'plan';
	return new Response(bytes as BodyInit, {
		headers: {
			'content-type': 'application/pdf',
			'content-disposition': `attachment; filename="${file}.pdf"`,
			'cache-control': 'private, no-store'
		}
	});
};

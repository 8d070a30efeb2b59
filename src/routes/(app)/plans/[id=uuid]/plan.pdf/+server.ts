import { error } from '@sveltejs/kit';
import { requireApiRole } from '$lib/server/api';
import { currentResult } from '$lib/components/plan/currentResult';
import { readerLocale } from '$lib/components/plan/format';
import { planPdf } from '$lib/server/pdf/planPdf';
import { findOwnPlan, planView } from '$lib/server/plans';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ locals, params, request }) => {
	const me = requireApiRole(locals, 'homeowner');
	const found = await findOwnPlan(params.id, me.id);
	if (!found) error(404, 'No such plan.');
	const view = planView(found);
	const bytes = await planPdf({ name: view.name, result: currentResult(view.input, view.result), createdAt: found.updatedAt, locale: readerLocale(request.headers.get('accept-language')) });
	const file = view.name.replace(/[^A-Za-z0-9 _-]/g, '').trim().replace(/\s+/g, '-') || 'plan';
	return new Response(bytes as BodyInit, {
		headers: {
			'content-type': 'application/pdf',
			'content-disposition': `attachment; filename="${file}.pdf"`,
			'cache-control': 'private, no-store'
		}
	});
};

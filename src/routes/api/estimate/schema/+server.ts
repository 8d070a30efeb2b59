import { planInputJsonSchema } from '$lib/plan';
import type { RequestHandler } from './$types';

/** Built once: the schema only changes with a deploy. */
const body = JSON.stringify({
	...planInputJsonSchema(),
	title: 'Stakeline slab plan input',
	description: 'Request body of POST /api/estimate. Lengths are in the units the plan names.'
});

/** The JSON Schema of the estimate request, generated from the zod schema the engine uses. */
export const GET: RequestHandler = () =>
	new Response(body, {
		headers: {
			'content-type': 'application/schema+json; charset=utf-8',
			'cache-control': 'public, max-age=3600'
		}
	});

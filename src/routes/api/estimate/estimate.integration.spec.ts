import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { planOutside } from '$lib/plan/bounds.arbitraries';
import { largestPlan, rect } from '$lib/plan/test-plans';
import { POST } from './+server';
import { GET } from './schema/+server';
import { ESTIMATE_LIMIT } from '$lib/server/rate-limit';
import { useTestDatabase } from '$lib/server/integration-setup';

// Each call from its own address, so the per-client rate limit (tested below) stays out of the way.
const post = (body: string, address = `test-${crypto.randomUUID()}`) =>
	POST({ request: new Request('http://localhost/api/estimate', { method: 'POST', body }), getClientAddress: () => address } as unknown as Parameters<
		typeof POST
	>[0]) as Promise<Response>;
const postJson = (value: unknown) => post(JSON.stringify(value));

const valid = {
	units: 'imperial',
	sections: [
		{
			outline: [
				[0, 0],
				[16, 0],
				[16, 12],
				[0, 12]
			]
		}
	],
	bags: { offered: [{ size: 80, price: 6.4 }] },
	readyMix: { price: 185 }
};

/** A validator's own wording, which a person should never read. */
const RAW = /expected|received|invalid input|too small|too big|>=|<=/i;

async function expectBad(res: Response, path?: string): Promise<{ path: string; message: string }[]> {
	expect(res.status).toBe(400);
	const body = await res.json();
	expect(Array.isArray(body.errors)).toBe(true);
	expect(body.errors.length).toBeGreaterThan(0);
	for (const e of body.errors) {
		expect(typeof e.path === 'string' && typeof e.message === 'string').toBe(true);
		expect(e.message).not.toMatch(RAW);
	}
	// Each problem once.
	const keys = body.errors.map((e: { path: string; message: string }) => `${e.path} ${e.message}`);
	expect(new Set(keys).size).toBe(keys.length);
	if (path !== undefined) expect(body.errors.map((e: { path: string }) => e.path)).toContain(path);
	return body.errors;
}

// The per-address limit is counted in PostgreSQL.
useTestDatabase();

describe('POST /api/estimate', () => {
	it('is rate-limited per client address, with Retry-After and the limit in the message', async () => {
		const address = `limit-${crypto.randomUUID()}`;
		for (let i = 0; i < ESTIMATE_LIMIT.points; i++) expect((await post(JSON.stringify(valid), address)).status).toBe(200);
		const over = await post(JSON.stringify(valid), address);
		expect(over.status).toBe(429);
		expect(Number(over.headers.get('retry-after'))).toBeGreaterThan(0);
		expect((await over.json()).message).toMatch(`Over ${ESTIMATE_LIMIT.points} estimates a minute`);
		// Another client is not affected.
		expect((await post(JSON.stringify(valid))).status).toBe(200);
	});

	it('answers a valid plan with the full result', async () => {
		const res = await postJson(valid);
		expect(res.status).toBe(200);
		expect(res.headers.get('content-type')).toMatch(/application\/json/);
		const r = await res.json();
		for (const k of ['cubicFeet', 'cubicYards', 'cubicMeters']) {
			expect(typeof r.volume.net[k]).toBe('number');
			expect(typeof r.volume.order[k]).toBe('number');
		}
		expect(r.volume.net.cubicFeet).toBe(64); // 192 ft² × 4/12 ft, rounded to 4 places
		expect(r.area).toMatchObject({ squareFeet: 192, squareMeters: 17.8374 }); // 192 × 0.3048²
		expect(r.bags[0]).toMatchObject({ size: 80, unit: 'lb', count: 118 }); // 70.4 ft³ / 0.60 (bag labels)
		expect(r.joints.maxSpacing.feet).toBe(12); // 36 × 4 in, ACI 302.1R
		expect(r.strength[0]).toEqual(expect.objectContaining({ day: 1, percent: expect.any(Number) }));
		expect(r.cautions[0]).toEqual(expect.objectContaining({ id: 'local-codes', title: expect.any(String), source: expect.any(String) }));
	});

	it('rejects a body that is not JSON', async () => {
		await expectBad(await post('{"units": "imperial",'), '');
	});

	it('rejects wrong types with their paths', async () => {
		await expectBad(await postJson({ ...valid, thickness: 'thick' }), 'thickness');
		await expectBad(await postJson({ ...valid, sections: 'none' }), 'sections');
		await expectBad(await postJson(null), '');
		await expectBad(await postJson([valid]), '');
	});

	it('rejects invalid geometry at the outline', async () => {
		const outlines = (...o: [number, number][][]) => ({ ...valid, sections: o.map((outline) => ({ outline })) });
		// Crossing itself; a corner given twice (kept on one line each, like the rectangles below).
		// prettier-ignore
		await expectBad(await postJson(outlines([[0, 0], [10, 0], [2, 8], [8, 10]])), 'sections.0.outline');
		// prettier-ignore
		await expectBad(await postJson(outlines([[0, 0], [10, 0], [10, 0], [0, 10]])), 'sections.0.outline');
		// Two pours on top of each other.
		await expectBad(await postJson(outlines(rect(0, 0, 10, 10), rect(5, 5, 10, 10))), 'sections.1.outline');
	});

	it('maps an error found by the engine to its path', async () => {
		await expectBad(await postJson({ ...valid, fill: { volume: 2, largestPiece: 3 } }), 'fill');
	});

	it('answers random junk with 400 and errors, never a throw', async () => {
		await fc.assert(
			fc.asyncProperty(
				fc.oneof(
					fc.string(),
					fc.jsonValue().map((v) => JSON.stringify(v))
				),
				async (body) => {
					await expectBad(await post(body));
				}
			),
			{ numRuns: 60 }
		);
	});

	it('answers a valid plan with one field spoiled with 400', async () => {
		const keys = ['units', 'sections', 'thickness', 'slope', 'forms', 'bags', 'crew', 'conditions', 'houseEdge'] as const;
		const junk = fc.oneof(fc.string(), fc.constant(-1e9), fc.array(fc.integer()), fc.constant({ nope: true }));
		await fc.assert(
			fc.asyncProperty(fc.constantFrom(...keys), junk, async (key, value) => {
				await expectBad(await postJson({ ...valid, [key]: value }));
			}),
			{ numRuns: 60 }
		);
	});
});

describe('POST /api/estimate: scope limits', () => {
	it('refuses the 263-byte attack (a 2000 × 2000 ft slab of 10 lb bags) quickly, naming the limits', async () => {
		const attack = {
			units: 'imperial',
			sections: [
				{
					outline: [
						[-1000, -1000],
						[1000, -1000],
						[1000, 1000],
						[-1000, 1000]
					]
				}
			],
			bags: { offered: [{ size: 10 }] },
			crew: { method: 'drum', drumBatchMass: 20 }
		};
		const errors = await expectBad(await postJson(attack), 'sections');
		const text = errors.map((e) => e.message).join(' ');
		expect(text).toContain('the limit is 3,000 ft²');
		expect(text).toContain('the limit is 1,000 ft');
	});

	it('answers every plan outside one limit with a 400 that names that limit', async () => {
		await fc.assert(
			fc.asyncProperty(planOutside, async ({ limit, needle, plan }) => {
				const errors = await expectBad(await postJson(plan));
				expect(errors.map((e) => e.message).join(' | '), limit).toContain(needle);
			}),
			{ numRuns: 60 }
		);
	}, 60_000);

	it('answers the largest plan in scope under 1 MB', async () => {
		const res = await postJson(largestPlan());
		expect(res.status).toBe(200);
		expect((await res.arrayBuffer()).byteLength).toBeLessThan(1_000_000);
	});
});

describe('POST /api/estimate: messages in plain words', () => {
	const messageAt = async (plan: unknown, path: string) => (await expectBad(await postJson(plan), path)).find((e) => e.path === path)!.message;

	it('names the field, its unit and the range to enter', async () => {
		expect(await messageAt({ ...valid, thickness: null }, 'thickness')).toBe('Enter the thickness, 2–12 in.');
		expect(await messageAt({ ...valid, thickness: 1 }, 'thickness')).toBe('Enter the thickness, 2–12 in.');
		expect(await messageAt({ ...valid, units: 'metric', thickness: 20 }, 'thickness')).toBe('Enter the thickness, 50–300 mm.');
		expect(await messageAt({ ...valid, crew: { people: 2.5 } }, 'crew.people')).toBe('Enter the number of people, a whole number 1–20.');
		expect(await messageAt({ ...valid, crew: { method: 'robot' } }, 'crew.method')).toBe('Choose the mixing method: hand or drum.');
		expect(await messageAt({ ...valid, units: 'cubits' }, 'units')).toBe('Choose the units: imperial or metric.');
		expect(await messageAt({ ...valid, conditions: { pourDate: 'soon' } }, 'conditions.pourDate')).toBe(
			'Enter the pour date as a real calendar date, written year-month-day (2027-06-12).'
		);
		expect(await messageAt({ ...valid, colour: 'grey' }, 'colour')).toMatch(/"colour" is not part of a plan/);
	});

	it('refuses NUL characters and lone surrogates in text with a 400 at the field', async () => {
		for (const bad of ['Patio\u0000', 'Patio \ud800', '\udc00 Patio'])
			expect(await messageAt({ ...valid, name: bad }, 'name')).toMatch(/control character or broken character/);
		expect(await messageAt({ ...valid, sections: [{ ...valid.sections[0], name: 'A\u0000' }] }, 'sections.0.name')).toMatch(/control character/);
		expect(await messageAt({ ...valid, reference: { label: '\ud83d' } }, 'reference.label')).toMatch(/broken character/);
		// A whole surrogate pair (an emoji) is text like any other.
		expect((await postJson({ ...valid, name: 'Patio \ud83d\ude00' })).status).toBe(200);
	});
});

describe('GET /api/estimate/schema', () => {
	it('publishes the JSON Schema of the request', async () => {
		const res = (await GET({} as Parameters<typeof GET>[0])) as Response;
		expect(res.status).toBe(200);
		const s = await res.json();
		expect(s.$schema).toMatch(/json-schema\.org/);
		expect(s.oneOf).toHaveLength(2);
		expect(s.oneOf[0].properties.units).toEqual({ type: 'string', const: 'imperial' });
		expect(s.oneOf[0].required).toEqual(['units', 'sections']);
	});
});

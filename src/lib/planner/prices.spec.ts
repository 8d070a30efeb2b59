import { describe, expect, it } from 'vitest';
import { planInputSchema } from '$lib/plan';
import { PRICE_KEYS, PRICE_LABELS, priceFields } from './prices';

type Shape = Record<string, { description?: string }>;
const [imperial, metric] = planInputSchema.options;
const shapes = { imperial: imperial.shape.prices.unwrap().shape as Shape, metric: metric.shape.prices.unwrap().shape as Shape };

describe('price fields', () => {
	it('every price key of the schema, in both unit systems, has its own label', () => {
		expect(Object.keys(shapes.metric)).toEqual(Object.keys(shapes.imperial));
		expect(PRICE_KEYS).toEqual(Object.keys(shapes.imperial));
		for (const key of PRICE_KEYS) expect(PRICE_LABELS[key], key).toBeDefined();
		// No label left over from a price the schema dropped.
		expect(Object.keys(PRICE_LABELS).sort()).toEqual([...PRICE_KEYS].sort());
	});

	it('each label says what, in which currency, and per what unit', () => {
		for (const units of ['imperial', 'metric'] as const) {
			const fields = priceFields(units, 'CAD');
			expect(fields.map((f) => f.key)).toEqual(PRICE_KEYS);
			for (const f of fields) expect(f.label, f.key).toMatch(/^[A-Z][^,]+, CAD (per \S.*|each|in all)$/);
			expect(new Set(fields.map((f) => f.label)).size).toBe(fields.length);
		}
		expect(priceFields('imperial', 'EUR').find((f) => f.key === 'gravel')?.label).toBe('Gravel for the base, EUR per yd³');
		expect(priceFields('metric', 'EUR').find((f) => f.key === 'gravel')?.label).toBe('Gravel for the base, EUR per m³');
	});

	it('a price whose schema unit differs between unit systems is labelled with each system’s unit', () => {
		for (const key of PRICE_KEYS) {
			const [a, b] = [shapes.imperial[key].description, shapes.metric[key].description];
			if (a !== b) expect(PRICE_LABELS[key].per.imperial, key).not.toBe(PRICE_LABELS[key].per.metric);
			// The unit the schema names after "Per" is the one the label names.
			for (const [units, d] of [
				['imperial', a],
				['metric', b]
			] as const) {
				const unit = d?.match(/^Per ([^ .;]+)/)?.[1];
				if (unit && /[²³]|^(ft|m|lb|kg|US|L|yd)$/.test(unit)) expect(PRICE_LABELS[key].per[units], `${key} ${units}`).toContain(unit);
			}
		}
	});
});

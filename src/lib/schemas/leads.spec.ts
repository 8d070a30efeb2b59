import { describe, expect, it } from 'vitest';
import { bidSchema, getBidsSchema } from './leads';

const future = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
const good = { total: '$2,480.50', item_labour: '1,200', item_materials: '900', earliestStart: future(7), durationDays: '2', validUntil: future(30) };

describe('bidSchema', () => {
	it('turns dollars into cents and keeps only the line items given', () => {
		const r = bidSchema.parse(good);
		expect(r.totalCents).toBe(248050);
		expect(r.lineItems).toEqual([
			{ kind: 'labour', cents: 120000 },
			{ kind: 'materials', cents: 90000 }
		]);
		expect(r.durationDays).toBe(2);
	});

	it('refuses line items above the total, past dates and bad amounts, by field', () => {
		const r = bidSchema.safeParse({ ...good, total: '1000', item_base: 'ten', earliestStart: '2001-01-01', durationDays: '0' });
		expect(r.success).toBe(false);
		const byField = Object.fromEntries(r.error!.issues.map((i) => [String(i.path[0]), i.message]));
		expect(byField).toMatchObject({
			item_base: 'Enter an amount in dollars, like 1850 or 1,850.00.',
			earliestStart: 'Pick today or a later date.',
			durationDays: 'Use at least 1 days.'
		});
		const over = bidSchema.safeParse({ ...good, total: '1000' });
		expect(over.error?.issues.map((i) => [i.path[0], i.message])).toEqual([['total', 'The line items add up to more than the total.']]);
	});
});

describe('getBidsSchema', () => {
	it('needs one to five contractors', () => {
		const base = { scope: 'whole_job', timeframe: 'flexible' };
		expect(getBidsSchema.safeParse({ ...base, contractors: [] }).success).toBe(false);
		expect(getBidsSchema.safeParse({ ...base, contractors: Array.from({ length: 6 }, () => crypto.randomUUID()) }).success).toBe(false);
		expect(getBidsSchema.parse({ ...base, contractors: [crypto.randomUUID()] }).notes).toBe('');
	});
});

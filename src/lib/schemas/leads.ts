import { z } from 'zod';
import { plainText } from '$lib/plan/text';
import { existingSurfaces, finishes, lineItemKinds, MAX_CONTRACTORS_PER_SEND, timeframes } from '$lib/leads';
import { serviceKinds, wholeNumber } from './contractor';

const uuid = z.uuid('Unknown contractor.');

/** The job site's street address: told only to the contractor whose bid is accepted. */
export const siteAddress = plainText()
	.trim()
	.min(8, 'Enter the street address of the site, with the town (at least 8 characters).')
	.max(200, 'Use at most 200 characters.')
	.regex(/\d/, 'Include the house or lot number.')
	.regex(/\p{L}{2}/u, 'Include the street name.');
/** A phone number with its area code: 7 to 15 digits, with spaces, dots, dashes or brackets between. */
export const contactPhone = plainText()
	.trim()
	.regex(/^\+?[0-9 ()./-]{7,25}$/, 'Enter a phone number with its area code.')
	.refine((p) => {
		const digits = p.replace(/\D/g, '').length;
		return digits >= 7 && digits <= 15;
	}, 'Enter a phone number with its area code (7 to 15 digits).');

export const getBidsSchema = z
	.object({
		scope: z.enum(serviceKinds, { error: 'Choose what you want done.' }),
		timeframe: z.enum(timeframes, { error: 'Choose when the work should happen.' }),
		notes: plainText().trim().max(2000, 'Use at most 2000 characters.').default(''),
		finish: z.enum(finishes, { error: 'Choose a finish.' }).default('broom'),
		existingSurface: z.enum(existingSurfaces, { error: 'Choose what is there now.' }).default('grass_soil'),
		siteAccess: plainText().trim().max(500, 'Use at most 500 characters.').default(''),
		// Optional when sending (asked again on accepting); given, both must be valid.
		siteAddress: plainText().trim().max(200, 'Use at most 200 characters.').default(''),
		phone: plainText().trim().max(25, 'Use at most 25 characters.').default(''),
		contractors: z
			.array(uuid)
			.min(1, 'Choose at least one contractor.')
			.max(MAX_CONTRACTORS_PER_SEND, `Choose at most ${MAX_CONTRACTORS_PER_SEND} contractors.`)
	})
	.superRefine((v, ctx) => {
		for (const [key, schema] of [
			['siteAddress', siteAddress],
			['phone', contactPhone]
		] as const) {
			const bad = v[key] ? schema.safeParse(v[key]).error?.issues[0] : undefined;
			if (bad) ctx.addIssue({ code: 'custom', path: [key], message: bad.message });
		}
		if (v.siteAddress && !v.phone) ctx.addIssue({ code: 'custom', path: ['phone'], message: 'Add a phone number too, or leave both empty for now.' });
		if (v.phone && !v.siteAddress) ctx.addIssue({ code: 'custom', path: ['siteAddress'], message: 'Add the site address too, or leave both empty for now.' });
	})
	.transform(({ siteAddress, phone, ...rest }) => ({ ...rest, contact: siteAddress && phone ? { siteAddress, phone } : null }));

/** Dollars as typed ("1,250", "$980.50") to whole cents; empty is allowed only where optional. */
const DOLLARS = /^\$?\s*(\d{1,3}(,\d{3})+|\d+)(\.\d{1,2})?$/;
const toCents = (s: string) => Math.round(Number(s.replace(/[$,\s]/g, '')) * 100);
const dollarsMessage = 'Enter an amount in dollars, like 1850 or 1,850.00.';
const dollars = plainText()
	.trim()
	.regex(DOLLARS, dollarsMessage)
	.transform(toCents)
	.pipe(z.number().max(1_000_000_00, 'That is more than this kind of job can cost.'));
const optionalDollars = plainText()
	.trim()
	.default('')
	.refine((s) => s === '' || DOLLARS.test(s), dollarsMessage)
	.transform((s) => (s === '' ? null : toCents(s)));

const isoDate = (missing: string) =>
	plainText()
		.trim()
		.min(1, missing)
		.regex(/^\d{4}-\d{2}-\d{2}$/, 'Enter a date.');
const utcToday = () => new Date().toISOString().slice(0, 10);

/**
 * A bid, checked against the bidder's own calendar day: `today` is built per request from the
 * contractor's time zone, so late evening in Oregon is not already "tomorrow" as in UTC.
 */
export const bidSchemaFor = (today: () => string) =>
	z
		.object({
			total: dollars.pipe(z.number().min(100, 'Enter the total price.')),
			...Object.fromEntries(lineItemKinds.map((k) => [`item_${k}`, optionalDollars])),
			earliestStart: isoDate('Enter the earliest start date.').refine((d) => d >= today(), 'Pick today or a later date.'),
			durationDays: wholeNumber('Enter how many days the job takes.', 1, 60, ' days'),
			validUntil: isoDate('Enter how long the price holds.').refine((d) => d >= today(), 'Pick today or a later date.'),
			inclusions: plainText().trim().max(2000, 'Use at most 2000 characters.').default(''),
			exclusions: plainText().trim().max(2000, 'Use at most 2000 characters.').default(''),
			notes: plainText().trim().max(2000, 'Use at most 2000 characters.').default('')
		})
		.transform((b, ctx) => {
			const raw = b as unknown as Record<string, number | null>;
			const lineItems = lineItemKinds.filter((k) => raw[`item_${k}`] !== null).map((kind) => ({ kind, cents: raw[`item_${kind}`]! }));
			const sum = lineItems.reduce((s, i) => s + i.cents, 0);
			if (sum > b.total) ctx.addIssue({ code: 'custom', path: ['total'], message: 'The line items add up to more than the total.' });
			return {
				totalCents: b.total,
				lineItems,
				earliestStart: b.earliestStart,
				durationDays: b.durationDays,
				validUntil: b.validUntil,
				inclusions: b.inclusions,
				exclusions: b.exclusions,
				notes: b.notes
			};
		});
/** The same checks against UTC's day, for callers without a reader (tests, scripts). */
export const bidSchema = bidSchemaFor(utcToday);
export type BidInput = z.output<typeof bidSchema>;

export const declineSchema = z.object({
	reason: plainText().trim().min(3, 'Say briefly why, so the homeowner knows.').max(1000, 'Use at most 1000 characters.')
});

export const messageSchema = z.object({
	body: plainText().trim().min(1, 'Write a message first.').max(4000, 'Use at most 4000 characters.')
});

export const acceptSchema = z.object({ bid: z.uuid('Unknown bid.'), siteAddress, phone: contactPhone });

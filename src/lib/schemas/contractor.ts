import { z } from 'zod';
import { plainText } from '$lib/plan/text';

/** The parts of a slab job a contractor can take on; "whole" means all of them. */
export const serviceKinds = ['layout_forms', 'base_prep', 'pour_finish', 'whole_job'] as const;
export type ServiceKind = (typeof serviceKinds)[number];
/** The farthest a contractor may say they travel, in their unit (mi or km); matching relies on it. */
export const MAX_SERVICE_RADIUS = 250;
export const serviceLabels: Record<ServiceKind, string> = {
	layout_forms: 'Layout and forms',
	base_prep: 'Base preparation',
	pour_finish: 'Pour and finish',
	whole_job: 'The whole job'
};

export const distanceUnits = ['mi', 'km'] as const;
export type DistanceUnit = (typeof distanceUnits)[number];

export const documentKinds = ['licence', 'insurance'] as const;
export type DocumentKind = (typeof documentKinds)[number];
export const documentLabels: Record<DocumentKind, string> = { licence: 'Licence document', insurance: 'Insurance certificate' };

/** A whole number typed into a text or number field; empty is "missing", not zero. */
export const wholeNumber = (missing: string, min: number, max: number, unit = '') =>
	plainText()
		.trim()
		.min(1, missing)
		.pipe(
			z.coerce
				.number<string>({ error: 'Enter a whole number.' })
				.int('Enter a whole number.')
				.min(min, `Use at least ${min}${unit}.`)
				.max(max, `Use at most ${max}${unit}.`)
		);

const text = (missing: string, max: number) => plainText().trim().min(1, missing).max(max, `Use at most ${max} characters.`);

/** A US ZIP code: five digits (ZIP+4 is accepted and shortened). */
export const zipCode = plainText()
	.trim()
	.regex(/^\d{5}(-\d{4})?$/, 'Enter a five-digit ZIP code.')
	.transform((s) => s.slice(0, 5));

/** Latest expiry date a contractor may enter: credentials are renewed within a few years. */
export const MAX_EXPIRY_YEARS = 10;
const isoDay = (d: Date) => d.toISOString().slice(0, 10);
const expiryDate = (what: string) =>
	plainText()
		.trim()
		.min(1, `Enter the date your ${what} expires.`)
		.regex(/^\d{4}-\d{2}-\d{2}$/, 'Enter a date.')
		.refine((d) => !Number.isNaN(Date.parse(`${d}T00:00:00Z`)) && isoDay(new Date(`${d}T00:00:00Z`)) === d, 'Enter a date that exists.')
		.refine((d) => d >= isoDay(new Date()), `This date has passed: enter the expiry date of your renewed ${what}.`)
		.refine((d) => d <= isoDay(new Date(Date.now() + MAX_EXPIRY_YEARS * 365.25 * 86_400_000)), `Use a date within ${MAX_EXPIRY_YEARS} years.`);

export const contractorProfileSchema = z.object({
	businessName: text('Enter the business name.', 120),
	contactName: text('Enter who homeowners will deal with.', 100),
	phone: plainText()
		.trim()
		.regex(/^\+?[0-9 ()./-]{7,25}$/, 'Enter a phone number with its area code.'),
	description: text('Tell homeowners what your business does.', 2000),
	yearsInTrade: wholeNumber('Enter how many years you have done this work.', 0, 80, ' years'),
	services: z.array(z.enum(serviceKinds)).min(1, 'Choose at least one service.'),
	licenceNumber: text('Enter your licence number.', 60),
	licenceAuthority: text('Enter who issued the licence.', 120),
	licenceExpiresOn: expiryDate('licence'),
	insuranceExpiresOn: expiryDate('insurance'),
	servicePostcode: zipCode,
	serviceRadius: wholeNumber('Enter how far you travel.', 1, MAX_SERVICE_RADIUS),
	serviceRadiusUnit: z.enum(distanceUnits, { error: 'Choose miles or kilometres.' })
});
export type ContractorProfileInput = z.output<typeof contractorProfileSchema>;

export const vettingReasonSchema = z.object({
	reason: plainText().trim().min(5, 'Say what the contractor needs to know (at least 5 characters).').max(1000, 'Use at most 1000 characters.')
});
export const optionalReasonSchema = z.object({ reason: plainText().trim().max(1000, 'Use at most 1000 characters.').optional() });

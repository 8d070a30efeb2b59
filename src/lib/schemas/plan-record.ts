import { z } from 'zod';
import { plainText } from '$lib/plan/text';

/**
 * What a saved plan adds around the engine's input: its name and where it is. The engine's own
 * schema (planInputSchema in $lib/plan) validates `input`.
 */
export const planMetaSchema = z.object({
	name: plainText().trim().min(1, 'Give the plan a name.').max(100, 'Use at most 100 characters.'),
	postcode: plainText()
		.trim()
		.max(12, 'Use at most 12 characters.')
		.regex(/^[A-Za-z0-9 -]*$/, 'Letters, digits, spaces and dashes only.')
		.default('')
});

export const createPlanSchema = planMetaSchema.extend({ input: z.unknown() });

export const updatePlanSchema = planMetaSchema.partial().extend({
	revision: z.int().min(1, 'Send the revision you edited.'),
	input: z.unknown().optional()
});

export const renamePlanSchema = z.object({ name: planMetaSchema.shape.name });

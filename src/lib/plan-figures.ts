import { z } from 'zod';

/**
 * The few plan numbers the handoff shows, read from a stored plan result. Only the fields the
 * engine documents as always present are read (area, net and order volume, bags, joint spacing,
 * cautions); anything missing or shaped differently is left out rather than guessed.
 */
const num = z.number().finite();
const volume = z.object({ cubicFeet: num, cubicYards: num, cubicMeters: num });
const resultShape = z.object({
	area: z.object({ squareFeet: num, squareMeters: num }).optional().catch(undefined),
	volume: z.object({ net: volume.optional().catch(undefined), order: volume.optional().catch(undefined) }).optional().catch(undefined),
	bags: z.array(z.object({ size: num, unit: z.string(), count: num })).optional().catch(undefined),
	joints: z.object({ maxSpacing: num }).optional().catch(undefined),
	cautions: z.array(z.object({ id: z.string(), title: z.string(), source: z.string() })).optional().catch(undefined)
});
const inputShape = z.object({ units: z.enum(['imperial', 'metric']).catch('imperial') }).catch({ units: 'imperial' });

export type PlanFigures = z.output<typeof resultShape> & { units: 'imperial' | 'metric' };

export function planFigures(input: unknown, result: unknown): PlanFigures {
	const r = resultShape.safeParse(result ?? {});
	return { ...(r.success ? r.data : {}), units: inputShape.parse(input ?? {}).units };
}

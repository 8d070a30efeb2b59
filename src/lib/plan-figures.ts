import { z } from 'zod';

/**
 * The few plan numbers the handoff shows, read from a stored plan result as docs/api.md documents
 * them (area, net and order volume, bags, joint spacing, the DIY total, cautions). The lead keeps a
 * frozen copy of whatever the engine wrote then, so anything missing or shaped differently is left
 * out rather than guessed.
 */
const num = z.number().finite();
const volume = z.object({ cubicFeet: num, cubicYards: num, cubicMeters: num });
const resultShape = z.object({
	area: z.object({ squareFeet: num, squareMeters: num }).optional().catch(undefined),
	volume: z.object({ net: volume.optional().catch(undefined), order: volume.optional().catch(undefined) }).optional().catch(undefined),
	bags: z.array(z.object({ size: num, unit: z.string(), count: num })).optional().catch(undefined),
	joints: z.object({ maxSpacing: z.object({ feet: num, meters: num }) }).optional().catch(undefined),
	materials: z.object({ diyTotal: z.object({ amount: num, complete: z.boolean() }) }).optional().catch(undefined),
	cautions: z.array(z.object({ id: z.string(), title: z.string(), source: z.string() })).optional().catch(undefined)
});
const inputShape = z.object({ units: z.enum(['imperial', 'metric']).catch('imperial') }).catch({ units: 'imperial' });

export type PlanFigures = z.output<typeof resultShape> & { units: 'imperial' | 'metric' };

export function planFigures(input: unknown, result: unknown): PlanFigures {
	const r = resultShape.safeParse(result ?? {});
	return { ...(r.success ? r.data : {}), units: inputShape.parse(input ?? {}).units };
}

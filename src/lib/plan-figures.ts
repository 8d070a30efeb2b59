import { z } from 'zod';
import type { PlanResult } from '$lib/plan';

/**
 * The few plan numbers the handoff shows, read from a stored plan result as docs/api.md documents
 * them (area, net and order volume, bags, joint spacing, the DIY total, cautions). The lead keeps a
 * frozen copy of whatever the engine wrote then, so anything missing or shaped differently is left
 * out rather than guessed.
 */
const num = z.number().finite();
const volume = z.object({ cubicFeet: num, cubicYards: num, cubicMeters: num });
const resultShape = z.object({
	/** ISO 4217; a result without one was priced in US dollars. */
	currency: z.string().regex(/^[A-Z]{3}$/).optional().catch(undefined),
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

/** Every top-level part of the engine's result, as src/lib/plan/index.ts defines PlanResult. */
const RESULT_PARTS = ['units', 'area', 'geometry', 'volume', 'forms', 'elevations', 'bags', 'readyMix', 'cost', 'mixing', 'joints', 'strength', 'milestones', 'schedule', 'weather', 'materials', 'cautions'] as const;

/**
 * The frozen result as a whole PlanResult when it has every part, so the planner's views (outline,
 * 3D, stake marks, day plan) can draw it; null for anything older or partial, which then shows
 * only the figures above.
 */
export function fullResult(result: unknown): PlanResult | null {
	return hasEveryPart(result) ? result : null;
}

function hasEveryPart(result: unknown): result is PlanResult {
	if (!result || typeof result !== 'object') return false;
	const r = result as Record<string, unknown>;
	return RESULT_PARTS.every((k) => r[k] !== undefined && r[k] !== null);
}

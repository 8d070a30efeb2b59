// The product's scope, apart from the schema so that code which only needs the numbers (the
// wizard's outline editor) does not load zod and the whole schema with them.

/**
 * The product's scope: a homeowner's slab, not a parking lot. Each limit keeps one output (and its
 * computation) small; the engine's outputs grow at most linearly with corners, stakes and sections.
 * Documented in docs/api.md; each refusal names its limit.
 */
export const LIMITS = {
	/** Pour sections (each its own pour day at least). */
	sections: 12,
	/** Corners of one section's outline. */
	verticesPerSection: 100,
	/** Corners of all outlines together. */
	vertices: 300,
	/** Slab area of all sections, ft² / m². */
	area: { imperial: 3000, metric: 280 },
	/** Outline length of all sections (forms, bulkheads, stake marks), ft / m. */
	perimeter: { imperial: 1000, metric: 300 },
	/** Stakes: outline length ÷ stake spacing. */
	stakes: 600,
	/** Bags of each offered size for the whole order. */
	bags: 10000
} as const;

/**
 * Largest answer (rounded JSON, bytes) a plan inside LIMITS may get: it grows linearly with stakes,
 * corners and sections. At the limits this is 20 + 180 + 240 + 96 kB, under 1 MB.
 */
export const answerBytesBound = (stakes: number, corners: number, sections: number) => 20_000 + 300 * stakes + 800 * corners + 8_000 * sections;

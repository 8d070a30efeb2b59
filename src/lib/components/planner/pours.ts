import type { PlanResult } from '$lib/plan';
import { list } from '$lib/plan/format';

/** What the wizard's results panel and its phone bar show. pending: the engine is still loading; failed: it could not be fetched. */
export type ResultsState = {
	result: PlanResult | null;
	errorCount?: number;
	/** The steps whose fields are marked, by title: the step on screen may not be one of them. */
	errorSteps?: readonly string[];
	pending?: boolean;
	failed?: boolean;
};

/** What the results say while fields are marked, and in which steps: "Fix the 2 marked fields in the Site and Crew steps to see the numbers." */
export function fixMessage(errorCount: number, errorSteps: readonly string[] = []): string {
	const what = errorCount === 1 ? 'the marked field' : `the ${errorCount} marked fields`;
	const where = errorSteps.length ? ` in the ${list(errorSteps, 'and')} step${errorSteps.length > 1 ? 's' : ''}` : '';
	return `Fix ${what}${where} to see the numbers.`;
}

/** The bag size the mixing plan counts in (the first offered while none is marked). */
export const plannedBag = (result: PlanResult | null) => result?.bags.find((b) => b.planned) ?? result?.bags[0];

/**
 * Mixing and placing as the results show it: once the slab is poured in several pours, the figure
 * that matters on the day is the longest single pour, and whether each pour fits its working time.
 */
export function pourTimes(mixing: PlanResult['mixing']) {
	// A pour the engine split into parts: each part takes its share of the section's time (time grows with bags).
	const perPour = mixing.sections.flatMap((s) =>
		s.pours.length > 1 && s.bags > 0 ? s.pours.map((p) => (s.totalMinutes * p.bags) / s.bags) : [s.totalMinutes]
	);
	const pours = perPour.length;
	const longest = Math.max(0, ...perPour);
	const total = perPour.reduce((a, b) => a + b, 0);
	const late = mixing.sections.filter((s) => !s.fits).length;
	const badge =
		pours === 1
			? mixing.fits
				? 'One pour fits'
				: 'Too much for one pour'
			: mixing.fits
				? `${pours} pours fit`
				: late === 1
					? 'A pour runs too long'
					: `${late} pours run too long`;
	return { pours, longest, total, badge };
}

export const hoursText = (min: number) => (min >= 60 ? `${Math.floor(min / 60)} h ${Math.round(min % 60)} min` : `${Math.round(min)} min`);

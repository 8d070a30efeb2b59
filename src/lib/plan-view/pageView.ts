// What the plan page sends the browser. The page itself shows the build card, summary, outline,
// cautions, mixing plan, strength, materials and the comparison with the pour log, so it gets only
// the fields those read, with the build card's and the summary's rows worked out on the server
// (they read the forms, elevations, volumes and bags, which the page does not show otherwise). The
// long parts (layout sheet, stake marks, day plan) and the 3D view come on demand from the sheets
// page (`planSheets`), which a browser without JavaScript opens as a page of its own.

import type { PlanResult, StrengthDay } from '$lib/plan';
import { buildCardItems } from './buildCard';
import { summaryItems, type StrengthPoint, type SummaryItem } from './rows';

export type PlanPageView = Pick<PlanResult, 'units' | 'currency' | 'area' | 'geometry' | 'joints' | 'mixing' | 'milestones' | 'materials' | 'cautions'> & {
	strength: StrengthPoint[];
	/** Null for a result frozen before the engine carried its slab block. */
	buildCard: SummaryItem[] | null;
	summary: SummaryItem[];
	/** For the on-demand parts' short descriptions. */
	counts: { stakes: number; days: number };
	/** Whether the 3D view has a surface to draw (the slab block, as for the build card). */
	has3d: boolean;
};

/** The day, date and percent of each strength day: all the chart, its table and the milestones read. */
export const strengthPoints = (days: readonly StrengthDay[]): StrengthPoint[] =>
	days.map((d) => (d.date === undefined ? { day: d.day, percent: d.percent } : { day: d.day, date: d.date, percent: d.percent }));

export function planPageView(r: PlanResult): PlanPageView {
	return {
		units: r.units,
		currency: r.currency,
		area: r.area,
		geometry: r.geometry,
		joints: r.joints,
		mixing: r.mixing,
		milestones: r.milestones,
		materials: r.materials,
		cautions: r.cautions,
		strength: strengthPoints(r.strength),
		buildCard: r.slab ? buildCardItems(r) : null,
		summary: summaryItems(r),
		counts: { stakes: r.elevations.stakes.length, days: r.schedule.days.length },
		has3d: !!r.slab
	};
}

/** The long parts, on demand: what the layout sheet, stake marks, day plan and 3D view read. */
export type PlanSheets = Pick<PlanResult, 'units' | 'geometry' | 'joints' | 'forms' | 'elevations' | 'schedule' | 'slab' | 'volume'>;

export function planSheets(r: PlanResult): PlanSheets {
	return {
		units: r.units,
		geometry: r.geometry,
		joints: r.joints,
		forms: r.forms,
		elevations: r.elevations,
		schedule: r.schedule,
		slab: r.slab,
		volume: r.volume
	};
}

// The wizard's steps in order, and which input fields (top-level names in the plan schema) each
// step holds: the wizard marks a step with errors by them, and each step lists its errors by them.

import type { ParsedPlan } from '$lib/plan';

type Field = keyof ParsedPlan;

export const STEPS = [
	{
		id: 'site',
		title: 'Site',
		intro: 'Where the slab goes and what the weather will be on pour day.',
		fields: ['reference', 'gapToHouse', 'conditions', 'units', 'name', 'exposure']
	},
	{
		id: 'outline',
		title: 'Outline',
		intro: 'The shape of the slab, the house walls, and how it splits into pours.',
		fields: ['sections', 'houseEdge', 'otherHouseEdges']
	},
	{ id: 'pitch', title: 'Pitch', intro: 'How the top falls so water runs off, away from the house.', fields: ['slope'] },
	{
		id: 'build-up',
		title: 'Build-up',
		intro: 'Thickness, form boards, base and edges.',
		fields: ['thickness', 'forms', 'houseEdgeFormed', 'thickenedEdge', 'base', 'fill', 'reinforcement', 'reinforcing', 'wastePercent', 'loads', 'mix']
	},
	{
		id: 'crew',
		title: 'Crew',
		intro: 'Who mixes and places, how fast, curing, and what things cost.',
		fields: ['crew', 'bags', 'readyMix', 'prices', 'currency', 'joints', 'curing', 'milestones']
	},
	{ id: 'review', title: 'Review', intro: 'The plan in short, and what to watch out for.', fields: [] }
] as const satisfies readonly { id: string; title: string; intro: string; fields: readonly Field[] }[];

export type StepId = (typeof STEPS)[number]['id'];

/** The input fields a step holds. */
export const stepFields = (id: StepId): readonly Field[] => STEPS.find((s) => s.id === id)!.fields;

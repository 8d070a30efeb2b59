import { parsePlanInput, type PlanResult } from '$lib/plan';
import { formatArea, formatFall, formatLength, formatSmall, formatVolume } from './text';

export type SpecRow = { label: string; value: string };

const reinforcementLabels: Record<string, string> = { none: 'None', fiber: 'Fibres in the mix', mesh: 'Welded wire mesh', rebar: 'Reinforcing bars' };
const jointMethod = { tool: 'tooled while plastic', saw: 'saw-cut' } as const;

/**
 * The numbers a contractor prices a slab from, in the trade's terms, read from the plan as sent:
 * outline, area, thickness, base, edges, reinforcement, fall, joints. Missing parts are left out
 * rather than guessed (an older lead may hold a partial result).
 */
export function specRows(input: unknown, result: PlanResult | null): SpecRow[] {
	if (!result) return [];
	const u = result.units;
	const parsed = parsePlanInput(input);
	const plan = parsed.ok ? parsed.plan : null;
	const rows: SpecRow[] = [];
	for (const s of result.geometry.sections) {
		const edges = s.edges.map((e) => `${formatLength(e.length, u)}${e.kind === 'house' ? ' (house)' : e.kind === 'coldJoint' ? ' (cold joint)' : ''}`);
		rows.push({ label: result.geometry.sections.length > 1 ? `Outline, ${s.name}` : 'Outline', value: `${s.edges.length} sides: ${edges.join(', ')}` });
	}
	rows.push({ label: 'Area', value: formatArea(result.area, u) });
	rows.push({ label: 'Perimeter', value: formatLength(result.area.perimeter, u) });
	if (plan) rows.push({ label: 'Thickness', value: u === 'imperial' ? `${plan.thickness} in` : `${plan.thickness} mm` });
	rows.push({ label: 'Concrete to order', value: formatVolume(result.volume.order, u) });
	rows.push({ label: 'Base', value: `${formatSmall(result.volume.base.depth, u)} compacted gravel, ${formatVolume(result.volume.base.compacted, u)}` });
	const thick = result.geometry.sections.flatMap((s) => s.edges.filter((e) => e.thickened));
	rows.push({
		label: 'Thickened edges',
		value: thick.length ? `${thick.length} ${thick.length === 1 ? 'edge' : 'edges'}, ${formatVolume(result.volume.thickenedEdges, u)} extra` : 'None'
	});
	if (plan) rows.push({ label: 'Reinforcement', value: reinforcementLabels[plan.reinforcement] ?? plan.reinforcement });
	const fall = result.elevations.fall;
	const fromHouse = result.geometry.houseEdges.some((h) => h.section === result.geometry.highEdge.section && h.edge === result.geometry.highEdge.edge);
	rows.push({
		label: 'Fall',
		value: `${formatFall(fall, u)} away from ${fromHouse ? 'the house' : `side ${result.geometry.highEdge.edge + 1}`}; ${formatSmall(result.elevations.totalDrop, u)} high to low`
	});
	const j = result.joints;
	rows.push({
		label: 'Control joints',
		value: `${formatLength(j.totalLength, u)} in all, ${jointMethod[j.method]}, ${formatSmall(j.depth, u)} deep, at most ${formatLength(j.maxSpacing, u)} apart`
	});
	if (result.geometry.coldJoints.length)
		rows.push({
			label: 'Pours',
			value: `${result.geometry.sections.length} pours, ${result.geometry.coldJoints.length} cold ${result.geometry.coldJoints.length === 1 ? 'joint' : 'joints'}`
		});
	return rows;
}

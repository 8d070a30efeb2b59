// The build card: the handful of numbers someone digging and forming the slab looks up most, read
// from the engine's slab block. The plan page and the PDF's first page both render these rows.

import type { PlanResult } from '$lib/plan';
import { formatInches, formatLength, formatSmall, formatVolume } from '$lib/plan/format';
import { sheetEdgeName } from '$lib/plan/layout-sheet';
import type { SummaryItem } from './format';

export type BuildCardPlan = Pick<PlanResult, 'units' | 'slab' | 'volume' | 'forms' | 'elevations' | 'joints' | 'bags' | 'readyMix' | 'mixing' | 'geometry'>;

const trim = (x: number, digits: number) => String(Math.round(x * 10 ** digits) / 10 ** digits);

/** Fall per foot as a tape fraction when it is one (¼ in reads better than 0.25), or per metre in mm. */
function fallText(rate: PlanResult['elevations']['fall'], u: PlanResult['units']): string {
	if (u === 'metric') return `${trim(rate.millimetersPerMeter, 1)} mm per m (${trim(rate.percent, 2)} %)`;
	const eighths = rate.inchesPerFoot * 8;
	const inch = Math.abs(eighths - Math.round(eighths)) < 1e-6 ? formatInches(rate.inchesPerFoot) : `${trim(rate.inchesPerFoot, 3)} in`;
	return `${inch} per ft (${trim(rate.percent, 2)} %)`;
}

export function buildCardItems(p: BuildCardPlan): SummaryItem[] {
	const u = p.units;
	const s = p.slab;
	const S = (x: { inches: number; millimeters: number }) => formatSmall(x, u);
	const planned = p.bags.find((b) => b.planned) ?? p.bags[0];
	const items: SummaryItem[] = [
		{ label: 'Slab thickness', value: S(s.thickness) },
		{ label: 'Dig depth', value: S(s.digDepth), note: `below the finished top: ${S(s.thickness)} of slab on ${S(s.base)} of base` }
	];
	if (s.thickenedDigDepth && s.trench)
		items.push({
			label: 'Dig at thickened edges',
			value: S(s.thickenedDigDepth),
			note: `a trench ${S(s.trench.width)} wide, ${S(s.trench.depth)} below the slab, on firm undisturbed soil with no base under it`
		});
	items.push(
		{
			label: 'Base',
			value: `${S(s.base)} compacted`,
			note: `buy ${formatVolume(p.volume.base.loose, u)} loose (${trim(p.volume.base.bulking, 2)} × the compacted volume)`
		},
		{
			label: 'Form boards',
			value: `${p.forms.lumber === 'custom' ? 'boards' : p.forms.lumber} · ${S(s.board.depth)} deep`,
			note: `top at the finished height, ${S(s.board.aboveDugGrade)} above the dug grade`
		},
		{
			label: 'Fall',
			value: fallText(p.elevations.fall, u),
			note: `total drop ${S(p.elevations.totalDrop)}${p.elevations.crossFall.percent ? `; cross fall ${fallText(p.elevations.crossFall, u)}` : ''}`
		},
		...(p.geometry.houseEdges.length
			? []
			: [
					{
						label: 'High side',
						value: `edge ${sheetEdgeName(p.geometry, p.geometry.highEdge.section, p.geometry.highEdge.edge)}`,
						note: 'the top is highest along this edge and falls away from it (marked on the layout sheet)'
					}
				]),
		{
			label: 'Control joints',
			value: p.joints.totalLength.meters > 0 ? `at most ${formatLength(p.joints.maxSpacing, u)} apart` : 'none needed',
			// A depth for joints that are not cut read as a contradiction ("none needed", "1¼ in deep, sawn").
			note:
				p.joints.totalLength.meters > 0
					? `${S(p.joints.depth)} deep, ${p.joints.method === 'saw' ? 'sawn' : 'tooled'}`
					: `the slab is small enough to need none (the limit is ${formatLength(p.joints.maxSpacing, u)} between joints)`
		},
		p.mixing.readyMixSuggested
			? { label: 'Concrete', value: `ready-mix, ${trim(p.readyMix.order, 2)} ${p.readyMix.unit}`, note: `or ${planned.count} × ${planned.size} ${planned.unit} bags in smaller pours` }
			: { label: 'Concrete', value: `${planned.count} × ${planned.size} ${planned.unit} bags`, note: `or ready-mix, ${trim(p.readyMix.order, 2)} ${p.readyMix.unit}` }
	);
	if (s.houseGap) {
		const formed = p.forms.runs.some((r) => r.kind === 'house' && r.formed);
		items.push({ label: 'Gap to the house', value: S(s.houseGap), note: formed ? 'between the wall and the form board' : 'filled with an isolation strip' });
	}
	return items;
}

// The build card: the handful of numbers someone digging and forming the slab looks up most, read
// from the engine's slab block. The plan page and the PDF's first page both render these rows.

import type { PlanResult } from '$lib/plan';
import { formatBagSize, formatFall, formatLength, formatOrder, formatSmall, formatVolume, num } from './text';
import { sheetEdgeName } from '$lib/plan/layout-sheet';
import type { SummaryItem } from './rows';

export type BuildCardPlan = Pick<PlanResult, 'units' | 'slab' | 'volume' | 'forms' | 'elevations' | 'joints' | 'bags' | 'readyMix' | 'mixing' | 'geometry'>;

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
			note: `buy ${formatVolume(p.volume.base.loose, u)} loose (${num(p.volume.base.bulking, 2)} × the compacted volume)`
		},
		{
			label: 'Form boards',
			value: `${p.forms.lumber === 'custom' ? 'boards' : p.forms.lumber} · ${S(s.board.depth)} deep`,
			note: `top at the finished height, ${S(s.board.aboveDugGrade)} above the dug grade`
		},
		{
			label: 'Fall',
			value: formatFall(p.elevations.fall, u),
			note: `total drop ${S(p.elevations.totalDrop)}${p.elevations.crossFall.percent ? `; cross fall ${formatFall(p.elevations.crossFall, u)}` : ''}`
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
			? { label: 'Concrete', value: `ready-mix, ${formatOrder(p.readyMix)}`, note: `or ${planned.count} × ${formatBagSize(planned)} bags in smaller pours` }
			: { label: 'Concrete', value: `${planned.count} × ${formatBagSize(planned)} bags`, note: `or ready-mix, ${formatOrder(p.readyMix)}` }
	);
	if (s.houseGap) {
		const formed = p.forms.runs.some((r) => r.kind === 'house' && r.formed);
		items.push({ label: 'Gap to the house', value: S(s.houseGap), note: formed ? 'between the wall and the form board' : 'filled with an isolation strip' });
	}
	return items;
}

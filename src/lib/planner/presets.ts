// "Start from a shape": a rectangle or an L, with the house along one side, around the notch
// (an inside house corner) or nowhere (a freestanding pad).
import type { EdgeRef, ParsedPlan } from '$lib/plan';
import { lShape, rectangle, type Pt } from './shapes';

export type HouseSide = 'side' | 'corner' | 'none';
export type Preset = { shape: 'rectangle' | 'l'; length: number; width: number; notchLength: number; notchWidth: number; house: HouseSide };

/** Why the preset form cannot make a shape, naming the field to fix; null when it can. */
export function presetProblem(p: Preset, units: 'imperial' | 'metric'): string | null {
	const u = units === 'imperial' ? 'ft' : 'm';
	const ok = (v: number) => typeof v === 'number' && Number.isFinite(v) && v > 0;
	if (!ok(p.length)) return `Enter the length (A–B), above 0 ${u}.`;
	if (!ok(p.width)) return `Enter the width (B–C side), above 0 ${u}.`;
	if (p.shape === 'rectangle') return null;
	if (!ok(p.notchLength)) return `Enter the notch length (C–D), above 0 ${u}.`;
	if (!ok(p.notchWidth)) return `Enter the notch width (D–E), above 0 ${u}.`;
	if (p.notchLength >= p.length) return `The notch length (C–D) must be less than the length (A–B), ${p.length} ${u}.`;
	if (p.notchWidth >= p.width) return `The notch width (D–E) must be less than the width (B–C side), ${p.width} ${u}.`;
	return null;
}

export function presetOutline(p: Preset): Pt[] {
	return p.shape === 'rectangle' ? rectangle(p.length, p.width) : lShape(p.length, p.width, p.notchLength, p.notchWidth);
}

/** The walls a preset stands against: edge A–B, or both notch edges C–D and D–E of the L. */
export function presetHouse(p: Preset): EdgeRef[] {
	if (p.house === 'none') return [];
	if (p.house === 'corner' && p.shape === 'l')
		return [
			{ section: 0, edge: 2 },
			{ section: 0, edge: 3 }
		];
	return [{ section: 0, edge: 0 }];
}

type Rate = ParsedPlan['slope']['fall'];

/**
 * The cross fall a preset starts with. Around a house corner the high side is the first wall
 * (C–D) and the fall runs away from it; a cross fall of the same rate toward D then also runs the
 * water away from the second wall (D–E), so both walls shed water (IRC R401.3). A total drop is
 * not a rate along the other wall, so that case starts from 2 %.
 */
export function presetCrossFall(p: Preset, fall: Rate): Rate {
	if (p.house !== 'corner' || p.shape !== 'l') return { value: 0, unit: fall.unit === 'totalDrop' ? 'percent' : fall.unit };
	return fall.unit !== 'totalDrop' && fall.value > 0 ? { ...fall } : { value: 2, unit: 'percent' };
}

const close = (a: number, b: number) => Math.abs(a - b) < 1e-9 * Math.max(1, Math.abs(a));
const same = (a: Pt[], b: Pt[]) => a.length === b.length && a.every((p, i) => close(p[0], b[i][0]) && close(p[1], b[i][1]));
/** A size read off the outline without float noise (4.877 − 3.048 = 1.8290000000000002 → 1.829). */
const clean = (v: number) => Math.round(v * 1e6) / 1e6;

/**
 * The preset form as the plan stands: its own sizes when the outline is one of the presets,
 * otherwise what the form held before (or a patio of typical size in the plan's units).
 */
export function detectPreset(input: ParsedPlan, previous?: Preset): Preset {
	const houses = input.houseEdge ? [input.houseEdge, ...input.otherHouseEdges] : [];
	const o = input.sections.length === 1 ? (input.sections[0].outline as Pt[]) : [];
	const onlyEdges = (...edges: number[]) => houses.length === edges.length && houses.every((h) => h.section === 0 && edges.includes(h.edge));
	const house: HouseSide = houses.length === 0 ? 'none' : onlyEdges(2, 3) ? 'corner' : 'side';
	if (o.length === 4 && same(o, rectangle(o[2][0], o[2][1])))
		return { ...(previous ?? typical(input.units)), shape: 'rectangle', length: o[2][0], width: o[2][1], house: house === 'corner' ? 'side' : house };
	if (o.length === 6) {
		const [L, W] = [o[1][0], o[5][1]];
		const nl = clean(L - o[3][0]);
		const nw = clean(W - o[2][1]);
		if (nl > 0 && nw > 0 && same(o, lShape(L, W, nl, nw))) return { shape: 'l', length: L, width: W, notchLength: nl, notchWidth: nw, house };
	}
	return previous ?? { ...typical(input.units), house };
}

function typical(units: ParsedPlan['units']): Preset {
	return units === 'imperial'
		? { shape: 'rectangle', length: 16, width: 12, notchLength: 6, notchWidth: 5, house: 'side' }
		: { shape: 'rectangle', length: 4.8, width: 3.6, notchLength: 1.8, notchWidth: 1.5, house: 'side' };
}

// The slab's build-up in one block: what is dug, what is placed, and the finished surface. Every
// view (build card, layout sheet, 3D scene, PDF) reads these instead of working them out again.

import type { Plane } from './elevations';
import type { Model } from './model';
import type { Pt } from './polygon';
import { mToPlan, small } from './units';
import type { Small } from './units';

export interface SlabResult {
	thickness: Small;
	/** Compacted base under the slab. */
	base: Small;
	/** Below the finished top: slab plus base, the depth to dig over the field of the slab. */
	digDepth: Small;
	/**
	 * Below the finished top at a thickened edge, or null without one: slab and the trench's extra
	 * depth, with no base under it (volume.ts leaves the trench off the base: the edge bears on firm
	 * undisturbed soil, common practice, no published source).
	 */
	thickenedDigDepth: Small | null;
	/** The thickened-edge trench under the slab, or null without one. */
	trench: { width: Small; depth: Small } | null;
	/** Space between slab and house wall, or null for a freestanding slab. */
	houseGap: Small | null;
	/** Board depth and how far its top (set at finished height) stands above the dug grade. */
	board: { depth: Small; aboveDugGrade: Small };
	/**
	 * The finished surface: height(p) = atHeight − down · (p − at), with p and `at` in the plan's
	 * length unit; `down` is the drop per unit run (a ratio), so the formula holds in any units.
	 */
	surface: { at: Pt; atHeight: Small; down: Pt };
}

export function computeSlab(m: Model, plane: Plane, thickened: boolean[][]): SlabResult {
	const dig = m.thickness + m.base.depth;
	const thick = thickened.some((s) => s.includes(true));
	const edgeDig = m.thickness + m.thickened.extraDepth;
	const { origin, t, n } = plane.frame;
	// drop(p) = fall·w + cross·u − minDrop with u = t·(p − o), w = n·(p − o): the gradient is fall·n + cross·t.
	const down: Pt = [plane.fall * n[0] + plane.cross * t[0], plane.fall * n[1] + plane.cross * t[1]];
	return {
		thickness: small(m.thickness),
		base: small(m.base.depth),
		digDepth: small(dig),
		thickenedDigDepth: thick ? small(edgeDig) : null,
		trench: thick ? { width: small(m.thickened.width), depth: small(m.thickened.extraDepth) } : null,
		houseGap: m.hasHouse ? small(m.gapToHouse) : null,
		board: { depth: small(m.forms.depth), aboveDugGrade: small(dig) },
		surface: {
			at: [mToPlan(origin[0], m.units), mToPlan(origin[1], m.units)],
			atHeight: small(plane.high + plane.minDrop),
			down
		}
	};
}

// Triangle soups for the 3D preview: the scene model's prisms, ribbons and arrows as flat
// (x, y, z per vertex) arrays that SlabScene hands to three's BufferGeometry.

import { ShapeUtils, Vector2 } from 'three';
import { sub, unit } from '$lib/plan/polygon';
import { lerp3, type P2, type P3, type Prism, type Segment } from './sceneModel';

/** Triangles of a simple polygon as index triples, by three's own triangulation (earcut). */
export const triangulate = (poly: readonly P2[]): number[][] =>
	ShapeUtils.triangulateShape(
		poly.map(([x, y]) => new Vector2(x, y)),
		[]
	);

/** Closed triangle soup of a prism (x, y, z per vertex), wound counter-clockwise seen from outside. */
export function prismTriangles(p: Prism): number[] {
	const out: number[] = [];
	const tri = (...corners: [number, number[]][]) => corners.forEach(([i, z]) => out.push(p.footprint[i][0], p.footprint[i][1], z[i]));
	const { top: t, bottom: b } = p;
	for (const [i, j, k] of triangulate(p.footprint)) {
		tri([i, t], [j, t], [k, t]);
		tri([i, b], [k, b], [j, b]);
	}
	const n = p.footprint.length;
	for (let i = 0; i < n; i++) {
		const j = (i + 1) % n;
		tri([i, b], [j, b], [j, t]);
		tri([i, b], [j, t], [i, t]);
	}
	return out;
}

/** A flat strip of the given width along a segment, facing up: how joint lines get drawn. */
export function ribbonTriangles(s: Segment, width: number): number[] {
	const d = unit(sub([s.to[0], s.to[1]], [s.from[0], s.from[1]]));
	const n: P2 = [(-d[1] * width) / 2, (d[0] * width) / 2];
	const q = (p: P3, k: number) => [p[0] + n[0] * k, p[1] + n[1] * k, p[2]];
	const [a, b, c, e] = [q(s.from, -1), q(s.to, -1), q(s.to, 1), q(s.from, 1)];
	return [...a, ...b, ...c, ...a, ...c, ...e];
}

/** Dashes of `on` metres with `off` gaps along a segment: the drawing convention for hidden edges. */
export function dashes(s: Segment, on = 0.12, off = 0.08): Segment[] {
	const L = Math.hypot(s.to[0] - s.from[0], s.to[1] - s.from[1]);
	const out: Segment[] = [];
	for (let d = 0; d < L; d += on + off) out.push({ from: lerp3(s.from, s.to, d / L), to: lerp3(s.from, s.to, Math.min(1, (d + on) / L)) });
	return out;
}

/** A flat arrow (shaft and head) lying along a segment, facing up. */
export function arrowTriangles(s: Segment, width: number): number[] {
	const L = Math.hypot(s.to[0] - s.from[0], s.to[1] - s.from[1]);
	const head = Math.min(L / 3, width * 3);
	const f = (L - head) / L;
	const neck = lerp3(s.from, s.to, f);
	const d = unit([s.to[0] - s.from[0], s.to[1] - s.from[1]]);
	const n: P2 = [-d[1] * width * 1.5, d[0] * width * 1.5];
	return [
		...ribbonTriangles({ from: s.from, to: neck }, width),
		neck[0] - n[0],
		neck[1] - n[1],
		neck[2],
		s.to[0],
		s.to[1],
		s.to[2],
		neck[0] + n[0],
		neck[1] + n[1],
		neck[2]
	];
}

/** Great-circle distances between postal-code centroids; good to a fraction of a percent here. */
import { KM_PER_MILE } from '$lib/plan/units';

export type LatLon = { lat: number; lon: number };

export const EARTH_RADIUS_KM = 6371.0088; // IUGG mean radius
export { KM_PER_MILE };

const rad = (deg: number) => (deg * Math.PI) / 180;

export function haversineKm(a: LatLon, b: LatLon): number {
	const h = Math.sin(rad(b.lat - a.lat) / 2) ** 2 + Math.cos(rad(a.lat)) * Math.cos(rad(b.lat)) * Math.sin(rad(b.lon - a.lon) / 2) ** 2;
	return 2 * EARTH_RADIUS_KM * Math.asin(Math.min(1, Math.sqrt(h)));
}

export const toKm = (distance: number, unit: 'mi' | 'km') => (unit === 'mi' ? distance * KM_PER_MILE : distance);

/** "12 mi" or "19 km", in the viewer's unit system. */
export function formatDistance(km: number, unit: 'mi' | 'km'): string {
	const v = unit === 'mi' ? km / KM_PER_MILE : km;
	return `${v < 10 ? v.toFixed(1) : Math.round(v)} ${unit}`;
}

import { and, asc, eq, isNotNull, sql } from 'drizzle-orm';
import zipcodes from 'zipcodes';
import { EARTH_RADIUS_KM, KM_PER_MILE, type LatLon } from '$lib/geo';
import { MAX_SERVICE_RADIUS, type ServiceKind } from '$lib/schemas/contractor';
import { db } from '$lib/server/db';
import { contractor } from '$lib/server/db/schema';
import { accountDisabledSql } from './lead-shared';
import { billingAllowsDelivery } from '$lib/server/billing/accounts'; // billing

export type Place = LatLon & { town: string };

/** A US ZIP code's centroid and town, from the zipcodes package; null when unknown. */
export function placeOf(postcode: string | null | undefined): Place | null {
	const z = postcode ? zipcodes.lookup(postcode.trim().slice(0, 5)) : undefined;
	return z ? { lat: z.latitude, lon: z.longitude, town: `${z.city}, ${z.state}` } : null;
}

/** Haversine in SQL, so the database filters and sorts by distance (same formula as $lib/geo). */
const distanceKm = (p: LatLon) => sql<number>`(2 * ${EARTH_RADIUS_KM}::float8 * asin(least(1, sqrt(
	power(sin(radians(${p.lat}::float8 - ${contractor.serviceLat}) / 2), 2)
	+ cos(radians(${contractor.serviceLat})) * cos(radians(${p.lat}::float8))
	* power(sin(radians(${p.lon}::float8 - ${contractor.serviceLon}) / 2), 2)))))`;
/**
 * No service area reaches farther than this many degrees of latitude: a great-circle distance is at
 * least the north–south one, and the largest radius allowed is MAX_SERVICE_RADIUS miles. The band
 * lets the database use the approved contractors' latitude index instead of reading every row.
 */
const LAT_BAND_DEG = (MAX_SERVICE_RADIUS * KM_PER_MILE) / ((EARTH_RADIUS_KM * Math.PI) / 180);
const radiusKm = sql<number>`(${contractor.serviceRadius} * case when ${contractor.serviceRadiusUnit} = 'mi' then ${KM_PER_MILE}::float8 else 1 end)`;

/**
 * Approved contractors whose service area covers `place` and who do the chosen part of the job
 * (or the whole job), nearest first, with what a homeowner may see of them.
 */
export async function matchContractors(place: LatLon, scope: ServiceKind, executor: Pick<typeof db, 'select'> = db) {
	const d = distanceKm(place);
	const day = new Date().toISOString().slice(0, 10);
	return executor
		.select({
			id: contractor.userId,
			businessName: contractor.businessName,
			description: contractor.description,
			yearsInTrade: contractor.yearsInTrade,
			services: contractor.services,
			distanceKm: d
		})
		.from(contractor)
		.where(
			and(
				eq(contractor.status, 'approved'),
				// An account an admin disabled gets no leads.
				sql`not ${accountDisabledSql(contractor.userId)}`,
				// An expired licence or insurance stops leads at once, even before the sweep lapses the account.
				sql`coalesce(${contractor.licenceExpiresOn}, 'infinity'::date) >= ${day}::date`,
				sql`coalesce(${contractor.insuranceExpiresOn}, 'infinity'::date) >= ${day}::date`,
				// billing: an account whose payment is overdue gets no new leads until it is paid.
				billingAllowsDelivery(contractor.userId),
				isNotNull(contractor.serviceLat),
				sql`${contractor.serviceLat} between ${place.lat - LAT_BAND_DEG}::float8 and ${place.lat + LAT_BAND_DEG}::float8`,
				sql`${d} <= ${radiusKm}`,
				sql`(${scope}::service_kind = any(${contractor.services}) or 'whole_job' = any(${contractor.services}))`
			)
		)
		.orderBy(asc(d), asc(contractor.businessName));
}
export type MatchedContractor = Awaited<ReturnType<typeof matchContractors>>[number];

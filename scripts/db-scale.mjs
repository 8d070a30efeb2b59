// npm run db:scale: the main list queries against a database at scale, with EXPLAIN ANALYZE.
//
//   npm run db:scale              fill stakeline_scale once (10,000 contractors, 100,000 plans,
//                                 100,000 leads), then time each query 20 times and show its plan
//   npm run db:scale -- --fresh   drop and fill it again
//
// A separate database in the project's cluster (PGDATABASE_SCALE, default stakeline_scale); the
// app's own and the test database are not touched. The queries are the SQL the app sends (the
// functions named beside each), with the parameters of one busy user.
import { parseArgs } from 'node:util';
import postgres from 'postgres';
import { settings } from './lib/settings.mjs';
import { log } from './lib/run.mjs';
import { ensurePostgres } from './lib/pg.mjs';
import { ensureDependencies, migrate } from './lib/steps.mjs';

const { values: opt } = parseArgs({ options: { fresh: { type: 'boolean', default: false }, runs: { type: 'string', default: '20' } } });
process.env.PGDATABASE = process.env.PGDATABASE_SCALE ?? 'stakeline_scale';
const s = settings('dev');
ensureDependencies();
ensurePostgres(s, { freshDatabase: opt.fresh });
migrate(s.env);

const sql = postgres(s.env.DATABASE_URL, { onnotice: () => {}, max: 1 });
const N = { contractors: 10_000, homeowners: 20_000, plans: 100_000, leads: 100_000 };

const [{ n }] = await sql`select count(*)::int as n from contractor`;
if (n < N.contractors) {
	log(`Filling ${process.env.PGDATABASE} (a minute or two)…`);
	const t0 = Date.now();
	await sql.begin(async (tx) => {
		// Contractors spread over the contiguous US, 10–60 mi service radius, nine in ten approved.
		await tx`insert into "user" (email, name, role, password_hash, email_verified_at)
			select 'pro' || i || '@scale.example', 'Contractor ' || i, 'contractor', 'x', now() from generate_series(1, ${N.contractors}) i`;
		await tx`insert into contractor (user_id, business_name, services, service_lat, service_lon, service_radius, service_radius_unit, status, licence_expires_on, insurance_expires_on)
			select u.id, 'Firm ' || u.name,
				case when random() < 0.5 then '{whole_job}'::service_kind[] else '{pour_finish}'::service_kind[] end,
				25 + random() * 24, -124 + random() * 57, 10 + (random() * 50)::int, 'mi',
				case when random() < 0.9 then 'approved'::contractor_status else 'awaiting_review'::contractor_status end,
				current_date + 200, current_date + 200
			from "user" u where u.email like 'pro%@scale.example'`;
		await tx`insert into "user" (email, name, role, password_hash, email_verified_at)
			select 'home' || i || '@scale.example', 'Homeowner ' || i, 'homeowner', 'x', now() from generate_series(1, ${N.homeowners}) i`;
		// Five plans each. The result holds only what the plans list reads (a real one is 30–90 kB).
		await tx`insert into plan (owner_id, name, postcode, input, result, updated_at)
			select u.id, 'Plan ' || g, '60601', '{"units":"imperial"}'::jsonb,
				jsonb_build_object('units', 'imperial', 'area', jsonb_build_object('squareFeet', 100 + g % 400, 'squareMeters', 10 + g % 40), 'volume', jsonb_build_object('order', jsonb_build_object('cubicYards', 2, 'cubicMeters', 1.5))),
				now() - (g || ' minutes')::interval
			from "user" u cross join generate_series(1, 5) g where u.email like 'home%@scale.example'`;
		// One lead per plan, to a contractor picked by the plan's row number.
		await tx`with p as (select id, owner_id, row_number() over () as r from plan where name like 'Plan %'),
				c as (select user_id, row_number() over () as r from contractor where business_name like 'Firm %')
			insert into lead (plan_id, homeowner_id, contractor_id, scope, timeframe, plan_revision, latest_revision, snapshot, town, distance_km, respond_by, sent_at)
			select p.id, p.owner_id, c.user_id, 'whole_job', 'within_month', 1, 1, '{"name":"Plan","postcode":"60601"}'::jsonb, 'Chicago, IL', 12.5, current_date + 7, now() - (p.r || ' seconds')::interval
			from p join c on c.r = 1 + (p.r % ${N.contractors}) limit ${N.leads}`;
		await tx`insert into bid (lead_id, plan_id, contractor_id, total_cents, earliest_start, duration_days, valid_until)
			select l.id, l.plan_id, l.contractor_id, 250000, current_date + 14, 2, current_date + 30 from lead l where random() < 0.3`;
		await tx`insert into lead_message (lead_id, sender_id, body)
			select l.id, l.contractor_id, 'When can we visit the site?' from lead l where random() < 0.3`;
	});
	await sql`analyze`;
	log(`Filled in ${((Date.now() - t0) / 1000).toFixed(0)} s`);
}

// One busy user of each kind, and a place in the middle of the contractors.
const [home] = await sql`select owner_id as id from plan group by owner_id order by count(*) desc, owner_id limit 1`;
const [pro] = await sql`select contractor_id as id from lead group by contractor_id order by count(*) desc limit 1`;
const [aPlan] = await sql`select plan_id as id from lead where homeowner_id = ${home.id} limit 1`;
const place = { lat: 41.88, lon: -87.63 };

const dist = (lat, lon) => `(2 * 6371.0088 * asin(least(1, sqrt(power(sin(radians(${lat}::float8 - c.service_lat) / 2), 2)
	+ cos(radians(c.service_lat)) * cos(radians(${lat}::float8)) * power(sin(radians(${lon}::float8 - c.service_lon) / 2), 2)))))`;
/** [SQL with $n placeholders, its parameters]: the statements the named functions send. */
const queries = {
	'contractor match (matching.ts matchContractors)': [
		`select c.user_id, c.business_name, ${dist('$1', '$2')} as d
		from contractor c
		where c.status = 'approved'
			and not exists (select 1 from "user" u where u.id = c.user_id and u.disabled_at is not null)
			and coalesce(c.licence_expires_on, 'infinity'::date) >= current_date and coalesce(c.insurance_expires_on, 'infinity'::date) >= current_date
			and c.service_lat is not null
			and c.service_lat between $1::float8 - $3::float8 and $1::float8 + $3::float8
			and ${dist('$1', '$2')} <= c.service_radius * case when c.service_radius_unit = 'mi' then 1.609344 else 1 end
			and ('whole_job'::service_kind = any(c.services) or 'whole_job' = any(c.services))
		order by d, c.business_name`,
		[place.lat, place.lon, (250 * 1.609344) / ((6371.0088 * Math.PI) / 180)] // matching.ts LAT_BAND_DEG
	],
	'leads inbox (leads.ts contractorLeads, first page)': [
		`select l.id, l.status, l.town, l.distance_km, l.sent_at, l.snapshot->>'name',
			(select count(*)::int from lead_message m where m.lead_id = l.id and m.sender_id <> l.contractor_id and m.created_at > coalesce(l.contractor_read_at, 'epoch'))
		from lead l where l.contractor_id = $1 order by l.sent_at desc limit 25 offset 0`,
		[pro.id]
	],
	'bids page (leads.ts leadsForPlan)': [
		`select l.id, l.status, c.business_name, b.id, b.total_cents,
			case when exists (select 1 from "user" u where u.id = c.user_id and u.disabled_at is not null) then 'suspended' else c.status::text end,
			(select count(*)::int from lead_message m where m.lead_id = l.id and m.sender_id <> l.homeowner_id and m.created_at > coalesce(l.homeowner_read_at, 'epoch'))
		from lead l join contractor c on c.user_id = l.contractor_id left join bid b on b.lead_id = l.id
		where l.plan_id = $1 order by l.distance_km`,
		[aPlan.id]
	],
	'plans list (plans.ts listPlans)': [`select * from plan where owner_id = $1 order by updated_at desc`, [home.id]],
	'unread count, every signed-in page (messages.ts unreadMessageCount)': [
		`select count(*) from lead_message m join lead l on l.id = m.lead_id
		where l.homeowner_id = $1 and m.sender_id <> $1 and m.created_at > l.homeowner_read_at`,
		[home.id]
	]
};

const runs = Number(opt.runs);
const [{ c: contractors }] = await sql`select count(*)::int c from contractor`;
const [{ p: plans }] = await sql`select count(*)::int p from plan`;
const [{ l: leads }] = await sql`select count(*)::int l from lead`;
console.log(
	`\n${contractors.toLocaleString('en-US')} contractors, ${plans.toLocaleString('en-US')} plans, ${leads.toLocaleString('en-US')} leads; ${runs} runs of each query\n`
);
const large = ['contractor', 'plan', 'lead', 'user', 'lead_message', 'bid'];
for (const [name, [text, args]] of Object.entries(queries)) {
	const times = [];
	let plan = [];
	for (let i = 0; i < runs; i++) {
		const rows = await sql.unsafe(`explain (analyze, buffers, format json) ${text}`, args);
		const p = rows[0]['QUERY PLAN'][0];
		times.push(p['Execution Time']);
		if (i === 0) plan = p;
	}
	times.sort((a, b) => a - b);
	const p95 = times[Math.ceil(0.95 * times.length) - 1];
	const seq = [];
	walk(plan.Plan, (node) => {
		if (node['Node Type'] === 'Seq Scan' && large.includes(node['Relation Name'])) seq.push(node['Relation Name']);
	});
	console.log(
		`${name}\n  median ${times[times.length >> 1].toFixed(2)} ms, p95 ${p95.toFixed(2)} ms${seq.length ? `, SEQUENTIAL SCAN on ${seq.join(', ')}` : ', index scans only'}`
	);
	const lines = await sql.unsafe(`explain (analyze, costs off, timing off, summary off) ${text}`, args);
	for (const r of lines) console.log(`    ${r['QUERY PLAN']}`);
	console.log('');
}
await sql.end();

function walk(node, f) {
	f(node);
	for (const c of node.Plans ?? []) walk(c, f);
}

// Loads the demo scenario (fixtures/demo.json, fixtures/demo-plans.json) once; running it again
// changes nothing. TypeScript run with tsx, so demo plans are computed by the real engine.
import fs from 'node:fs';
import path from 'node:path';
import postgres from 'postgres';
import zipcodes from 'zipcodes';
import { computePlan, ENGINE_VERSION } from '../src/lib/plan/index';
import { hashPassword } from '../src/lib/server/password';

type DemoProfile = {
	contactName: string;
	phone: string;
	description: string;
	yearsInTrade: number;
	services: string[];
	licenceNumber: string;
	licenceAuthority: string;
	servicePostcode: string;
	serviceRadius: number;
	serviceRadiusUnit: 'mi' | 'km';
	licenceExpiresInDays: number;
	insuranceExpiresInDays: number;
};
type DemoContractor = { businessName: string; status: string; profile: DemoProfile };
type DemoUser = { email: string; name: string; role: string; plans?: string[]; contractor?: DemoContractor };
type DemoPlan = { id: string; postcode?: string; input: { name: string } };

if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set');
// The demo accounts share a published password, an admin among them: they go only into this
// project's own local cluster (127.0.0.1 on PGPORT), or anywhere else only when SEED_DEMO=1.
const target = new URL(process.env.DATABASE_URL);
const localCluster = ['127.0.0.1', 'localhost', '[::1]'].includes(target.hostname) && target.port === String(process.env.PGPORT ?? 54329);
if (!localCluster && process.env.SEED_DEMO !== '1') {
	console.log(`Demo data not loaded into ${target.host}${target.pathname}: it is not the local cluster (set SEED_DEMO=1 to load it anyway).`);
	process.exit(0);
}
const read = (file: string) => JSON.parse(fs.readFileSync(new URL(`../fixtures/${file}`, import.meta.url), 'utf8'));
const demo: { password: string; users: DemoUser[] } = read('demo.json');
const demoPlans: DemoPlan[] = read('demo-plans.json').plans;
const sql = postgres(process.env.DATABASE_URL, { max: 1, onnotice: () => {} });

const uploadDir = path.resolve(process.env.UPLOAD_DIR || '.data/uploads');

/** A one-page PDF saying what it is: demo documents must never pass for real ones. */
function demoPdf(line: string) {
	const text = line.replace(/[()\\]/g, '');
	const content = `BT /F1 14 Tf 50 780 Td (${text}) Tj ET`;
	const objects = [
		'<< /Type /Catalog /Pages 2 0 R >>',
		'<< /Type /Pages /Kids [3 0 R] /Count 1 >>',
		'<< /Type /Page /Parent 2 0 R /MediaBox [0 0 595 842] /Contents 4 0 R /Resources << /Font << /F1 5 0 R >> >> >>',
		`<< /Length ${content.length} >>\nstream\n${content}\nendstream`,
		'<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica >>'
	];
	let out = '%PDF-1.4\n';
	const offsets = objects.map((body, i) => {
		const at = out.length;
		out += `${i + 1} 0 obj\n${body}\nendobj\n`;
		return at;
	});
	const xref = out.length;
	out += `xref\n0 ${objects.length + 1}\n0000000000 65535 f \n${offsets.map((o) => `${String(o).padStart(10, '0')} 00000 n \n`).join('')}`;
	out += `trailer\n<< /Size ${objects.length + 1} /Root 1 0 R >>\nstartxref\n${xref}\n%%EOF\n`;
	return Buffer.from(out, 'latin1');
}

/** The ISO day `n` days after today: demo expiry dates stay ahead of the day the demo is loaded. */
const day = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);

/** A demo firm's business record with its profile, service-area centroid and two demo documents. */
async function seedContractor(tx: postgres.TransactionSql, id: string, c: DemoContractor) {
	const p = c.profile;
	const at = zipcodes.lookup(p.servicePostcode);
	if (!at) throw new Error(`fixtures/demo.json: unknown ZIP code ${p.servicePostcode}`);
	await tx`
		INSERT INTO contractor (user_id, business_name, status, contact_name, phone, description, years_in_trade, services,
			licence_number, licence_authority, licence_expires_on, insurance_expires_on, service_postcode, service_radius, service_radius_unit, service_lat, service_lon, submitted_at)
		VALUES (${id}, ${c.businessName}, ${c.status}, ${p.contactName}, ${p.phone}, ${p.description}, ${p.yearsInTrade},
			${p.services}::service_kind[], ${p.licenceNumber}, ${p.licenceAuthority}, ${day(p.licenceExpiresInDays)}, ${day(p.insuranceExpiresInDays)}, ${p.servicePostcode}, ${p.serviceRadius},
			${p.serviceRadiusUnit}, ${at.latitude}, ${at.longitude}, now())`;
	for (const kind of ['licence', 'insurance']) {
		const key = `contractors/${id}/${kind}-demo.pdf`;
		const bytes = demoPdf(`DEMO ${kind} for ${c.businessName}, Fernhollow - invented, not a real document`);
		fs.mkdirSync(path.dirname(path.join(uploadDir, key)), { recursive: true });
		fs.writeFileSync(path.join(uploadDir, key), bytes);
		await tx`
			INSERT INTO contractor_document (contractor_id, kind, storage_key, content_type, bytes, original_name)
			VALUES (${id}, ${kind}, ${key}, 'application/pdf', ${bytes.length}, ${`${kind}-demo.pdf`})`;
	}
}

const passwordHash = await hashPassword(demo.password);
let added = 0;
try {
	await sql.begin(async (tx) => {
		for (const u of demo.users) {
			const rows = await tx`
				INSERT INTO "user" (email, name, role, password_hash, email_verified_at)
				VALUES (${u.email.toLowerCase()}, ${u.name}, ${u.role}, ${passwordHash}, now())
				ON CONFLICT (email) DO NOTHING RETURNING id`;
			const [{ id: userId }] = rows.length ? rows : await tx`SELECT id FROM "user" WHERE email = ${u.email.toLowerCase()}`;
			if (rows.length) added++;
			if (rows.length && u.contractor) await seedContractor(tx, userId, u.contractor);
			// The approved demo firms have a running plan and 50 lead credits (granted in the demo, no payment
			// provider record), so the demo and the test journeys that use them open their leads; a contractor
			// who cancels it in the demo keeps that choice on later runs.
			if (u.contractor?.status === 'approved')
				await tx`
					INSERT INTO billing_account (contractor_id, status, period_start, period_end, credits)
					SELECT ${userId}, 'active', now(), now() + interval '30 days', 50
					WHERE EXISTS (SELECT 1 FROM contractor WHERE user_id = ${userId})
					ON CONFLICT (contractor_id) DO NOTHING`;
			for (const planId of u.plans ?? []) {
				const p = demoPlans.find((d) => d.id === planId);
				if (!p) throw new Error(`fixtures/demo.json names an unknown demo plan ${planId}`);
				const [exists] = await tx`SELECT 1 FROM plan WHERE owner_id = ${userId} AND name = ${p.input.name}`;
				if (exists) continue;
				const result = JSON.parse(JSON.stringify(computePlan(p.input)));
				await tx`
					INSERT INTO plan (owner_id, name, postcode, input, result, engine_version)
					VALUES (${userId}, ${p.input.name}, ${p.postcode ?? null}, ${tx.json(p.input)}, ${tx.json(result)}, ${ENGINE_VERSION})`;
				added++;
			}
		}
	});
} finally {
	await sql.end();
}
console.log(added ? `Loaded ${added} demo accounts and plans` : 'Demo data already loaded');

// Loads the demo scenario in fixtures/demo.json once; running it again changes nothing.
import fs from 'node:fs';
import path from 'node:path';
import { hash } from '@node-rs/argon2';
import postgres from 'postgres';
import zipcodes from 'zipcodes';

if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set');
const demo = JSON.parse(fs.readFileSync(new URL('../fixtures/demo.json', import.meta.url), 'utf8'));
const sql = postgres(process.env.DATABASE_URL, { max: 1, onnotice: () => {} });

const uploadDir = path.resolve(process.env.UPLOAD_DIR || '.data/uploads');

/** A one-page PDF saying what it is: demo documents must never pass for real ones. */
function demoPdf(line) {
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

async function seedContractor(tx, id, u) {
	const c = u.contractor;
	const p = c.profile;
	const at = zipcodes.lookup(p.servicePostcode);
	await tx`
		INSERT INTO contractor (user_id, business_name, status, contact_name, phone, description, years_in_trade, services,
			licence_number, licence_authority, service_postcode, service_radius, service_radius_unit, service_lat, service_lon, submitted_at)
		VALUES (${id}, ${c.businessName}, ${c.status}, ${p.contactName}, ${p.phone}, ${p.description}, ${p.yearsInTrade},
			${p.services}::service_kind[], ${p.licenceNumber}, ${p.licenceAuthority}, ${p.servicePostcode}, ${p.serviceRadius},
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

// Same parameters as src/lib/server/password.ts.
const passwordHash = await hash(demo.password, { memoryCost: 19456, timeCost: 2, outputLen: 32, parallelism: 1 });
let added = 0;
try {
	await sql.begin(async (tx) => {
		for (const u of demo.users) {
			const rows = await tx`
				INSERT INTO "user" (email, name, role, password_hash, email_verified_at)
				VALUES (${u.email.toLowerCase()}, ${u.name}, ${u.role}, ${passwordHash}, now())
				ON CONFLICT (email) DO NOTHING RETURNING id`;
			if (!rows.length) continue;
			added++;
			if (u.role === 'contractor') await seedContractor(tx, rows[0].id, u);
		}
	});
} finally {
	await sql.end();
}
console.log(added ? `Loaded ${added} demo accounts` : 'Demo data already loaded');

// Loads the demo scenario in fixtures/demo.json once; running it again changes nothing.
import fs from 'node:fs';
import { hash } from '@node-rs/argon2';
import postgres from 'postgres';

if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set');
const demo = JSON.parse(fs.readFileSync(new URL('../fixtures/demo.json', import.meta.url), 'utf8'));
const sql = postgres(process.env.DATABASE_URL, { max: 1, onnotice: () => {} });

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
			if (u.role === 'contractor') {
				await tx`
					INSERT INTO contractor (user_id, business_name, status)
					VALUES (${rows[0].id}, ${u.contractor.businessName}, ${u.contractor.status})`;
			}
		}
	});
} finally {
	await sql.end();
}
console.log(added ? `Loaded ${added} demo accounts` : 'Demo data already loaded');

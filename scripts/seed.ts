// Loads the demo scenario (fixtures/demo.json, fixtures/demo-plans.json) once; running it again
// changes nothing. TypeScript run with tsx, so demo plans are computed by the real engine.
import fs from 'node:fs';
import { hash } from '@node-rs/argon2';
import postgres from 'postgres';
import { computePlan } from '../src/lib/plan/index';

type DemoUser = { email: string; name: string; role: string; plans?: string[]; contractor?: { businessName: string; status: string } };
type DemoPlan = { id: string; postcode?: string; input: { name: string } };

if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set');
const read = (file: string) => JSON.parse(fs.readFileSync(new URL(`../fixtures/${file}`, import.meta.url), 'utf8'));
const demo: { password: string; users: DemoUser[] } = read('demo.json');
const demoPlans: DemoPlan[] = read('demo-plans.json').plans;
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
			const [{ id: userId }] = rows.length ? rows : await tx`SELECT id FROM "user" WHERE email = ${u.email.toLowerCase()}`;
			if (rows.length) added++;
			if (rows.length && u.contractor) {
				await tx`INSERT INTO contractor (user_id, business_name, status) VALUES (${userId}, ${u.contractor.businessName}, ${u.contractor.status})`;
			}
			for (const planId of u.plans ?? []) {
				const p = demoPlans.find((d) => d.id === planId);
				if (!p) throw new Error(`fixtures/demo.json names an unknown demo plan ${planId}`);
				const [exists] = await tx`SELECT 1 FROM plan WHERE owner_id = ${userId} AND name = ${p.input.name}`;
				if (exists) continue;
				const result = JSON.parse(JSON.stringify(computePlan(p.input)));
				await tx`
					INSERT INTO plan (owner_id, name, postcode, input, result)
					VALUES (${userId}, ${p.input.name}, ${p.postcode ?? null}, ${tx.json(p.input)}, ${tx.json(result)})`;
				added++;
			}
		}
	});
} finally {
	await sql.end();
}
console.log(added ? `Loaded ${added} demo accounts and plans` : 'Demo data already loaded');

// npm start: sets up everything a fresh clone needs, then serves the app.
//   node scripts/start.mjs         build and serve (adapter-node) on http://127.0.0.1:3000
//   node scripts/start.mjs --dev   the same set-up, then vite's dev server
import fs from 'node:fs';
import path from 'node:path';
import { root, settings } from './lib/settings.mjs';
import net from 'node:net';
import { background, fail, log, waitForOk } from './lib/run.mjs';
import { bin, node, prepare } from './lib/steps.mjs';

const dev = process.argv.includes('--dev');
const s = settings('dev');
const started = Date.now();

prepare(s, { build: !dev });

// A server already on the port would answer the health check below in this one's place.
if (!(await portFree(s.host, s.port))) fail(`Port ${s.port} on ${s.host} is in use (another Stakeline running?); stop it or set PORT.`);

const env = { ...process.env, ...s.env };
const children = [];
if (s.useFakeMail) children.push(background(node, [path.join(root, 'scripts', 'mail-fake.mjs')], { env }));
if (s.useFakePayments) {
	if (!(await portFree('127.0.0.1', s.paymentsPort)))
		fail(`Port ${s.paymentsPort} (the fake payment provider) is in use; stop what uses it or set PAYMENTS_FAKE_PORT.`);
	children.push(background(node, [path.join(root, 'scripts', 'payments-fake.mjs')], { env }));
}
const app = dev
	? background(bin('vite'), ['dev', '--host', s.host, '--port', String(s.port), '--strictPort'], { env, cwd: root })
	: background(node, [path.join(root, 'build')], { env, cwd: root });
children.push(app);

for (const sig of ['SIGINT', 'SIGTERM']) {
	process.on(sig, () => {
		for (const c of children) c.kill('SIGTERM');
	});
}
app.on('exit', (code) => {
	for (const c of children) c.kill('SIGTERM');
	process.exit(code ?? 0);
});

// Asked on loopback: ORIGIN may name a proxy or an HTTPS address this process does not serve.
if (!(await waitForOk(`http://127.0.0.1:${s.port}/healthz`))) {
	for (const c of children) c.kill('SIGTERM');
	console.error('The app did not answer within a minute; see the messages above.');
	process.exit(1);
}
const demo = JSON.parse(fs.readFileSync(path.join(root, 'fixtures', 'demo.json'), 'utf8'));
log(`Stakeline is ready after ${((Date.now() - started) / 1000).toFixed(1)} s: ${s.env.ORIGIN}`);
console.log(`\n  Demo sign-ins (password for all: ${demo.password})`);
for (const u of demo.users) console.log(`    ${u.role.padEnd(10)} ${u.email.padEnd(34)} ${u.note ?? ''}`);
if (s.useFakeMail) console.log(`\n  Mail sent by the app: ${s.env.ORIGIN}/dev/mailbox`);
if (s.useFakePayments) console.log(`  Fake payment provider (nothing is charged): http://127.0.0.1:${s.paymentsPort}/_fake`);
console.log('  Stop with Ctrl-C; the database keeps running (npm run db:stop stops it).\n');

function portFree(host, port) {
	return new Promise((resolve) => {
		const probe = net.createServer();
		probe.once('error', () => resolve(false));
		probe.listen(port, host, () => probe.close(() => resolve(true)));
	});
}

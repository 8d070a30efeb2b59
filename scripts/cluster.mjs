// npm run cluster: the set-up `npm start` does, then Stakeline as it runs when one server is not
// enough — two app servers behind nginx on 127.0.0.1, sharing one PostgreSQL and an S3-compatible
// store (s3rver here; a managed bucket in production). nginx's configuration, its logs and the
// store's objects live under .data/cluster/. Ctrl-C stops everything but PostgreSQL.
//   PORT               nginx's port (default 3000, the address visitors use)
//   CLUSTER_APP_PORTS  the app servers' ports, comma-separated (default: two free ports)
//   S3_FAKE_PORT       the S3 fake's port (default: a free port)
import fs from 'node:fs';
import path from 'node:path';
import { root, settings } from './lib/settings.mjs';
import { background, fail, log } from './lib/run.mjs';
import { node, prepare } from './lib/steps.mjs';

const s = settings('dev');
const started = Date.now();

prepare(s);

// Imported after ensureDependencies: the S3 fake comes from node_modules.
const { startCluster, ensureNginx } = await import('./lib/cluster.mjs');
ensureNginx();

const env = { ...s.env };
const children = [];
if (s.useFakeMail) children.push(background(node, [path.join(root, 'scripts', 'mail-fake.mjs')], { env: { ...process.env, ...env } }));

const appPorts = (process.env.CLUSTER_APP_PORTS ?? '').split(',').filter(Boolean).map(Number);
let cluster;
try {
	cluster = await startCluster({
		env,
		dir: path.join(root, '.data', 'cluster'),
		port: s.port,
		appPorts: appPorts.length ? appPorts : undefined,
		s3Port: process.env.S3_FAKE_PORT ? Number(process.env.S3_FAKE_PORT) : undefined,
		origin: process.env.ORIGIN,
		// The demo's documents (and anything `npm start` stored) live on disk; the cluster reads the bucket.
		importUploads: env.UPLOAD_DIR
	});
} catch (err) {
	for (const c of children) c.kill('SIGTERM');
	fail(err.message);
}

let stopping = false;
async function stopAll(code = 0) {
	if (stopping) return;
	stopping = true;
	log('Stopping nginx, the app servers and the S3 fake…');
	await cluster.stop();
	for (const c of children) c.kill('SIGTERM');
	process.exit(code);
}
for (const sig of ['SIGINT', 'SIGTERM']) process.on(sig, () => void stopAll(0));
cluster.nginx.child.on('exit', (code) => {
	if (!stopping) console.error(`nginx stopped (exit ${code}); see ${path.join(cluster.dir, 'nginx', 'error.log')}`);
	void stopAll(1);
});
for (const app of cluster.apps)
	app.child.on('exit', (code, signal) => {
		// nginx keeps serving from the others; say so rather than stop the whole cluster.
		if (!stopping) console.error(`App server ${app.name} (port ${app.port}) stopped (${signal ?? `exit ${code}`}); nginx sends its requests to the others.`);
	});

const demo = JSON.parse(fs.readFileSync(path.join(root, 'fixtures', 'demo.json'), 'utf8'));
log(`Stakeline cluster is ready after ${((Date.now() - started) / 1000).toFixed(1)} s: ${process.env.ORIGIN ?? cluster.url}`);
console.log(`\n  nginx          ${cluster.url}  (config ${path.relative(root, cluster.nginx.conf)})`);
for (const app of cluster.apps) console.log(`  app server ${app.name}   ${app.url}`);
console.log(`  S3 fake        ${cluster.s3.endpoint}  bucket "stakeline", objects in ${path.relative(root, path.join(cluster.dir, 's3'))}`);
console.log(`  PostgreSQL     127.0.0.1:${s.pgPort}/${s.database}`);
console.log(`\n  Demo sign-ins (password for all: ${demo.password})`);
for (const u of demo.users) console.log(`    ${u.role.padEnd(10)} ${u.email.padEnd(34)} ${u.note ?? ''}`);
if (s.useFakeMail) console.log(`\n  Mail sent by the app: ${cluster.url}/dev/mailbox`);
console.log('  Stop with Ctrl-C; the database keeps running (npm run db:stop stops it).\n');

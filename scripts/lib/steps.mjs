// The set-up steps that `npm start` and `npm test` share.
import fs from 'node:fs';
import path from 'node:path';
import { createHash } from 'node:crypto';
import { root } from './settings.mjs';
import { aptInstall, log, run } from './run.mjs';
import { ensurePostgres } from './pg.mjs';

const node = process.execPath;
const bin = (name) => path.join(root, 'node_modules', '.bin', name);

/** npm ci when node_modules is missing or was installed from another lock file. */
export function ensureDependencies() {
	const lock = fs.readFileSync(path.join(root, 'package-lock.json'));
	const hash = createHash('sha256').update(lock).digest('hex');
	const stamp = path.join(root, 'node_modules', '.stakeline-lock');
	if (fs.existsSync(stamp) && fs.readFileSync(stamp, 'utf8') === hash) return;
	log('Installing dependencies (npm ci)…');
	run('npm', ['ci', '--no-audit', '--no-fund'], { cwd: root });
	fs.writeFileSync(stamp, hash);
}

export function migrate(env) {
	log('Applying database migrations');
	run(node, [path.join(root, 'scripts', 'migrate.mjs')], { cwd: root, env: { ...process.env, ...env } });
}

export function seed(env) {
	run(node, ['--import', 'tsx', path.join(root, 'scripts', 'seed.ts')], { cwd: root, env: { ...process.env, ...env } });
}

function newestMtime(p) {
	if (!fs.existsSync(p)) return 0;
	const st = fs.statSync(p);
	if (!st.isDirectory()) return st.mtimeMs;
	let max = st.mtimeMs;
	for (const entry of fs.readdirSync(p)) max = Math.max(max, newestMtime(path.join(p, entry)));
	return max;
}

/**
 * vite build, skipped when build/ is newer than every source file. `devMailbox` compiles in
 * /dev/mailbox (only when the local fake mail server is used); a build made otherwise lacks it.
 */
export function build({ force = false, devMailbox = false } = {}) {
	const stamp = path.join(root, 'build', '.stakeline-built');
	const inputs = ['src', 'static', 'package-lock.json', 'svelte.config.js', 'vite.config.ts', 'vite-plugins', 'tsconfig.json'];
	const newest = Math.max(...inputs.map((p) => newestMtime(path.join(root, p))));
	const kind = devMailbox ? 'with-dev-mailbox' : 'plain';
	const fresh = fs.existsSync(stamp) && fs.statSync(stamp).mtimeMs >= newest && fs.readFileSync(stamp, 'utf8').endsWith(kind);
	if (!force && fresh) return log('Build is up to date');
	log('Building the app (vite build)…');
	run(bin('vite'), ['build'], { cwd: root, env: { ...process.env, STAKELINE_DEV_MAILBOX: devMailbox ? '1' : '0' } });
	fs.writeFileSync(stamp, `${new Date().toISOString()} ${kind}`);
}

export function chromiumPath() {
	const p = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
	if (!fs.existsSync(p)) aptInstall(['chromium']);
	return p;
}

export { bin, node };

/**
 * What the commands that serve the app do first: the npm dependencies, the local PostgreSQL (with a
 * fresh database when asked), the migrations, the demo data and a build with the fake mailbox when
 * the fake mail server runs.
 * @param {{ env: Record<string, string>, useFakeMail: boolean }} s @param {{ freshDatabase?: boolean, build?: boolean }} [o]
 */
export function prepare(s, { freshDatabase = false, build: withBuild = true } = {}) {
	ensureDependencies();
	ensurePostgres(s, { freshDatabase });
	migrate(s.env);
	seed(s.env);
	if (withBuild) build({ devMailbox: s.useFakeMail });
}

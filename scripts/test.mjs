// npm test: the same set-up as npm start against a fresh test database, then every check:
// Vitest (unit + integration on the real PostgreSQL), the build, and Playwright in Debian's Chromium,
// with svelte-check and the linters (what `npm run lint` runs) beside Playwright. Exits non-zero on
// the first failure. `npm test -- FILE...` runs the same set-up, the type check and ESLint on the
// named files, then only those files: *.e2e.ts with Playwright (after a build), the rest with Vitest.
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { root, settings } from './lib/settings.mjs';
import { background, log, run } from './lib/run.mjs';
import { ensurePostgres } from './lib/pg.mjs';
import { bin, build, chromiumPath, ensureDependencies, migrate, node, seed } from './lib/steps.mjs';

const s = settings('test');
const files = process.argv.slice(2).filter((a) => !a.startsWith('-'));
const e2eFiles = files.filter((f) => f.endsWith('.e2e.ts'));
const unitFiles = files.filter((f) => !f.endsWith('.e2e.ts'));
const all = files.length === 0;
const t0 = Date.now();
/** Runs each check in turn with its output held and printed when it ends; throws on the first failure. */
async function runChecks(checks, opts) {
	for (const [name, cmd, args] of checks) {
		const t = Date.now();
		const child = spawn(cmd, args, { ...opts, stdio: ['ignore', 'pipe', 'pipe'] });
		const out = [];
		child.stdout.on('data', (d) => out.push(d));
		child.stderr.on('data', (d) => out.push(d));
		const code = await new Promise((resolve) => child.on('close', (c, signal) => resolve(c ?? signal)));
		log(`${name}: ${((Date.now() - t) / 1000).toFixed(1)} s`);
		process.stdout.write(Buffer.concat(out));
		if (code !== 0) throw new Error(`${name} failed (${path.basename(cmd)} exited with ${code})`);
	}
}
const step = (name, fn) => {
	const t = Date.now();
	log(name);
	fn();
	log(`${name}: ${((Date.now() - t) / 1000).toFixed(1)} s`);
};

try {
	ensureDependencies();
	ensurePostgres(s, { freshDatabase: true });
	migrate(s.env);
	seed(s.env);
	const env = { ...process.env, ...s.env, CHROMIUM_PATH: chromiumPath() };
	if (s.useFakeMail) background(node, [path.join(root, 'scripts', 'mail-fake.mjs')], { env });
	if (s.useFakePayments) {
		// A fresh test database: the fake starts empty too.
		fs.rmSync(s.env.PAYMENTS_FAKE_STATE, { force: true });
		background(node, [path.join(root, 'scripts', 'payments-fake.mjs')], { env });
	}
	const opts = { cwd: root, env };
	// The static checks (type check, Prettier, ESLint) read files only: they run one after another
	// beside Playwright, sharing the cores with its two browsers, and their output is printed
	// when each ends. Without end-to-end files they run first, as before.
	const checks = [
		['Type check (svelte-kit sync)', bin('svelte-kit'), ['sync']],
		['Type check (svelte-check)', bin('svelte-check'), ['--tsconfig', './tsconfig.json', '--fail-on-warnings']],
		...(all
			? [
					['Lint (prettier --check)', bin('prettier'), ['--check', '--cache', '.']],
					['Lint (eslint)', bin('eslint'), ['--cache', '--cache-location', 'node_modules/.cache/eslint/', '.']]
				]
			: [['Lint (eslint, the named files)', bin('eslint'), ['--cache', '--cache-location', 'node_modules/.cache/eslint/', ...files]]])
	];
	const e2e = all || e2eFiles.length > 0;
	if (!e2e) await runChecks(checks, opts);
	if (all || unitFiles.length) step('Unit and integration tests (vitest)', () => run(bin('vitest'), ['run', ...unitFiles], opts));
	if (e2e) {
		step('Build', () => build({ force: true, devMailbox: s.useFakeMail }));
		const t = Date.now();
		log('End-to-end tests (playwright), with the static checks beside them');
		const playwright = spawn(bin('playwright'), ['test', ...e2eFiles], { ...opts, stdio: 'inherit' });
		const done = new Promise((resolve) => playwright.on('exit', (code, signal) => resolve(code ?? signal)));
		// A failed check ends the run at once, as a failure anywhere else does.
		// SIGINT: Playwright stops as on Ctrl-C, taking its web server down with it.
		await runChecks(checks, opts).catch(async (err) => {
			playwright.kill('SIGINT');
			await done;
			throw err;
		});
		const code = await done;
		if (code !== 0) throw new Error(`playwright test exited with ${code}`);
		log(`End-to-end tests (playwright): ${((Date.now() - t) / 1000).toFixed(1)} s`);
	}
	log(`All checks passed in ${((Date.now() - t0) / 1000).toFixed(0)} s`);
	process.exit(0);
} catch (err) {
	console.error(`\n✖ ${err.message}`);
	process.exit(1);
}

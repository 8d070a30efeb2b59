// npm test: the same set-up as npm start against a fresh test database, then every check:
// svelte-check, the linters (`npm run lint`), Vitest (unit + integration on the real PostgreSQL),
// the build, and Playwright in Debian's Chromium. Exits non-zero on the first failure.
// `npm test -- FILE...` runs the same set-up, the type check and ESLint on the named files, then
// only those files: *.e2e.ts with Playwright (after a build), the rest with Vitest.
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
	step('Type check (svelte-check)', () => {
		run(bin('svelte-kit'), ['sync'], opts);
		run(bin('svelte-check'), ['--tsconfig', './tsconfig.json', '--fail-on-warnings'], opts);
	});
	// Prettier's check and ESLint: everything, or (ESLint only) the named files.
	if (all) step('Lint (npm run lint)', () => run('npm', ['run', '--silent', 'lint'], opts));
	else step('Lint (eslint, the named files)', () => run(bin('eslint'), ['--cache', '--cache-location', 'node_modules/.cache/eslint/', ...files], opts));
	if (all || unitFiles.length) step('Unit and integration tests (vitest)', () => run(bin('vitest'), ['run', ...unitFiles], opts));
	if (all || e2eFiles.length) {
		step('Build', () => build({ force: true, devMailbox: s.useFakeMail }));
		step('End-to-end tests (playwright)', () => run(bin('playwright'), ['test', ...e2eFiles], opts));
	}
	log(`All checks passed in ${((Date.now() - t0) / 1000).toFixed(0)} s`);
	process.exit(0);
} catch (err) {
	console.error(`\n✖ ${err.message}`);
	process.exit(1);
}

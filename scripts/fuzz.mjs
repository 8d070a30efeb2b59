// npm run fuzz — 10 000 hostile bodies (FUZZ_RUNS to change) against every JSON route and form
// action of the built app, on the test database; prints the tally of answers by status class.
import { settings, root } from './lib/settings.mjs';
import { ensurePostgres } from './lib/pg.mjs';
import { run } from './lib/run.mjs';
import { bin, build, chromiumPath, migrate, seed } from './lib/steps.mjs';

const s = settings('test');
ensurePostgres(s, { freshDatabase: true });
migrate(s.env);
seed(s.env);
build();
const env = { ...process.env, ...s.env, CHROMIUM_PATH: chromiumPath(), FUZZ_RUNS: process.env.FUZZ_RUNS ?? '10000' };
run(bin('playwright'), ['test', 'tests/fuzz.e2e.ts'], { cwd: root, env });

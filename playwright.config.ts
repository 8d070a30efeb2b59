import { defineConfig, devices } from '@playwright/test';

// npm test sets these (scripts/test.mjs); the defaults let `npx playwright test` run after it.
const port = Number(process.env.PORT ?? 3100);
const baseURL = process.env.ORIGIN ?? `http://127.0.0.1:${port}`;

/** Files that stop the database or an app server (see the projects below). */
const EXCLUSIVE = ['**/reliability.e2e.ts', '**/cluster.e2e.ts'];

export default defineConfig({
	testDir: 'tests',
	testMatch: '**/*.e2e.ts',
	// Two browsers at a time: one journey leaves the two cores about a quarter idle (it waits on the app
	// and the database), two finish the suite in about two-thirds of the time. PW_WORKERS=1 runs one.
	workers: Number(process.env.PW_WORKERS ?? 2),
	fullyParallel: false,
	forbidOnly: !!process.env.CI,
	retries: 0,
	// Up to eight test runs share two cores here; a journey that takes 10 s alone can take 40 s.
	timeout: 90_000,
	reporter: [['list']],
	outputDir: 'test-results',
	use: {
		...devices['Desktop Chrome'],
		baseURL,
		screenshot: 'only-on-failure',
		// No trace by default: recording one snapshots the page at every action, which took about half of
		// the field-by-field journeys' time (planner-fields 27 s → 13 s without it), and CI keeps only the
		// printed output. To record locally: `npx playwright test --trace retain-on-failure FILE`.
		trace: 'off',
		launchOptions: {
			// Debian's Chromium; Playwright never downloads a browser here.
			executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
			args: [
				'--no-sandbox',
				'--disable-gpu',
				'--disable-quic',
				'--no-first-run',
				'--disable-background-networking',
				'--disable-component-update',
				'--disable-sync',
				'--enable-unsafe-swiftshader'
			]
		}
	},
	projects: [
		// Signs the demo accounts in once (tests/auth.setup.ts) for the tests that start signed in.
		{ name: 'sign-in', testMatch: 'auth.setup.ts' },
		{ name: 'chromium', dependencies: ['sign-in'], testIgnore: EXCLUSIVE },
		// Drills that take the shared database or app servers down run alone, after everything else and
		// one after the other, so no journey meets an outage it did not cause.
		{ name: 'fault-drill', testMatch: 'reliability.e2e.ts', dependencies: ['chromium'] },
		{ name: 'cluster', testMatch: 'cluster.e2e.ts', dependencies: ['fault-drill'] }
	],
	webServer: {
		command: 'node build',
		url: `${baseURL}/healthz`,
		reuseExistingServer: false,
		timeout: 60_000,
		// Warnings and errors from the app reach the test output (a failing run shows why it failed).
		stdout: 'pipe',
		env: {
			...(process.env as Record<string, string>),
			LOG_LEVEL: process.env.LOG_LEVEL ?? 'warn',
			// The tests' request clients keep idle connections open; Node's 5 s keep-alive close could meet a
			// request reusing one (ECONNRESET on a matrix POST under load), as nginx's did (docs/deploy.md).
			KEEP_ALIVE_TIMEOUT: process.env.KEEP_ALIVE_TIMEOUT ?? '35',
			PORT: String(port),
			ORIGIN: baseURL,
			ADMIN_EMAIL: process.env.ADMIN_EMAIL ?? 'first-admin@stakeline.test',
			ADMIN_PASSWORD: process.env.ADMIN_PASSWORD ?? 'first-admin-password'
		}
	}
});

import tailwindcss from '@tailwindcss/vite';
import { sveltekit } from '@sveltejs/kit/vite';
import { defineConfig } from 'vitest/config';
import { postgresWriteGuard } from './vite-plugins/postgres-write-guard';

export default defineConfig(({ command }) => ({
	plugins: [postgresWriteGuard(), tailwindcss(), sveltekit()],
	// Bundled, so the write guard above applies to the server's copy of postgres.js.
	ssr: { noExternal: ['postgres'] },
	// The fake mailbox (/dev/mailbox) shows sign-in links: it is compiled in only for the dev server
	// and for builds that npm start / npm test make with the local fake mail server, never `npm run build`.
	define: { __DEV_MAILBOX__: JSON.stringify(command === 'serve' || process.env.STAKELINE_DEV_MAILBOX === '1') },
	test: {
		environment: 'node',
		// Timeouts only guard against hangs (timing targets live in benchmarks): the test machine is shared
		// and can be heavily loaded, so a PDF or a mail round trip may take seconds there.
		testTimeout: 30_000,
		expect: { requireAssertions: true, poll: { timeout: 10_000 } },
		server: { deps: { inline: ['postgres'] } },
		// Both cores: Vitest's default on a 2-core machine is one worker (cores − 1), which ran the unit
		// files one after another.
		maxWorkers: 2,
		projects: [
			// Pure specs (engine, views, rules, mail and PDF rendering) run files side by side first…
			{
				extends: true,
				test: {
					name: 'unit',
					// Each project names its own files: `extends` concatenates lists, so a shared include would
					// put every spec in both.
					include: ['src/**/*.{test,spec}.ts'],
					exclude: ['src/**/*.integration.spec.ts'],
					// Pure specs share nothing (no mocks, no globals they change), so a worker keeps the modules
					// it imported for the next file: re-importing the engine and Svelte per file was over half
					// of the unit run.
					isolate: false,
					sequence: { groupOrder: 0 },
					benchmark: { include: ['src/**/*.bench.ts'] }
				}
			},
			// …then the integration specs, which share one test database, one file after another.
			{
				extends: true,
				test: {
					name: 'integration',
					include: ['src/**/*.integration.spec.ts'],
					fileParallelism: false,
					sequence: { groupOrder: 1 },
					benchmark: { include: [] }
				}
			}
		]
	}
}));

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
		include: ['src/**/*.{test,spec}.ts'],
		environment: 'node',
		// Timeouts only guard against hangs (timing targets live in benchmarks): the test machine is shared
		// and can be heavily loaded, so a PDF or a mail round trip may take seconds there.
		testTimeout: 30_000,
		expect: { requireAssertions: true, poll: { timeout: 10_000 } },
		// Integration specs share one test database; run files one after another.
		fileParallelism: false,
		server: { deps: { inline: ['postgres'] } },
		benchmark: { include: ['src/**/*.bench.ts'] }
	}
}));

import tailwindcss from '@tailwindcss/vite';
import { sveltekit } from '@sveltejs/kit/vite';
import { defineConfig } from 'vitest/config';
import { postgresWriteGuard } from './vite-plugins/postgres-write-guard';

export default defineConfig({
	plugins: [postgresWriteGuard(), tailwindcss(), sveltekit()],
	// Bundled, so the write guard above applies to the server's copy of postgres.js.
	ssr: { noExternal: ['postgres'] },
	test: {
		include: ['src/**/*.{test,spec}.ts'],
		environment: 'node',
		expect: { requireAssertions: true },
		// Integration specs share one test database; run files one after another.
		fileParallelism: false,
		server: { deps: { inline: ['postgres'] } },
		benchmark: { include: ['src/**/*.bench.ts'] }
	}
});

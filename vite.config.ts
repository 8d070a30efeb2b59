import tailwindcss from '@tailwindcss/vite';
import { sveltekit } from '@sveltejs/kit/vite';
import { defineConfig } from 'vitest/config';

export default defineConfig({
	plugins: [tailwindcss(), sveltekit()],
	test: {
		include: ['src/**/*.{test,spec}.ts'],
		environment: 'node',
		expect: { requireAssertions: true },
		// Integration specs share one test database; run files one after another.
		fileParallelism: false,
		benchmark: { include: ['src/**/*.bench.ts'] }
	}
});

import tailwindcss from '@tailwindcss/vite';
import { sveltekit } from '@sveltejs/kit/vite';
import { defineConfig } from 'vitest/config';

export default defineConfig(({ command }) => ({
	plugins: [tailwindcss(), sveltekit()],
	// The fake mailbox (/dev/mailbox) shows sign-in links: it is compiled in only for the dev server
	// and for builds that npm start / npm test make with the local fake mail server, never `npm run build`.
	define: { __DEV_MAILBOX__: JSON.stringify(command === 'serve' || process.env.STAKELINE_DEV_MAILBOX === '1') },
	test: {
		include: ['src/**/*.{test,spec}.ts'],
		environment: 'node',
		expect: { requireAssertions: true },
		// Integration specs share one test database; run files one after another.
		fileParallelism: false,
		benchmark: { include: ['src/**/*.bench.ts'] }
	}
}));

import adapter from '@sveltejs/adapter-node';
import { vitePreprocess } from '@sveltejs/vite-plugin-svelte';

/** @type {import('@sveltejs/kit').Config} */
const config = {
	preprocess: vitePreprocess(),
	kit: {
		adapter: adapter(),
		// Forms post back to the same origin; adapter-node reads ORIGIN for the check.
		csrf: { trustedOrigins: [] }
	}
};

export default config;

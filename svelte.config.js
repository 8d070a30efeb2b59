import adapter from '@sveltejs/adapter-node';
import { vitePreprocess } from '@sveltejs/vite-plugin-svelte';

/** @type {import('@sveltejs/kit').Config} */
const config = {
	preprocess: vitePreprocess(),
	kit: {
		adapter: adapter(),
		// Forms post back to the same origin; adapter-node reads ORIGIN for the check. The check itself is
		// src/lib/server/csrf.ts (a hook), which does what SvelteKit's does but also takes a mail
		// program's one-click unsubscribe post (RFC 8058) at the stop link; '*' hands the check over.
		csrf: { trustedOrigins: ['*'] },
		// The offline worker is registered by a plan's layout (scope /, answering only for plan pages), not on every page.
		serviceWorker: { register: false },
		// SvelteKit adds a nonce (server-rendered pages) or hash (prerendered) to its own scripts; no
		// other inline script runs. Inline styles stay allowed: Svelte's style: directives use them.
		csp: {
			mode: 'auto',
			directives: {
				'default-src': ['self'],
				'script-src': ['self'],
				'style-src': ['self', 'unsafe-inline'],
				'img-src': ['self', 'data:', 'blob:'],
				'font-src': ['self', 'data:'],
				'connect-src': ['self'],
				'worker-src': ['self', 'blob:'],
				'object-src': ['none'],
				'base-uri': ['self'],
				'form-action': ['self'],
				'frame-ancestors': ['none']
			}
		}
	}
};

export default config;

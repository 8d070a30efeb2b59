// The bare page `npm run load` compares the app with: one +page.svelte on adapter-node, same
// SvelteKit, Svelte, Vite and adapter versions as the app (resolved from the project's node_modules).
import adapter from '@sveltejs/adapter-node';

export default { kit: { adapter: adapter() } };

import { describe, expect, it } from 'vitest';

describe('client hooks', () => {
	it('leave zod jitless, read through its own configuration', async () => {
		// Zod first, as a page that already holds it would; then the hook; then zod's own view of it.
		const { config } = await import('zod/v4/core');
		await import('./hooks.client');
		expect(config().jitless).toBe(true);
	});
});

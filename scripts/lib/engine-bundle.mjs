// The engine as it ships: bundled by Vite (as `vite build` bundles it for the browser and the
// server) and loaded by Node itself, not through the test runner's per-module transform. Shared by
// the bench (src/lib/plan/plan.bench.ts) and the allocation count (scripts/engine-alloc.mjs).
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { build } from 'vite';

/**
 * Bundles src/lib/plan/index.ts and test-plans.ts into `outDir` and loads both.
 * @param {string} outDir
 * @param {{ minify?: boolean, root?: string }} [options] minify: false keeps function names for
 *   profiles; root: the tree whose src/lib/plan is bundled (default the working directory)
 * @returns {Promise<{ engine: typeof import('../../src/lib/plan/index'), plans: typeof import('../../src/lib/plan/test-plans') }>}
 */
export async function bundleEngine(outDir, { minify = true, root = '.' } = {}) {
	await build({
		configFile: false,
		logLevel: 'warn',
		build: {
			lib: {
				entry: { engine: path.join(root, 'src/lib/plan/index.ts'), plans: path.join(root, 'src/lib/plan/test-plans.ts') },
				formats: ['es']
			},
			outDir,
			emptyOutDir: true,
			target: 'node20',
			minify
		}
	});
	/** @param {string} name */
	const load = (name) => import(pathToFileURL(path.join(outDir, `${name}.js`)).href);
	return { engine: await load('engine'), plans: await load('plans') };
}

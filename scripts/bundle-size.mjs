// JavaScript each page downloads on first load, gzip bytes, from the last build's manifests: the
// client entry, then the route's layout and page nodes with every chunk they import statically
// (dynamic imports, such as the 3D viewer, are left out: they load only when asked for).
// `node scripts/bundle-size.mjs` prints every page; tests/bundle-size.e2e.ts holds the budgets.
import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';
import { pathToFileURL } from 'node:url';
import { root } from './lib/settings.mjs';

const out = path.join(root, '.svelte-kit', 'output');

/**
 * Route id → gzip bytes and file count for every page route of the last build.
 * @returns {Promise<Map<string, { bytes: number; chunks: number }>>}
 */
export async function pageBundles() {
	const client = path.join(out, 'client');
	/** @type {Record<string, { file: string; isEntry?: boolean; imports?: string[] }>} */
	const man = JSON.parse(fs.readFileSync(path.join(client, '.vite', 'manifest.json'), 'utf8'));
	const { manifest } = await import(pathToFileURL(path.join(out, 'server', 'manifest.js')).href);
	/** @type {Map<string, number>} */
	const gz = new Map();
	/** @param {string} key */
	const size = (key) => {
		if (!gz.has(key)) gz.set(key, zlib.gzipSync(fs.readFileSync(path.join(client, man[key].file)), { level: 9 }).length);
		return /** @type {number} */ (gz.get(key));
	};
	/** @param {number} i */
	const node = (i) => `.svelte-kit/generated/client-optimized/nodes/${i}.js`;
	const entries = Object.keys(man).filter((k) => man[k].isEntry && !/\/nodes\//.test(k));
	const result = new Map();
	for (const r of manifest._.routes) {
		if (!r.page) continue;
		/** @type {Set<string>} */
		const seen = new Set();
		/** @param {string} k */
		const visit = (k) => {
			if (seen.has(k) || !man[k]) return;
			seen.add(k);
			for (const i of man[k].imports ?? []) visit(i);
		};
		[...entries, ...r.page.layouts.filter(/** @param {number | undefined} i */ (i) => i !== undefined).map(node), node(r.page.leaf)].forEach(visit);
		result.set(r.id, { bytes: [...seen].reduce((a, k) => a + size(k), 0), chunks: seen.size });
	}
	return result;
}

if (import.meta.url === pathToFileURL(process.argv[1]).href) {
	const rows = [...(await pageBundles())].sort((a, b) => b[1].bytes - a[1].bytes);
	for (const [id, { bytes, chunks }] of rows) console.log(`${(bytes / 1024).toFixed(1).padStart(7)} kB  ${String(chunks).padStart(3)} files  ${id}`);
}

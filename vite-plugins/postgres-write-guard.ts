import type { Plugin } from 'vite';

/**
 * postgres.js 3.4.9 defers small writes to a setImmediate; when the server closes the connection
 * first (a PostgreSQL restart), that callback writes to a null socket and the uncaught TypeError
 * ends the whole app (upstream issues #1154, #1208; fix not released). Teardown also leaves the
 * timer variable set, so a reused connection never flushes again. This rewrites those three spots
 * while bundling postgres into the server; it fails the build if the code no longer matches.
 */
const PATCHES: [string, string][] = [
	[
		'  function nextWrite(fn) {\n    const x = socket.write(chunk, fn)',
		'  function nextWrite(fn) {\n    if (!socket) { nextWriteTimer !== null && clearImmediate(nextWriteTimer); chunk = nextWriteTimer = null; return false }\n    const x = socket.write(chunk, fn)'
	],
	['    clearImmediate(nextWriteTimer)\n    if (socket) {', '    clearImmediate(nextWriteTimer)\n    chunk = nextWriteTimer = null\n    if (socket) {'],
	['    clearImmediate(nextWriteTimer)\n    socket.removeListener', '    clearImmediate(nextWriteTimer)\n    chunk = nextWriteTimer = null\n    socket.removeListener']
];

export function postgresWriteGuard(): Plugin {
	return {
		name: 'stakeline-postgres-write-guard',
		enforce: 'pre',
		transform(code, id) {
			if (!/[/\\]postgres[/\\]src[/\\]connection\.js$/.test(id)) return;
			for (const [from, to] of PATCHES) {
				if (!code.includes(from)) throw new Error(`postgres-write-guard: ${id} changed; check whether the upstream fix landed`);
				code = code.replace(from, to);
			}
			return { code, map: null };
		}
	};
}

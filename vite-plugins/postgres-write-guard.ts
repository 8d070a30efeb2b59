import type { Plugin } from 'vite';

/**
 * postgres.js 3.4.9 defers small writes to a setImmediate; when the server closes the connection
 * first (a PostgreSQL restart), that callback writes to a null socket and the uncaught TypeError
 * ends the whole app (upstream issues #1154, #1208; fix not released). Teardown also leaves the
 * timer variable set, so a reused connection never flushes again; and a closed connection keeps its
 * last backend's error for the next query. This rewrites those spots while bundling postgres into
 * the server (and under Vitest); it fails the build if the code no longer matches.
 */
const PATCHES: [string, string][] = [
	[
		'  function nextWrite(fn) {\n    const x = socket.write(chunk, fn)',
		'  function nextWrite(fn) {\n    if (!socket) { nextWriteTimer !== null && clearImmediate(nextWriteTimer); chunk = nextWriteTimer = null; return false }\n    const x = socket.write(chunk, fn)'
	],
	['    clearImmediate(nextWriteTimer)\n    if (socket) {', '    clearImmediate(nextWriteTimer)\n    chunk = nextWriteTimer = null\n    if (socket) {'],
	[
		'    clearImmediate(nextWriteTimer)\n    socket.removeListener',
		'    clearImmediate(nextWriteTimer)\n    chunk = nextWriteTimer = null\n    socket.removeListener'
	],
	// A backend that ends while it answers (a restart's "terminating connection", a start-up's "the
	// database system is shutting down") leaves its error and its query set after the socket closes;
	// the next connection's first ReadyForQuery hands that error to whatever query reconnected it,
	// however much later (upstream issue #1223). They die with the socket.
	[
		'    socket = null\n\n    if (initial)\n      return reconnect()\n',
		'    socket = null\n\n    errorResponse = null\n    if (initial) {\n      query = null\n      return reconnect()\n    }\n'
	],
	[
		"    !hadError && (query || sent.length) && error(Errors.connection('CONNECTION_CLOSED', options, socket))\n",
		"    !hadError && (query || sent.length) && error(Errors.connection('CONNECTION_CLOSED', options, socket))\n    query = null\n"
	]
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

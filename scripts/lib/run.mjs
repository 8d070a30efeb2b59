// Small process helpers for the bootstraps.
import { spawn, spawnSync } from 'node:child_process';

/** @param {string} msg */
export function log(msg) {
	console.log(`\x1b[32m▸\x1b[0m ${msg}`);
}

/** @param {string} msg @returns {never} */
export function fail(msg) {
	console.error(`\x1b[31m✖ ${msg}\x1b[0m`);
	process.exit(1);
}

/**
 * Runs a command to completion with inherited output; throws on a non-zero exit.
 * @param {string} cmd @param {string[]} args @param {import('node:child_process').SpawnSyncOptions} [opts]
 */
export function run(cmd, args, opts = {}) {
	const r = spawnSync(cmd, args, { stdio: 'inherit', ...opts });
	if (r.error) throw r.error;
	if (r.status !== 0) throw new Error(`${cmd} ${args.join(' ')} exited with ${r.status}`);
}

/**
 * Runs a command and returns its trimmed stdout, or null when it fails.
 * @param {string} cmd @param {string[]} args @param {import('node:child_process').SpawnSyncOptions} [opts]
 */
export function capture(cmd, args, opts = {}) {
	const r = spawnSync(cmd, args, { encoding: 'utf8', ...opts });
	return r.status === 0 ? String(r.stdout).trim() : null;
}

export const isRoot = () => typeof process.getuid === 'function' && process.getuid() === 0;

/**
 * Starts a long-running child; it is killed when this process exits.
 * @param {string} cmd @param {string[]} args @param {import('node:child_process').SpawnOptions} [opts]
 */
export function background(cmd, args, opts = {}) {
	const child = spawn(cmd, args, { stdio: 'inherit', ...opts });
	const stop = () => child.exitCode === null && child.kill('SIGTERM');
	process.on('exit', stop);
	return child;
}

/** @param {string[]} packages */
export function aptInstall(packages) {
	if (!isRoot()) fail(`Please install ${packages.join(' ')} (apt-get install ${packages.join(' ')}); not root.`);
	log(`Installing ${packages.join(' ')} from Debian's packages…`);
	const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
	run('apt-get', ['update', '-q'], { env });
	run('apt-get', ['install', '-y', '-q', '--no-install-recommends', ...packages], { env });
}

/**
 * Polls url until it answers 2xx (true) or `ms` pass (false).
 * @param {string} url @param {{ ms?: number, headers?: Record<string, string> }} [o]
 */
export async function waitForOk(url, { ms = 60_000, headers = {} } = {}) {
	const until = Date.now() + ms;
	while (Date.now() < until) {
		try {
			const res = await fetch(url, { headers, signal: AbortSignal.timeout(3000) });
			if (res.ok) return true;
		} catch {
			/* not up yet */
		}
		await new Promise((r) => setTimeout(r, 200));
	}
	return false;
}

// A project-local PostgreSQL cluster from Debian's packages, listening on 127.0.0.1 only.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { createHash } from 'node:crypto';
import { aptInstall, capture, fail, isRoot, log, run } from './run.mjs';

function findBinDir() {
	const base = '/usr/lib/postgresql';
	if (!fs.existsSync(base)) return null;
	const dirs = fs
		.readdirSync(base)
		.filter((v) => fs.existsSync(path.join(base, v, 'bin', 'initdb')))
		.sort((a, b) => Number(a) - Number(b));
	return dirs.length ? path.join(base, dirs.at(-1), 'bin') : null;
}

/** Postgres refuses to run as root: as root, the cluster belongs to the `postgres` system user. */
function asOwner(cmd, args) {
	return isRoot() ? ['runuser', ['-u', 'postgres', '--', cmd, ...args]] : [cmd, args];
}

function ownerCanReach(dir) {
	if (!isRoot()) return true;
	return capture('runuser', ['-u', 'postgres', '--', 'test', '-x', dir]) !== null;
}

/** Where the cluster lives; falls back to /var/lib when the project folder is closed to `postgres`. */
function clusterDirs(requested) {
	let dataDir = requested;
	const parent = path.dirname(dataDir);
	fs.mkdirSync(parent, { recursive: true });
	if (!ownerCanReach(parent)) {
		const id = createHash('sha1').update(requested).digest('hex').slice(0, 10);
		dataDir = path.join('/var/lib/stakeline', id, 'pg');
		log(`${parent} is not reachable by the postgres user (a parent folder is mode 0700); using ${dataDir}`);
		fs.mkdirSync(path.dirname(dataDir), { recursive: true });
		fs.chmodSync(path.dirname(dataDir), 0o755);
		fs.chmodSync(path.dirname(path.dirname(dataDir)), 0o755);
	}
	let runDir = `${dataDir}-run`;
	// Unix socket paths are limited to about 107 bytes.
	if (runDir.length > 80) runDir = path.join(os.tmpdir(), `stakeline-pg-${createHash('sha1').update(dataDir).digest('hex').slice(0, 10)}`);
	return { dataDir, runDir };
}

function ensureOwnedDir(dir) {
	fs.mkdirSync(dir, { recursive: true });
	if (isRoot()) run('chown', ['postgres:postgres', dir]);
	fs.chmodSync(dir, 0o700);
}

/**
 * The port a cluster keeps in postgresql.conf is the one it was created with; passing PGPORT on every
 * start lets the same .data/pg serve whichever port this run was given.
 */
const portOption = (s) => ['-o', `-p ${s.pgPort}`];

/** The port the cluster in dataDir is serving on, or null when it is not running. */
function runningPort(dataDir) {
	let lines;
	try {
		lines = fs.readFileSync(path.join(dataDir, 'postmaster.pid'), 'utf8').split('\n');
	} catch {
		return null;
	}
	try {
		process.kill(Number(lines[0]), 0);
	} catch (e) {
		if (e.code !== 'EPERM') return null; // a stale pid file from a crash: pg_ctl start clears it
	}
	return Number(lines[3]) || null;
}

/**
 * Makes sure the cluster exists and runs, and that the app role and database exist.
 * Returns a function that runs SQL as the superuser.
 */
export function ensurePostgres(s, { freshDatabase = false } = {}) {
	let bin = findBinDir();
	if (!bin) {
		aptInstall(['postgresql']);
		bin = findBinDir();
		if (!bin) fail('PostgreSQL was installed but no server binaries were found in /usr/lib/postgresql');
	}
	if (isRoot() && capture('id', ['-u', 'postgres']) === null) fail('The postgres system user is missing; reinstall the postgresql package.');
	const { dataDir, runDir } = clusterDirs(s.dataDir);
	const superuser = isRoot() ? 'postgres' : os.userInfo().username;
	const exec = (name, args) => {
		const [c, a] = asOwner(path.join(bin, name), args);
		run(c, a, { stdio: ['ignore', 'inherit', 'inherit'] });
	};

	ensureOwnedDir(runDir);
	if (!fs.existsSync(path.join(dataDir, 'PG_VERSION'))) {
		log(`Creating a PostgreSQL cluster in ${dataDir}`);
		ensureOwnedDir(dataDir);
		exec('initdb', ['-D', dataDir, '-U', superuser, '-E', 'UTF8', '--locale=C.UTF-8', '--auth-local=peer', '--auth-host=scram-sha-256']);
		fs.appendFileSync(
			path.join(dataDir, 'postgresql.conf'),
			`\n# Stakeline: loopback only, project-local socket\nlisten_addresses = '127.0.0.1'\nport = ${s.pgPort}\nunix_socket_directories = '${runDir}'\n`
		);
	}

	const ready = () => capture(path.join(bin, 'pg_isready'), ['-q', '-h', '127.0.0.1', '-p', String(s.pgPort)]) !== null;
	const runningOn = runningPort(dataDir);
	if (runningOn !== null && runningOn !== s.pgPort)
		fail(
			`This project's PostgreSQL (${dataDir}) is already running on port ${runningOn}, not ${s.pgPort}. ` +
				`Use PGPORT=${runningOn}, or stop it first with npm run db:stop.`
		);
	if (ready() && runningOn === null) fail(`Port ${s.pgPort} is already used by another PostgreSQL server; set PGPORT to a free port.`);
	if (!ready()) {
		log(`Starting PostgreSQL on 127.0.0.1:${s.pgPort}`);
		exec('pg_ctl', ['-D', dataDir, '-l', path.join(runDir, 'server.log'), ...portOption(s), '-w', '-t', '30', 'start']);
	}

	const sql = (query) => {
		const [c, a] = asOwner(path.join(bin, 'psql'), [
			'-h',
			runDir,
			'-p',
			String(s.pgPort),
			'-U',
			superuser,
			'-d',
			'postgres',
			'-v',
			'ON_ERROR_STOP=1',
			'-qtAc',
			query
		]);
		const out = capture(c, a);
		if (out === null) {
			run(c, a); // again, with its error shown
		}
		return out ?? '';
	};
	const lit = (v) => `'${String(v).replaceAll("'", "''")}'`;
	const ident = (v) => `"${String(v).replaceAll('"', '""')}"`;

	if (sql(`SELECT 1 FROM pg_roles WHERE rolname = ${lit(s.pgUser)}`) !== '1') {
		sql(`CREATE ROLE ${ident(s.pgUser)} LOGIN CREATEDB PASSWORD ${lit(s.pgPassword)}`);
	}
	if (freshDatabase) sql(`DROP DATABASE IF EXISTS ${ident(s.database)} WITH (FORCE)`);
	if (sql(`SELECT 1 FROM pg_database WHERE datname = ${lit(s.database)}`) !== '1') {
		log(`Creating database ${s.database}`);
		sql(`CREATE DATABASE ${ident(s.database)} OWNER ${ident(s.pgUser)}`);
	}
	return { dataDir, stop: () => exec('pg_ctl', ['-D', dataDir, '-m', 'fast', '-w', 'stop']) };
}

/** Stops the cluster if it runs (npm run db:stop). */
export function stopPostgres(s) {
	const bin = findBinDir();
	const { dataDir } = clusterDirs(s.dataDir);
	if (!bin || !fs.existsSync(path.join(dataDir, 'postmaster.pid'))) return log('PostgreSQL is not running.');
	const [c, a] = asOwner(path.join(bin, 'pg_ctl'), ['-D', dataDir, '-m', 'fast', '-w', 'stop']);
	run(c, a);
}

/**
 * The running cluster's tools for the fault drill and backups: how to stop/start/restart it, whether
 * it answers, and the path of a server binary (pg_dump, pg_restore) of the same version.
 */
export function pgCluster(s) {
	const bin = findBinDir();
	if (!bin) fail('PostgreSQL is not installed; run npm start or npm test once first.');
	const { dataDir, runDir } = clusterDirs(s.dataDir);
	const logFile = path.join(runDir, 'server.log');
	const ctlOptions = {
		stop: ['-m', 'fast'],
		start: ['-l', logFile, ...portOption(s), '-t', '30'],
		restart: ['-m', 'fast', '-l', logFile, ...portOption(s), '-t', '30']
	};
	return {
		bin: (name) => path.join(bin, name),
		/** [command, args] of pg_ctl stop/start/restart, for callers that must not block (the fault drill). */
		ctlCommand: (action) => asOwner(path.join(bin, 'pg_ctl'), ['-D', dataDir, ...ctlOptions[action], '-w', action]),
		ready: () => capture(path.join(bin, 'pg_isready'), ['-q', '-h', '127.0.0.1', '-p', String(s.pgPort)]) !== null
	};
}

// npm run db:stop — stops the project-local PostgreSQL cluster.
// npm run db:backup [FILE] — pg_dump of DATABASE_URL (custom format) to FILE or backups/<db>-<time>.dump.
// npm run db:restore FILE — pg_restore of FILE into DATABASE_URL, replacing the objects it holds.
import fs from 'node:fs';
import path from 'node:path';
import { root, settings } from './lib/settings.mjs';
import { pgCluster, stopPostgres } from './lib/pg.mjs';
import { fail, log, run } from './lib/run.mjs';

const [command, file] = process.argv.slice(2);
// The test bootstrap sets DATABASE_URL; otherwise the app's own database.
const s = settings(process.env.STAKELINE_PROFILE ?? 'dev');
const url = s.env.DATABASE_URL;
const dbName = new URL(url).pathname.slice(1);

if (command === 'stop') stopPostgres(s);
else if (command === 'backup') {
	const out = path.resolve(file ?? path.join(root, 'backups', `${dbName}-${new Date().toISOString().replace(/[:.]/g, '-')}.dump`));
	fs.mkdirSync(path.dirname(out), { recursive: true });
	// Custom format: compressed, and pg_restore can pick or reorder objects.
	run(pgCluster(s).bin('pg_dump'), ['--format=custom', '--no-owner', '--file', out, '--dbname', url]);
	log(`Backed up ${dbName} to ${out} (${fs.statSync(out).size} bytes)`);
} else if (command === 'restore') {
	if (!file || !fs.existsSync(file)) fail('usage: npm run db:restore FILE (a dump made by npm run db:backup)');
	// --clean --if-exists drops what the dump holds before recreating it; one transaction: all or nothing.
	run(pgCluster(s).bin('pg_restore'), ['--clean', '--if-exists', '--no-owner', '--single-transaction', '--exit-on-error', '--dbname', url, file]);
	log(`Restored ${file} into ${dbName}`);
} else console.log('usage: node scripts/db.mjs stop | backup [FILE] | restore FILE');

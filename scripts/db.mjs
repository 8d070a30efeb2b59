// npm run db:stop — stops the project-local PostgreSQL cluster.
import { settings } from './lib/settings.mjs';
import { stopPostgres } from './lib/pg.mjs';

if (process.argv[2] === 'stop') stopPostgres(settings('dev'));
else console.log('usage: node scripts/db.mjs stop');

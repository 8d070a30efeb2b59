// The one job system: graphile-worker on the app's PostgreSQL. Jobs are rows in the graphile_worker
// schema (its own migrations, run by scripts/migrate.mjs), added with graphile_worker.add_job() in SQL
// so a job commits or rolls back with the change it reports. Every app server runs a worker in its
// own process; a worker takes a job with FOR UPDATE SKIP LOCKED, so each job runs in one of them.
import { Logger, run, type Runner, type Task, type TaskList } from 'graphile-worker';
import type { Transporter } from 'nodemailer';
import { sql } from 'drizzle-orm';
import { env } from '$env/dynamic/private';
import { SYNC_EXTRA_LEAD } from '../billing/accounts';
import { syncExtraLead } from '../billing/extra-leads';
import { sweep } from '../credentials';
import { purgeSentLinks } from '../email-tokens';
import { log } from '../log';
import { SEND_MAIL, sendOutboxMail } from '../mail';
import { CURING_REMINDER, sendCuringReminder } from '../reminders';
import { running } from './running';

/**
 * Recurring jobs (graphile-worker's cron: one job per slot, whichever worker claims it first):
 * the credential and respond-by sweep each hour (a missed hour is caught up on start), and the
 * blanking of sign-in links in mail already sent, each minute.
 */
export const CRONTAB = ['0 * * * * credential_sweep ?fill=1h&max=1', '* * * * * purge_sent_links ?max=1'].join('\n');

export interface JobOptions {
	/** The site's address, for links in mail a job writes. */
	origin: string;
	/** Jobs one worker runs at once. */
	concurrency?: number;
	/** Replaces the SMTP transport (tests). */
	transport?: Transporter;
	/** Runs the recurring jobs too (default true). */
	cron?: boolean;
}

export function taskList(o: Pick<JobOptions, 'origin' | 'transport'>): TaskList {
	const sendMail: Task = async (payload, helpers) => {
		const { id } = payload as { id: string };
		await sendOutboxMail(id, helpers.job.attempts, helpers.job.max_attempts, o.transport);
	};
	return {
		[SEND_MAIL]: sendMail,
		[CURING_REMINDER]: async (payload) => {
			await sendCuringReminder(payload as { planId: string; pourDate: string; day: string }, o.origin);
		},
		[SYNC_EXTRA_LEAD]: async (payload) => {
			await syncExtraLead((payload as { leadId: string }).leadId);
		},
		credential_sweep: async () => {
			await sweep(new Date(), o.origin);
		},
		purge_sent_links: async () => {
			await purgeSentLinks();
		}
	};
}

const levels = { error: 'error', warning: 'warn', info: 'info', debug: 'debug' } as const;
/** graphile-worker's log lines through the app's structured log; routine start-up chatter as debug. */
const logger = new Logger((scope) => (level, message, meta) => {
	const l = levels[level as keyof typeof levels] ?? 'info';
	log[l === 'info' ? 'debug' : l]({ job: scope, ...meta }, message);
});

/** Runs the credential sweep a few seconds after start, once however many servers start together. */
export const SWEEP_ON_START = sql`SELECT graphile_worker.add_job('credential_sweep', '{}'::json, run_at := now() + interval '5 seconds',
	job_key := 'credential_sweep:start', job_key_mode := 'preserve_run_at')`;

/** Starts a worker in this process. Call stop() on it before closing the database pool. */
export async function startWorker(o: JobOptions): Promise<Runner> {
	if (!env.DATABASE_URL) throw new Error('DATABASE_URL is not set');
	const runner = await run({
		connectionString: env.DATABASE_URL,
		concurrency: o.concurrency ?? 2,
		maxPoolSize: (o.concurrency ?? 2) + 2,
		// SvelteKit's adapter handles SIGTERM; the shutdown hook stops the worker.
		noHandleSignals: true,
		pollInterval: 5_000,
		logger,
		taskList: taskList(o),
		crontab: o.cron === false ? '' : CRONTAB
	});
	running.add(runner);
	// A worker that stops for good is logged; the app keeps serving (mail waits in the queue).
	runner.promise.catch((err) => log.error({ err }, 'job worker stopped'));
	return runner;
}

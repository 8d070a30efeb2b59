import type { CuringDay } from '$lib/plan/reminders';
import { formatDay } from '$lib/reader';
import { notice, type Mail } from './templates';

/** One curing day's reminder: what to do or what the slab can now take, each with its source. */
export function curingReminderMail(o: { name: string; planName: string; day: CuringDay; planUrl: string; stopUrl: string }): Mail {
	const when = `${formatDay(o.day.date, { locale: 'en-US' })}, day ${o.day.day} after the first pour`;
	return notice({
		subject: `${o.planName}: ${o.day.items.map((i) => i.title).join(' · ')}`,
		name: o.name,
		lines: [
			`Curing reminder for ${o.planName}: ${when}.`,
			...o.day.items.map((i) => `${i.title}. ${i.text} (${i.source})`),
			'Local codes and the product labels rule where they differ.'
		],
		action: 'Open the plan',
		url: o.planUrl,
		footer: 'You get these because you turned on e-mail curing reminders for this plan.',
		stop: { label: 'Stop curing reminders for this plan', url: o.stopUrl },
		kind: 'curing'
	});
}

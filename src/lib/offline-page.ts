// The page the service worker answers with when the phone is offline and the page asked for was not
// kept (a plan never opened here with a connection, or a page that is never kept, such as the
// editor). Plain HTML with its own styles, since no app script or server can run: it says what
// works without a connection and what does not, and links to the plans kept on this device.

import { tokens } from './palette';

/** A plan whose pages the service worker keeps: its plan page and, when kept too, its pour-day page. */
export interface KeptPlan {
	id: string;
	name: string;
	pour: boolean;
}

const escapeHtml = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;');
const unescapeHtml = (s: string) =>
	s
		.replace(/&lt;/g, '<')
		.replace(/&gt;/g, '>')
		.replace(/&quot;/g, '"')
		.replace(/&#39;/g, "'")
		.replace(/&amp;/g, '&');

/**
 * The plan's name from the <title> of a kept plan page ("Name · Stakeline") or pour-day page
 * ("Pour day · Name · Stakeline"); null when the page has no such title.
 */
export function planNameFromPage(html: string): string | null {
	const title = /<title>([^<]{1,400})<\/title>/.exec(html)?.[1];
	if (!title) return null;
	const name = unescapeHtml(title)
		.replace(/ · Stakeline$/, '')
		.replace(/^Pour day · /, '')
		.trim();
	return name || null;
}

/** The offline page for a request to `path` (the address that could not be reached). */
export function offlinePage(path: string, kept: readonly KeptPlan[]): string {
	const t = tokens;
	const plans = [...kept].sort((a, b) => a.name.localeCompare(b.name));
	const list = plans.length
		? `<h2>Kept on this device</h2>
<ul data-testid="kept-plans">${plans
				.map(
					(p) =>
						`<li><a href="/plans/${escapeHtml(p.id)}">${escapeHtml(p.name)}</a>${p.pour ? ` · <a href="/plans/${escapeHtml(p.id)}/pour">pour day</a>` : ''}</li>`
				)
				.join('')}</ul>`
		: `<h2>Kept on this device</h2>
<p data-testid="kept-plans">No plan yet. Open a plan once with a connection and it stays readable here.</p>`;
	return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>No connection · Stakeline</title>
<style>
body{margin:0;background:${t.paper};color:${t.ink};font:17px/1.5 ui-sans-serif,system-ui,sans-serif}
main{max-width:40rem;padding:1.5rem 1.25rem 3rem;margin:0 auto}
h1{font-size:1.875rem;line-height:1.2;margin:0 0 .75rem}
h2{font-size:1.25rem;margin:1.5rem 0 .5rem}
p{margin:.5rem 0}
.note{border:2px solid ${t.ink};background:${t['clay-50']};border-radius:.5rem;padding:.75rem 1rem;font-weight:700}
a{color:${t['moss-700']};font-weight:700}
ul{padding:0;list-style:none;margin:0}
li{border-bottom:1px solid ${t.line};padding:.25rem 0}
li a{display:inline-flex;align-items:center;min-height:44px}
.again{display:inline-flex;align-items:center;min-height:44px;padding:0 1rem;border-radius:.5rem;background:${t['moss-600']};color:#fff;text-decoration:none;margin-top:1rem}
.soft{color:${t['ink-soft']}}
</style>
</head>
<body>
<main>
<h1>No connection</h1>
<p class="note" data-testid="offline-page">This page is not kept on this device, so it cannot open without a connection.</p>
<p>A plan stays readable offline once it has been opened here with a connection: its plan page (build card, layout sheet, stake marks, day plan) and its pour-day page, where batches, temperatures, notes and photos are kept on the device and sent when the connection returns.</p>
${list}
<h2>Needs a connection</h2>
<p class="soft">Plans never opened on this device, editing a plan, bids and messages, and adding photos from the plan page (the pour-day page keeps them until the connection returns).</p>
<a class="again" href="${escapeHtml(path)}">Try again</a>
</main>
</body>
</html>
`;
}

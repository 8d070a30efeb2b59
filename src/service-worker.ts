/// <reference no-default-lib="true"/>
/// <reference lib="esnext" />
/// <reference lib="webworker" />
/// <reference types="@sveltejs/kit" />

// Keeps the plans a homeowner opened readable without a connection: the app shell (the build and
// the static files) cached at install, and each plan's page, sheets page and pour-day page (with their
// __data.json) and the plan list (the installed app's start page) cached as they load, network
// first. Registered from a plan's layout with the scope / so the list at /plans (outside /plans/) is
// covered too; every other request passes by untouched (no respondWith), except a navigation to any other page
// under /plans, which gets our own offline page (lib/offline-page.ts) when the network fails, as does a plan page
// with nothing kept. Records and photos made offline are not this worker's business: the pour page queues them on
// the device (localStorage, IndexedDB) and sends them itself; their POSTs pass by, so a failed send reaches the
// page as a network error and the photo stays queued.

import { build, files, version } from '$service-worker';
import { offlinePage, planNameFromPage, type KeptPlan } from '$lib/offline-page';

const sw = self as unknown as ServiceWorkerGlobalScope;
const SHELL = `shell-${version}`;
const PAGES = 'plan-pages';
const SHELL_FILES = new Set([...build, ...files]);

/** A page kept for offline use: the plan list, a plan itself, its pour-day page or its sheets (the
 *  layout sheet, stake marks and day plan the plan page opens on demand), HTML or data. */
const PLAN_PAGE = /^\/plans(\/[0-9a-f-]{36}(\/pour|\/sheets)?)?(\/__data\.json)?$/;
/** Pages a navigation to which gets the offline page rather than the browser's error when nothing is kept. */
const PLAN_AREA = /^\/plans(\/|$)/;

sw.addEventListener('install', (event) => {
	event.waitUntil(
		caches
			.open(SHELL)
			.then((cache) => cache.addAll([...SHELL_FILES]))
			// A new worker takes over at once: it only serves files of its own build, and old pages keep working
			// because their files stay in the network.
			.then(() => sw.skipWaiting())
	);
});

sw.addEventListener('activate', (event) => {
	event.waitUntil(
		(async () => {
			for (const key of await caches.keys()) if (key !== SHELL && key !== PAGES) await caches.delete(key);
			await sw.clients.claim();
		})()
	);
});

/** Keeps the latest copy of a plan page; the page data carries the time it was made. */
async function keep(request: Request | string, response: Response) {
	const cache = await caches.open(PAGES);
	await cache.put(request, response);
}

async function networkFirst(request: Request): Promise<Response> {
	const url = new URL(request.url);
	try {
		const response = await fetch(request);
		// Only a plain answer for the signed-in owner: not a redirect to sign in, not an error page.
		if (response.ok && !response.redirected && response.type === 'basic') await keep(request, response.clone());
		return response;
	} catch (e) {
		const cache = await caches.open(PAGES);
		const hit =
			(await cache.match(request, { ignoreVary: true })) ??
			// __data.json is asked for with the nodes the page needs; the full copy answers any of them.
			(await cache.match(url.origin + url.pathname, { ignoreVary: true }));
		if (hit) return hit;
		if (request.mode === 'navigate') return offline(url);
		throw e;
	}
}

/** The plans whose pages are kept, named from their kept pages' titles. */
async function keptPlans(): Promise<KeptPlan[]> {
	const cache = await caches.open(PAGES);
	const plans = new Map<string, KeptPlan>();
	for (const request of await cache.keys()) {
		const m = /^\/plans\/([0-9a-f-]{36})(\/pour)?$/.exec(new URL(request.url).pathname);
		if (!m) continue;
		const name = planNameFromPage(await ((await cache.match(request, { ignoreVary: true }))?.text() ?? ''));
		const plan = plans.get(m[1]) ?? { id: m[1], name: name ?? 'Plan', pour: false };
		if (m[2]) plan.pour = true;
		else if (name) plan.name = name;
		plans.set(m[1], plan);
	}
	return [...plans.values()];
}

/** Our own page for a navigation that cannot be answered offline: what works, and the plans kept here. */
async function offline(url: URL): Promise<Response> {
	return new Response(offlinePage(url.pathname + url.search, await keptPlans()), {
		status: 503,
		headers: { 'content-type': 'text/html; charset=utf-8', 'cache-control': 'no-store' }
	});
}

sw.addEventListener('fetch', (event) => {
	const request = event.request;
	if (request.method !== 'GET') return;
	const url = new URL(request.url);
	if (url.origin !== sw.location.origin) return;
	if (SHELL_FILES.has(url.pathname)) {
		event.respondWith(caches.match(request, { ignoreVary: true }).then((hit) => hit ?? fetch(request)));
		return;
	}
	if (PLAN_PAGE.test(url.pathname)) event.respondWith(networkFirst(request));
	else if (request.mode === 'navigate' && PLAN_AREA.test(url.pathname)) event.respondWith(fetch(request).catch(() => offline(url)));
});

/**
 * From a plan's page: { type: 'keep', urls } fetches those pages now so the plan's other pages are
 * there offline even if not opened yet; { type: 'forget' } drops every kept page (signed out).
 */
sw.addEventListener('message', (event) => {
	const msg = event.data as { type?: string; urls?: unknown } | null;
	if (msg?.type === 'keep' && Array.isArray(msg.urls)) {
		const urls = msg.urls.filter((u): u is string => typeof u === 'string' && PLAN_PAGE.test(u)).slice(0, 8);
		event.waitUntil(
			Promise.all(
				urls.map(async (u) => {
					try {
						const response = await fetch(u, { credentials: 'same-origin' });
						if (response.ok && !response.redirected) await keep(u, response);
					} catch {
						// Offline already: what is kept stays.
					}
				})
			)
		);
	} else if (msg?.type === 'forget') event.waitUntil(caches.delete(PAGES));
});

/** Page numbers from `?page=`: 1-based, anything odd is page 1. */
export function pageFrom(url: URL, size: number) {
	const n = Number(url.searchParams.get('page'));
	const page = Number.isInteger(n) && n > 0 && n < 100_000 ? n : 1;
	return { page, size, offset: (page - 1) * size };
}

/** The same address on another page, keeping every other search parameter. */
export function pageHref(url: URL, page: number) {
	const q = new URLSearchParams(url.searchParams);
	if (page <= 1) q.delete('page');
	else q.set('page', String(page));
	const s = q.toString();
	return s ? `?${s}` : url.pathname;
}

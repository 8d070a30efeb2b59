// The plan as a PDF, built on the server with pdfkit and Nunito embedded. Every line comes from the
// same row helpers as the plan page, so the download carries the page's numbers.

import { readFile } from 'node:fs/promises';
import { inflateSync } from 'node:zlib';
import { createRequire } from 'node:module';
import PDFDocument from 'pdfkit';
import type { PlanResult } from '$lib/plan';
import { layoutSheet, tapeLength } from '$lib/plan/layout-sheet';
import { buildCardItems } from '$lib/components/plan/buildCard';
import { GLOSSARY } from '$lib/components/plan/glossary';
import { LABEL_SIZE, layoutDrawing, type LayoutDrawing } from '$lib/components/plan/layoutDrawing';
import {
	DEFERRAL_FALLBACK,
	READY_MIX_HINT,
	SEVERITY_COLOR,
	SEVERITY_LABEL,
	crewItems,
	dayRows,
	diyTotal,
	fitText,
	formatDate,
	materialRows,
	milestoneRows,
	mixingRows,
	sortCautions,
	stakeIntro,
	stakeRows,
	strengthNote,
	summaryItems,
	type MilestoneRow
} from '$lib/components/plan/format';

const require = createRequire(import.meta.url);

// WOFF, not WOFF2: fontkit (pdfkit's font reader) throws while subsetting these WOFF2 files, and
// the WOFF2 ones hold the variable font rather than the static weights.
const FONT_FILES = { regular: 'nunito-latin-400-normal.woff', bold: 'nunito-latin-800-normal.woff' } as const;

interface Fonts {
	regular: Buffer;
	bold: Buffer;
	/** Code points the latin subset covers, from fontsource's own range list. */
	covers: (cp: number) => boolean;
}

/**
 * WOFF 1.0 to the plain TrueType it wraps. fontkit reads WOFF but inflates a table again on every
 * glyph lookup, which made each PDF take about half a second; unwrapped once, it reads in place.
 */
export function woffToSfnt(woff: Buffer): Buffer {
	if (woff.toString('latin1', 0, 4) !== 'wOFF') throw new Error('Not a WOFF 1.0 font');
	const count = woff.readUInt16BE(12);
	const tables = Array.from({ length: count }, (_, i) => {
		const at = 44 + i * 20;
		const [offset, compLength, origLength] = [4, 8, 12].map((k) => woff.readUInt32BE(at + k));
		const raw = woff.subarray(offset, offset + compLength);
		return { tag: woff.readUInt32BE(at), checksum: woff.readUInt32BE(at + 16), data: compLength < origLength ? inflateSync(raw) : raw };
	});
	const pad = (n: number) => (n + 3) & ~3;
	const dirLength = 12 + 16 * count;
	const out = Buffer.alloc(dirLength + tables.reduce((a, x) => a + pad(x.data.length), 0));
	const power = 2 ** Math.floor(Math.log2(count));
	out.writeUInt32BE(woff.readUInt32BE(4), 0); // flavor: the sfnt version
	out.writeUInt16BE(count, 4);
	out.writeUInt16BE(power * 16, 6);
	out.writeUInt16BE(Math.log2(power), 8);
	out.writeUInt16BE(count * 16 - power * 16, 10);
	let offset = dirLength;
	tables.forEach((x, i) => {
		const at = 12 + i * 16;
		out.writeUInt32BE(x.tag, at);
		out.writeUInt32BE(x.checksum, at + 4);
		out.writeUInt32BE(offset, at + 8);
		out.writeUInt32BE(x.data.length, at + 12);
		x.data.copy(out, offset);
		offset += pad(x.data.length);
	});
	return out;
}

let fonts: Promise<Fonts> | undefined;

function loadFonts(): Promise<Fonts> {
	fonts ??= (async () => {
		const file = (name: string) => readFile(require.resolve(`@fontsource/nunito/files/${name}`));
		const [regular, bold, unicode] = await Promise.all([
			file(FONT_FILES.regular),
			file(FONT_FILES.bold),
			readFile(require.resolve('@fontsource/nunito/unicode.json'), 'utf8')
		]);
		const ranges: Record<string, string> = JSON.parse(unicode);
		const spans = ranges.latin.split(',').map((r) => r.replace('U+', '').split('-').map((h) => parseInt(h, 16)));
		const covers = (cp: number) => spans.some(([lo, hi = lo]) => cp >= lo && cp <= hi);
		return { regular: woffToSfnt(regular), bold: woffToSfnt(bold), covers };
	})().catch((e) => {
		fonts = undefined;
		throw e;
	});
	return fonts;
}

// The latin subset has ¼ ½ ¾ but not eighths or math signs; spell those out rather than print boxes.
const SPELLED: Record<string, string> = { '⅛': '1/8', '⅜': '3/8', '⅝': '5/8', '⅞': '7/8', '≥': '>=', '≤': '<=', '→': '->' };

export function pdfText(s: string, covers: (cp: number) => boolean): string {
	return [...s.replace(/(\d)([⅛⅜⅝⅞])/g, '$1 $2')]
		.map((c) => (covers(c.codePointAt(0)!) ? c : (SPELLED[c] ?? '?')))
		.join('');
}

/** Stakeline tokens (src/app.css) for print. */
const C = {
	ink: '#1d2b25',
	soft: '#4a5a52',
	line: '#d9d3c4',
	moss: '#2f6b4f',
	mossLight: '#eef5ef',
	clay: '#b4562a',
	danger: '#a32626',
	sky: '#1f4e66'
} as const;

/**
 * The plan as PDF bytes. `createdAt`: when the plan was last saved; `madeAt`: when this PDF is
 * made (now by default); `locale`: the reader's, for dates (en-US by default).
 */
export async function planPdf(plan: { name: string; result: PlanResult; createdAt?: Date; madeAt?: Date; locale?: string }): Promise<Uint8Array> {
	const f = await loadFonts();
	const r = plan.result;
	const t = (s: string) => pdfText(s, f.covers);
	const doc = new PDFDocument({
		size: r.units === 'imperial' ? 'LETTER' : 'A4',
		margins: { top: 54, bottom: 64, left: 54, right: 54 },
		bufferPages: true,
		lang: 'en',
		displayTitle: true,
		info: { Title: plan.name, Subject: 'Concrete slab plan', Creator: 'Stakeline' }
	});
	// Always select fonts by these names: pdfkit caches a font per name, not per buffer.
	doc.registerFont('regular', f.regular);
	doc.registerFont('bold', f.bold);
	const chunks: Buffer[] = [];
	doc.on('data', (c: Buffer) => chunks.push(c));
	const done = new Promise<void>((resolve, reject) => {
		doc.on('end', resolve);
		doc.on('error', reject);
	});

	const left = doc.page.margins.left;
	const width = doc.page.width - left - doc.page.margins.right;
	const bottom = () => doc.page.height - doc.page.margins.bottom;
	const room = (h: number) => {
		if (doc.y + h > bottom()) doc.addPage();
	};
	const text = (s: string, o: { size?: number; bold?: boolean; color?: string; gap?: number } = {}) =>
		doc
			.font(o.bold ? 'bold' : 'regular')
			.fontSize(o.size ?? 10)
			.fillColor(o.color ?? C.ink)
			.text(t(s), left, doc.y, { width, paragraphGap: o.gap ?? 2 });
	const heading = (s: string) => {
		room(80);
		doc.moveDown(0.8);
		text(s, { size: 15, bold: true, color: C.moss, gap: 0 });
		doc.moveTo(left, doc.y + 1).lineTo(left + width, doc.y + 1).lineWidth(1).strokeColor(C.moss).stroke();
		doc.moveDown(0.5);
	};
	// Tables drawn by hand: pdfkit's own table re-opens the font from its buffer for every cell.
	const table = (head: string[] | null, rows: string[][], columns: (number | '*')[]) => {
		const fixed = columns.reduce<number>((a, c) => a + (c === '*' ? 0 : c), 0);
		const share = (width - fixed) / Math.max(1, columns.filter((c) => c === '*').length);
		const widths = columns.map((c) => (c === '*' ? share : c));
		const pad = 4;
		const row = (cells: string[], isHead: boolean) => {
			const texts = cells.map(t);
			doc.font(isHead ? 'bold' : 'regular').fontSize(9);
			const h = 2 * pad + Math.max(...texts.map((c, i) => doc.heightOfString(c, { width: widths[i] - 2 * pad })));
			if (doc.y + h > bottom()) {
				doc.addPage();
				if (head && !isHead) row(head, true); // repeat the header on the new page
				doc.font('regular').fontSize(9);
			}
			const y = doc.y;
			if (isHead) doc.rect(left, y, width, h).fill(C.mossLight);
			let x = left;
			texts.forEach((c, i) => {
				doc.fillColor(C.ink).text(c, x + pad, y + pad, { width: widths[i] - 2 * pad });
				x += widths[i];
			});
			doc.moveTo(left, y + h).lineTo(left + width, y + h).lineWidth(isHead ? 1 : 0.5).strokeColor(isHead ? C.moss : C.line).stroke();
			doc.x = left;
			doc.y = y + h;
		};
		room(40);
		if (head) row(head, true);
		for (const cells of rows) row(cells, false);
		doc.moveDown(0.5);
	};

	// Title and the deferral to local codes, first thing on the page.
	const { deferral, rest } = sortCautions(r.cautions);
	text(plan.name, { size: 24, bold: true, gap: 0 });
	const day = (d: Date) => formatDate(d.toISOString().slice(0, 10), plan.locale);
	text(
		[
			'Concrete slab plan',
			plan.createdAt ? `saved ${day(plan.createdAt)}` : '',
			`PDF made ${day(plan.madeAt ?? new Date())}`,
			`prices in ${r.currency ?? 'USD'}`
		]
			.filter(Boolean)
			.join(' · '),
		{ color: C.soft }
	);
	doc.moveDown(0.4);
	text(deferral ? `${deferral.title}. ${deferral.reason}` : DEFERRAL_FALLBACK, { size: 9, color: C.sky });

	// First page: the build card beside nothing else, then the drawing to lay the slab out by.
	const sheet = layoutSheet(r);
	if (r.slab) {
		heading('Build card');
		const cells = buildCardItems(r);
		const colW = width / 2;
		const top = doc.y;
		let rowTop = top;
		for (let i = 0; i < cells.length; i += 2) {
			let h = 0;
			for (const [k, c] of cells.slice(i, i + 2).entries()) {
				const x = left + k * colW;
				doc.font('regular').fontSize(8).fillColor(C.soft).text(t(c.label), x, rowTop, { width: colW - 8 });
				doc.font('bold').fontSize(12).fillColor(C.ink).text(t(c.value), x, doc.y, { width: colW - 8 });
				if (c.note) doc.font('regular').fontSize(8).fillColor(C.soft).text(t(c.note), x, doc.y, { width: colW - 8 });
				h = Math.max(h, doc.y - rowTop);
			}
			rowTop += h + 5;
		}
		doc.x = left;
		doc.y = rowTop;
	}
	// The key names only what the drawing holds: no house wall on a freestanding pad, no diagonals on an L.
	const key = [
		r.geometry.houseEdges.length ? 'brown: house wall' : '',
		'dashed black: control joints',
		'blue: cold joints',
		sheet.diagonals.length ? 'grey dashes: diagonals' : '',
		'squares: stakes, numbered as in the stake marks',
		'R ids: boards as in the cut list'
	].filter(Boolean).join('; ');
	const legend = `Start at corner ${sheet.start.corner} (${sheet.start.why}, circled). ${sheet.highEdge ? `Green dashes: the high side, edge ${sheet.highEdge}; the top falls away from it. ` : ''}${key[0].toUpperCase()}${key.slice(1)}.`;
	// Room below the drawing for its legend, measured, so the legend never spills onto a page of its own.
	const legendHeight = doc.font('regular').fontSize(8).heightOfString(t(legend), { width, paragraphGap: 2 }) + 8;
	room(60 + 160 + legendHeight); // heading, the smallest drawing and its legend together
	heading('Layout drawing');
	const drawing = layoutDrawing(r, sheet, { width, height: Math.max(160, bottom() - doc.y - legendHeight) });
	const drawingTop = doc.y;
	drawLayout(doc, drawing, { x: left + (width - drawing.width) / 2, y: drawingTop, t });
	// Its labels are placed with doc.text, which moves doc.y: continue below the drawing's box.
	doc.y = drawingTop + drawing.height + 4;
	text(legend, { size: 8, color: C.soft });

	doc.addPage();
	heading('Layout sheet');
	const tape = (l: { feet: number; meters: number }) => tapeLength(l, r.units);
	const check = sheet.squareCheck;
	if (check)
		text(
			`Squaring the first corner${check.ratio ? ` (${check.ratio})` : ''}: from corner ${check.corner}, mark ${tape(check.legA)} along ${check.edges[0]} and ${tape(check.legB)} along ${check.edges[1]}; the marks are ${tape(check.diagonal)} apart when the corner is as drawn${check.ratio ? ' (square)' : ` (${Math.round(check.angle * 10) / 10}°)`}.`,
			{ bold: true }
		);
	for (const d of sheet.diagonals)
		text(`Diagonals of ${d.name}: ${d.first.from}–${d.first.to} ${tape(d.first.length)}, ${d.second.from}–${d.second.to} ${tape(d.second.length)}${d.square ? ' (equal: square)' : ''}.`);
	doc.moveDown(0.3);
	table(
		['Stake', 'Board', 'From corner, along', 'Distance'],
		sheet.stakes.map((s) => [s.id, s.board, `${s.from}, along ${s.along}`, tape(s.distance)]),
		[50, 50, '*', 110]
	);
	table(
		['Board', 'Edge', 'Kind', 'Length'],
		sheet.boards.map((b) => [b.id, b.edge, b.formed ? b.kind : 'isolation strip, no board', tape(b.length)]),
		[50, 70, '*', 110]
	);

	heading('Summary');
	table(
		null,
		summaryItems(r).map((i) => [i.label, i.note ? `${i.value}\n${i.note}` : i.value]),
		[150, '*']
	);

	heading('Stake marks');
	text(stakeIntro(r));
	doc.moveDown(0.3);
	table(
		['Stake', 'On', 'Position (x, y)', `Height vs. ${r.elevations.reference.label}`, 'Below level line'],
		stakeRows(r).map((s) => [s.high ? `${s.id} (high)` : s.id, s.where, s.position, s.elevation, s.belowLine]),
		[48, '*', 128, 84, 72]
	);

	heading('Mixing plan');
	text(crewItems(r).map((i) => `${i.label}: ${i.value}${i.note ? ` (${i.note})` : ''}`).join('  ·  '));
	if (r.mixing.readyMixSuggested) text(READY_MIX_HINT, { bold: true, color: C.clay });
	doc.moveDown(0.3);
	const mixing = mixingRows(r);
	table(
		['Section', 'Bags', 'Mixing', 'Placing', 'Mix and place', 'Working time'],
		mixing.map((m) => [m.name, m.bags, m.mixing, m.placing, m.total, m.working]),
		['*', 110, 56, 56, 70, 90]
	);
	for (const m of mixing) {
		room(40);
		text(`${m.name}: ${fitText(m)}`, { bold: true, color: m.fits ? C.moss : C.danger });
		if (m.split) text(`Suggested split: ${m.split}. ${m.splitNote}`);
	}

	heading('Day by day');
	for (const d of dayRows(r, plan.locale)) {
		room(36);
		text([d.label, d.date, d.pour ? 'pour day' : ''].filter(Boolean).join(' · '), { bold: true, color: d.pour ? C.moss : C.ink, gap: 0 });
		doc.font('regular').fontSize(10).fillColor(C.ink);
		doc.list(d.tasks.map((k) => t(k.text)), left + 6, doc.y, { width: width - 6, bulletRadius: 1.6, textIndent: 10, paragraphGap: 1 });
		doc.x = left;
		doc.moveDown(0.4);
	}

	heading('Strength over time');
	const stones = milestoneRows(r, plan.locale);
	strengthChart(doc, r.strength, stones, { x: left, width, t });
	const over = strengthNote(r.strength);
	if (over) text(over, { size: 8, color: C.soft, gap: 6 });
	table(
		['#', 'Milestone', 'When', 'Strength then', 'Rule and source'],
		stones.map((m, i) => [String(i + 1), m.title, m.when, m.strength ?? '—', `${m.rule}; ${m.source}`]),
		[18, 90, '*', 60, 150]
	);

	heading('Materials');
	const total = diyTotal(r);
	table(
		['Material', 'Quantity', 'Cost'],
		[
			...materialRows(r).map((m) => [m.note ? `${m.name}\n${m.note}` : m.name, m.quantity, m.cost ?? '—']),
			...(total ? [['Do-it-yourself total', '', total.amount]] : [])
		],
		['*', 110, 80]
	);
	if (total?.note) text(`Total ${total.note}.`, { size: 9, color: C.soft });
	doc.moveDown(0.3);
	table(
		['Tool', 'Count', 'What for'],
		r.materials.tools.map((k) => [k.name, String(k.count), k.why]),
		['*', 44, 200]
	);

	heading('Cautions');
	for (const c of deferral ? [deferral, ...rest] : rest) {
		room(70);
		// The signal word on its ANSI Z535 colour, as on a hazard label; the title in ink beside it.
		const word = t(SEVERITY_LABEL[c.severity].toUpperCase());
		doc.font('bold').fontSize(8);
		const w = doc.widthOfString(word) + 8;
		const y = doc.y;
		doc.rect(left, y + 1, w, 12).fill(SEVERITY_COLOR[c.severity]);
		doc.fillColor(c.severity === 'warning' ? '#000000' : '#ffffff').text(word, left + 4, y + 3.5, { lineBreak: false });
		doc.font('bold').fontSize(11).fillColor(C.ink).text(t(c.title), left + w + 6, y, { width: width - w - 6, paragraphGap: 1 });
		doc.x = left;
		text(c.reason);
		text(`What to do: ${c.action}`);
		text(`Source: ${c.source}`, { size: 9, color: C.soft, gap: 8 });
	}
	if (!deferral) text(DEFERRAL_FALLBACK, { bold: true, color: C.sky });

	heading('Trade words in plain language');
	for (const g of GLOSSARY) {
		room(40);
		text(g.term, { bold: true, gap: 0 });
		text(g.plain, { gap: g.source ? 0 : 5 });
		if (g.source) text(`Source: ${g.source}`, { size: 8, color: C.soft, gap: 5 });
	}

	// Footer on every page: the plan, the page count, and the reminder that local rules come first.
	const pages = doc.bufferedPageRange();
	for (let i = 0; i < pages.count; i++) {
		doc.switchToPage(pages.start + i);
		const y = doc.page.height - doc.page.margins.bottom + 18;
		doc.page.margins.bottom = 0; // writing below the margin must not open a new page
		doc.font('regular').fontSize(8).fillColor(C.soft);
		doc.text(t(`${plan.name} · Stakeline · page ${i + 1} of ${pages.count}`), left, y, { width, lineBreak: false });
		doc.text(t(deferral?.title ?? DEFERRAL_FALLBACK), left, y + 11, { width, lineBreak: false });
	}
	doc.end();
	await done;
	return new Uint8Array(Buffer.concat(chunks));
}

/** A small vector line chart of percent strength by day, milestones as numbered dashed lines. */
function strengthChart(
	doc: InstanceType<typeof PDFDocument>,
	days: PlanResult['strength'],
	stones: MilestoneRow[],
	o: { x: number; width: number; t: (s: string) => string }
) {
	const h = 130;
	if (doc.y + h + 40 > doc.page.height - doc.page.margins.bottom) doc.addPage();
	const top = doc.y + 8;
	const x0 = o.x + 30;
	const w = o.width - 40;
	// Warm weather can pass 100 % before day 28: grow the axis in steps of 25 %.
	const yMax = Math.max(100, Math.ceil(Math.max(...days.map((d) => d.percent)) / 25) * 25);
	const px = (day: number) => x0 + (day / days.length) * w;
	const py = (pct: number) => top + h - (pct / yMax) * h;
	doc.save().lineWidth(0.5).strokeColor(C.line);
	for (let pct = 0; pct <= yMax; pct += 25) {
		doc.moveTo(x0, py(pct)).lineTo(x0 + w, py(pct)).stroke();
		doc.font('regular').fontSize(7).fillColor(C.soft).text(`${pct} %`, o.x, py(pct) - 3, { width: 26, align: 'right', lineBreak: false });
	}
	for (let d = 0; d <= days.length; d += 7)
		doc.text(String(d), px(d) - 10, top + h + 4, { width: 20, align: 'center', lineBreak: false });
	doc.text(o.t('Days after the last pour'), x0, top + h + 14, { width: w, align: 'center', lineBreak: false });
	stones.forEach((m, i) => {
		if (m.day === null || m.percent === undefined) return;
		doc.save().dash(3, { space: 3 }).strokeColor(C.clay).moveTo(px(m.day), top).lineTo(px(m.day), top + h).stroke().restore();
		doc.font('bold').fontSize(8).fillColor(C.clay).text(String(i + 1), px(m.day) + 2, top + 2 + (i % 3) * 9, { lineBreak: false });
	});
	doc.lineWidth(1.5).strokeColor(C.moss);
	days.forEach((d, i) => (i ? doc.lineTo(px(d.day), py(d.percent)) : doc.moveTo(px(d.day), py(d.percent))));
	doc.stroke().restore();
	doc.x = o.x;
	doc.y = top + h + 32;
}

/** The layout drawing in vector: the same shapes the plan page draws as SVG. */
function drawLayout(doc: InstanceType<typeof PDFDocument>, d: LayoutDrawing, o: { x: number; y: number; t: (s: string) => string }) {
	const P = (p: readonly [number, number]): [number, number] => [o.x + p[0], o.y + p[1]];
	const seg = (l: { from: readonly [number, number]; to: readonly [number, number] }) => doc.moveTo(...P(l.from)).lineTo(...P(l.to));
	doc.save();
	for (const s of d.slabs) {
		doc.polygon(...s.map(P)).lineWidth(1.2).fillAndStroke(C.mossLight, C.ink);
	}
	doc.lineWidth(0.6).strokeColor(C.soft).dash(2, { space: 3 });
	for (const l of d.diagonals) seg(l).stroke();
	doc.lineWidth(0.9).strokeColor(C.ink).dash(5, { space: 3 });
	for (const l of d.joints) seg(l).stroke();
	doc.undash().lineWidth(2.5).strokeColor(C.sky);
	for (const l of d.coldJoints) seg(l).stroke();
	doc.lineWidth(5).strokeColor(C.clay);
	for (const l of d.house) seg(l).stroke();
	if (d.high) {
		doc.lineWidth(4).strokeColor(C.moss).dash(8, { space: 3 });
		seg(d.high).stroke();
		doc.undash();
	}
	if (d.start) doc.lineWidth(2).strokeColor(C.moss).circle(...P(d.start), 7).stroke();
	doc.fillColor(C.sky);
	for (const s of d.stakes) doc.rect(P(s.at)[0] - 2, P(s.at)[1] - 2, 4, 4).fill();
	// Sizes from the drawing (LABEL_SIZE), which placed each label clear of the lines at that size.
	const FONT = { corner: ['bold', C.ink], board: ['bold', C.clay], length: ['regular', C.soft], stake: ['regular', C.sky], high: ['bold', C.moss] } as const;
	for (const l of d.labels) {
		const [font, color] = FONT[l.kind];
		const size = LABEL_SIZE[l.kind];
		doc.font(font).fontSize(size).fillColor(color);
		const txt = o.t(l.text);
		const w = doc.widthOfString(txt);
		const [x, y] = P(l.at);
		doc.text(txt, x - w / 2, y - size / 2, { lineBreak: false });
	}
	doc.restore();
}

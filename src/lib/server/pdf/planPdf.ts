// The plan as a PDF document, built on the server with pdfkit and Nunito embedded (fonts.ts), its
// pages written by layout.ts. Every line comes from the same rows as the plan page (lib/plan-view),
// so the download carries the page's numbers.

import PDFDocument from 'pdfkit';
import { print } from '$lib/palette';
import type { PlanResult } from '$lib/plan';
import { layoutSheet, tapeLength } from '$lib/plan/layout-sheet';
import { buildCardItems } from '$lib/plan-view/buildCard';
import { GLOSSARY } from '$lib/plan-view/glossary';
import { layoutDrawing } from '$lib/plan-view/layoutDrawing';
import {
	DEFERRAL_FALLBACK,
	READY_MIX_HINT,
	SEVERITY_COLOR,
	SEVERITY_LABEL,
	crewItems,
	dayRows,
	planDiyTotal,
	fitText,
	formatDate,
	materialRows,
	milestoneRows,
	mixingRows,
	sortCautions,
	stakeIntro,
	stakeRows,
	strengthChartGeometry,
	strengthNote,
	summaryItems
} from '$lib/plan-view';
import { loadFonts, pdfText } from './fonts';
import { drawLayout, drawStrengthChart, pageWriter } from './layout';

/** Stakeline tokens for print (lib/palette.ts). */
const C = print;

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

	const { left, width, bottom, room, text, heading, table } = pageWriter(doc, t);
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
				doc
					.font('regular')
					.fontSize(8)
					.fillColor(C.soft)
					.text(t(c.label), x, rowTop, { width: colW - 8 });
				doc
					.font('bold')
					.fontSize(12)
					.fillColor(C.ink)
					.text(t(c.value), x, doc.y, { width: colW - 8 });
				if (c.note)
					doc
						.font('regular')
						.fontSize(8)
						.fillColor(C.soft)
						.text(t(c.note), x, doc.y, { width: colW - 8 });
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
	]
		.filter(Boolean)
		.join('; ');
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
		text(
			`Diagonals of ${d.name}: ${d.first.from}–${d.first.to} ${tape(d.first.length)}, ${d.second.from}–${d.second.to} ${tape(d.second.length)}${d.square ? ' (equal: square)' : ''}.`
		);
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
	text(
		crewItems(r)
			.map((i) => `${i.label}: ${i.value}${i.note ? ` (${i.note})` : ''}`)
			.join('  ·  ')
	);
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
		doc.list(
			d.tasks.map((k) => t(k.text)),
			left + 6,
			doc.y,
			{ width: width - 6, bulletRadius: 1.6, textIndent: 10, paragraphGap: 1 }
		);
		doc.x = left;
		doc.moveDown(0.4);
	}

	heading('Strength over time');
	const stones = milestoneRows(r, plan.locale);
	drawStrengthChart(doc, strengthChartGeometry(r.strength, stones), { x: left, width, t });
	const over = strengthNote(r.strength);
	if (over) text(over, { size: 8, color: C.soft, gap: 6 });
	table(
		['#', 'Milestone', 'When', 'Strength then', 'Rule and source'],
		stones.map((m, i) => [String(i + 1), m.title, m.when, m.strength ?? '—', `${m.rule}; ${m.source}`]),
		[18, 90, '*', 60, 150]
	);

	heading('Materials');
	const total = planDiyTotal(r, 'homeowner');
	table(
		['Material', 'Quantity', 'Cost'],
		[
			...materialRows(r).map((m) => [m.note ? `${m.name}\n${m.note}` : m.name, m.quantity, m.cost ?? '—']),
			...(total ? [['Do-it-yourself total', '', total.value]] : [])
		],
		['*', 110, 80]
	);
	if (total?.detail) text(`Total: ${total.detail}.`, { size: 9, color: C.soft });
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
		doc
			.font('bold')
			.fontSize(11)
			.fillColor(C.ink)
			.text(t(c.title), left + w + 6, y, { width: width - w - 6, paragraphGap: 1 });
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

export { pdfText, woffToSfnt } from './fonts';

// The plan PDF's layout: a page writer (text, headings, tables that break across pages) and the
// two vector drawings, the strength chart and the layout drawing, in Stakeline's print colours.

import type PDFDocument from 'pdfkit';
import { print as C } from '$lib/palette';
import type { LayoutDrawing } from '$lib/plan-view/layoutDrawing';
import type { StrengthChart } from '$lib/plan-view';

export type Doc = InstanceType<typeof PDFDocument>;

/** Text, headings and tables written down the page from the left margin; `t` maps text onto the font. */
export function pageWriter(doc: Doc, t: (s: string) => string) {
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
		doc
			.moveTo(left, doc.y + 1)
			.lineTo(left + width, doc.y + 1)
			.lineWidth(1)
			.strokeColor(C.moss)
			.stroke();
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
			doc
				.moveTo(left, y + h)
				.lineTo(left + width, y + h)
				.lineWidth(isHead ? 1 : 0.5)
				.strokeColor(isHead ? C.moss : C.line)
				.stroke();
			doc.x = left;
			doc.y = y + h;
		};
		room(40);
		if (head) row(head, true);
		for (const cells of rows) row(cells, false);
		doc.moveDown(0.5);
	};
	return { left, width, bottom, room, text, heading, table };
}

/** A small vector line chart of percent strength by day, milestones as numbered dashed lines: the page's chart geometry, drawn for print. */
export function drawStrengthChart(doc: Doc, chart: StrengthChart, o: { x: number; width: number; t: (s: string) => string }) {
	const h = 130;
	if (doc.y + h + 40 > doc.page.height - doc.page.margins.bottom) doc.addPage();
	const top = doc.y + 8;
	const x0 = o.x + 30;
	const w = o.width - 40;
	const px = (day: number) => x0 + (day / chart.x.max) * w;
	const py = (pct: number) => top + h - (pct / chart.y.max) * h;
	doc.save().lineWidth(0.5).strokeColor(C.line);
	for (const pct of chart.y.ticks) {
		doc
			.moveTo(x0, py(pct))
			.lineTo(x0 + w, py(pct))
			.stroke();
		doc
			.font('regular')
			.fontSize(7)
			.fillColor(C.soft)
			.text(`${pct} %`, o.x, py(pct) - 3, { width: 26, align: 'right', lineBreak: false });
	}
	for (const d of chart.x.ticks) doc.text(String(d), px(d) - 10, top + h + 4, { width: 20, align: 'center', lineBreak: false });
	doc.text(o.t(chart.x.title), x0, top + h + 14, { width: w, align: 'center', lineBreak: false });
	for (const { day, label } of chart.lines) {
		doc
			.save()
			.dash(3, { space: 3 })
			.strokeColor(C.clay)
			.moveTo(px(day), top)
			.lineTo(px(day), top + h)
			.stroke()
			.restore();
		doc
			.font('bold')
			.fontSize(8)
			.fillColor(C.clay)
			.text(o.t(label), px(day) + 2, top + 2, { lineBreak: false });
	}
	doc.lineWidth(1.5).strokeColor(C.moss);
	chart.points.forEach((p, i) => (i ? doc.lineTo(px(p.day), py(p.percent)) : doc.moveTo(px(p.day), py(p.percent))));
	doc.stroke().restore();
	doc.x = o.x;
	doc.y = top + h + 32;
}

/** The layout drawing in vector: the same shapes the plan page draws as SVG. */
export function drawLayout(doc: Doc, d: LayoutDrawing, o: { x: number; y: number; t: (s: string) => string }) {
	const P = (p: readonly [number, number]): [number, number] => [o.x + p[0], o.y + p[1]];
	const seg = (l: { from: readonly [number, number]; to: readonly [number, number] }) => doc.moveTo(...P(l.from)).lineTo(...P(l.to));
	doc.save();
	for (const s of d.slabs) {
		doc
			.polygon(...s.map(P))
			.lineWidth(1.2)
			.fillAndStroke(C.mossLight, C.ink);
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
	if (d.start)
		doc
			.lineWidth(2)
			.strokeColor(C.moss)
			.circle(...P(d.start), 7)
			.stroke();
	doc.fillColor(C.sky);
	for (const s of d.stakes) doc.rect(P(s.at)[0] - 2, P(s.at)[1] - 2, 4, 4).fill();
	// Sizes from the drawing (labelSize), which placed each label clear of the lines at that size.
	const FONT = { corner: ['bold', C.ink], board: ['bold', C.clay], length: ['regular', C.soft], stake: ['regular', C.sky], high: ['bold', C.moss] } as const;
	for (const l of d.labels) {
		const [font, color] = FONT[l.kind];
		const size = d.labelSize[l.kind];
		doc.font(font).fontSize(size).fillColor(color);
		const txt = o.t(l.text);
		const w = doc.widthOfString(txt);
		const [x, y] = P(l.at);
		doc.text(txt, x - w / 2, y - size / 2, { lineBreak: false });
	}
	doc.restore();
}

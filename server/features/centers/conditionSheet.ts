import path from 'node:path';
import { createRequire } from 'node:module';
import PDFDocument from 'pdfkit';
import { oilGrid } from '../../../engine/index';
import { weekdaysText, type Center, type Condition, type LaneGroup } from '../../../shared/centers';
import { laneRanges } from './lanes';

const require = createRequire(import.meta.url);
const fontDir = path.join(path.dirname(require.resolve('@fontsource/source-sans-3/package.json')), 'files');
const FONT_REGULAR = path.join(fontDir, 'source-sans-3-latin-400-normal.woff');
const FONT_BOLD = path.join(fontDir, 'source-sans-3-latin-700-normal.woff');

const TEAL = '#0f5f5c';
const INK = '#111';
const MUTED = '#333';
const PAGE_BOTTOM = 842 - 48;
/** The oil map keeps this size whatever the notes: they flow below it (and onto the next page). */
const CELL_W = 6;
const MAP_W = 39 * CELL_W;
const MAP_H = 230;
/** Target arrows on boards 5–35 in fives at about 15 ft, as the screen's oil map draws them — common practice. */
const ARROWS = [5, 10, 15, 20, 25, 30, 35].map((b) => ({ board: b, ft: 15 }));
/** Approach-side dots on the lane at about 7 ft — common practice. */
const DOTS = [3, 5, 8, 11, 14, 26, 29, 32, 35, 37].map((b) => ({ board: b, ft: 7 }));

/**
 * Pale (no oil) to deep (heavy) blue. The lightness falls steadily with the oil, so a grey print keeps the order;
 * the dry band is hatched on top, so it shows even where grey printing turns the palest blues white.
 */
function oilColour(t: number): string {
  const c = Math.max(0, Math.min(1, t));
  const mix = (a: number, b: number) => Math.round(a + (b - a) * c);
  return `#${[mix(0xe6, 0x0b), mix(0xee, 0x2a), mix(0xf7, 0x6e)].map((v) => v.toString(16).padStart(2, '0')).join('')}`;
}

type Doc = PDFKit.PDFDocument;

function scheduleText(c: Condition, until: string | null): string {
  const days = weekdaysText(c.weekdays);
  const end = c.validTo ?? until;
  return `${c.validFrom}${end ? ` to ${end}` : ' until further notice'}${days ? `, on ${days}` : ''}`;
}

function numbersText(c: Condition): string {
  const s = c.pattern.summary;
  return [
    `Length ${s.lengthFt} ft (${s.lengthClass})`,
    `volume ${s.volumeMl.toFixed(2)} mL (${s.volumeClass})`,
    `forward / reverse ${s.forwardMl.toFixed(2)} / ${s.reverseMl.toFixed(2)} mL`,
    `ratio ${s.ratio === null ? 'no oil outside' : `${s.ratio.toFixed(1)} : 1`} (${s.ratioClass}; boards 18–22 vs 3–7 and 33–37)`,
  ].join(' · ');
}

/** Diagonal hatching inside a rectangle (dark lines survive any grey print). */
function hatch(doc: Doc, x: number, y: number, w: number, h: number): void {
  doc.save();
  doc.rect(x, y, w, h).clip();
  doc.lineWidth(0.6).strokeColor('#222');
  for (let d = -h; d < w; d += 4)
    doc
      .moveTo(x + d, y + h)
      .lineTo(x + d + h, y)
      .stroke();
  doc.restore();
}

function arrowMark(doc: Doc, cx: number, cy: number): void {
  doc
    .save()
    .lineWidth(0.8)
    .strokeColor('#000')
    .fillColor('#fff')
    .polygon([cx, cy - 5], [cx - 3, cy + 3], [cx + 3, cy + 3])
    .fillAndStroke()
    .restore();
}

function dotMark(doc: Doc, cx: number, cy: number): void {
  doc.save().lineWidth(0.8).strokeColor('#000').fillColor('#fff').circle(cx, cy, 2.2).fillAndStroke().restore();
}

/** The oil map of one publication at (x, y): boards across (board 39 left, as seen from the approach), feet up. */
function oilMap(doc: Doc, c: Condition, x: number, y: number): void {
  const s = c.pattern.summary;
  const maxFt = Math.min(60, Math.max(20, Math.ceil(s.lengthFt) + 4));
  const grid = oilGrid({ name: c.pattern.name, sweeps: c.pattern.sweeps }, { boardStep: 1, ftStep: 1, maxFt });
  let peak = 0;
  for (const col of grid.values) for (const v of col) peak = Math.max(peak, v);
  const cellH = MAP_H / grid.ft.length;
  const bx = (board: number) => x + (39 - board) * CELL_W;
  const fy = (ft: number) => y + MAP_H - (ft / maxFt) * MAP_H;
  grid.boards.forEach((board, bi) =>
    grid.ft.forEach((_, fi) => {
      const v = grid.values[bi][fi];
      doc.rect(bx(board), y + MAP_H - (fi + 1) * cellH, CELL_W, cellH).fill(oilColour(peak > 0 ? v / peak : 0));
    }),
  );
  // The dry outside band: boards whose oil over the pattern's length is under a tenth of the heaviest board's.
  const oiledFt = Math.max(1, Math.min(maxFt, Math.round(s.lengthFt)));
  const perBoard = grid.values.map((col) => col.slice(0, oiledFt + 1).reduce((a, b) => a + b, 0));
  const heaviest = Math.max(...perBoard);
  grid.boards.forEach((board, bi) => {
    if (heaviest > 0 && perBoard[bi] < heaviest * 0.1) hatch(doc, bx(board), fy(oiledFt), CELL_W, fy(0) - fy(oiledFt));
  });
  for (const a of ARROWS) if (a.ft <= maxFt) arrowMark(doc, bx(a.board) + CELL_W / 2, fy(a.ft));
  for (const d of DOTS) if (d.ft <= maxFt) dotMark(doc, bx(d.board) + CELL_W / 2, fy(d.ft));
  doc.lineWidth(0.5).strokeColor('#444').rect(x, y, MAP_W, MAP_H).stroke();
  doc
    .lineWidth(1.2)
    .strokeColor('#000')
    .moveTo(x, fy(0))
    .lineTo(x + MAP_W, fy(0))
    .stroke();
  doc.font('body').fontSize(8).fillColor(MUTED);
  for (const ft of [0, 10, 20, 30, 40, 50, 60].filter((f) => f <= maxFt))
    doc.text(`${ft} ft`, x - 32, fy(ft) - 4, { width: 28, align: 'right', lineBreak: false });
  doc.text('board 39', x, y + MAP_H + 3, { lineBreak: false });
  doc.text('board 1', x + MAP_W - 30, y + MAP_H + 3, { lineBreak: false });
  doc.text('foul line', x + MAP_W / 2 - 15, y + MAP_H + 3, { lineBreak: false });
}

/** The legend beside the first map: the oil scale, the dry band, arrows and dots. */
function legend(doc: Doc, x: number, y: number): void {
  doc.font('bold').fontSize(10).fillColor(INK).text('Legend', x, y, { lineBreak: false });
  let yy = y + 16;
  for (let i = 0; i < 10; i++) doc.rect(x + i * 9, yy, 9, 10).fill(oilColour(i / 9));
  doc.lineWidth(0.5).strokeColor('#444').rect(x, yy, 90, 10).stroke();
  doc
    .font('body')
    .fontSize(8.5)
    .fillColor(MUTED)
    .text('Oil: light (little) to dark (most)', x + 96, yy + 1, { lineBreak: false });
  yy += 16;
  doc.rect(x, yy, 18, 10).fill('#fff');
  hatch(doc, x, yy, 18, 10);
  doc.lineWidth(0.5).strokeColor('#444').rect(x, yy, 18, 10).stroke();
  doc.fillColor(MUTED).text('Dry outside boards (hatched)', x + 24, yy + 1, { lineBreak: false });
  yy += 16;
  arrowMark(doc, x + 9, yy + 5);
  doc.fillColor(MUTED).text('Arrows (about 15 ft)', x + 24, yy + 1, { lineBreak: false });
  yy += 16;
  dotMark(doc, x + 9, yy + 5);
  doc.fillColor(MUTED).text('Dots (about 7 ft)', x + 24, yy + 1, { lineBreak: false });
}

/**
 * The front-desk sheet of a center's condition (A4, fonts embedded): every lane group with its pattern, schedule,
 * lane surface, numbers, oil map (fixed size, with arrows, dots and the dry band hatched), what comes next and its
 * notes (which flow on below the map and onto the next page), a legend and the approach caution. Prints legibly in grey.
 */
export function conditionSheetPdf(center: Center, groups: LaneGroup[], when: { timeZone: string; today: string }): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const first = groups.find((g) => g.current)?.current;
    const doc = new PDFDocument({
      size: 'A4',
      margin: 48,
      info: { Title: `${center.name} — lane condition`, Author: 'Lanewright', Subject: first?.pattern.name ?? 'Lane condition' },
    });
    const chunks: Buffer[] = [];
    doc.on('data', (b: Buffer) => chunks.push(b));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    doc.registerFont('body', FONT_REGULAR);
    doc.registerFont('bold', FONT_BOLD);
    const x0 = 48;
    const width = 595 - 96;

    doc.font('bold').fontSize(22).fillColor(TEAL).text(center.name, x0);
    doc
      .font('body')
      .fontSize(11)
      .fillColor(MUTED)
      .text(
        `${center.town} · lane condition on ${when.today} (${when.timeZone}) · ${groups.length} lane group${groups.length === 1 ? '' : 's'}`,
      );
    doc.moveDown(0.6);

    groups.forEach((g, i) => {
      const c = g.current ?? g.next?.condition ?? null;
      if (!c) return;
      // A group's heading, details and map stay together; only its notes may run on.
      if (doc.y + 130 + MAP_H > PAGE_BOTTOM) doc.addPage();
      const top = doc.y;
      doc
        .lineWidth(1)
        .strokeColor(TEAL)
        .moveTo(x0, top)
        .lineTo(x0 + width, top)
        .stroke();
      doc.y = top + 6;
      doc
        .font('bold')
        .fontSize(15)
        .fillColor(INK)
        .text(`Lanes ${laneRanges(g.lanes)}: ${g.current ? g.current.pattern.name : 'nothing in force today'}`, x0, doc.y, { width });
      doc.font('body').fontSize(10.5).fillColor(INK);
      if (g.current) {
        doc.text(`In force: ${scheduleText(g.current, g.currentUntil)}`, { width });
        doc.text(`Lane surface: ${g.current.laneText}`, { width });
        doc.text(numbersText(g.current), { width });
      }
      if (g.next)
        doc.text(
          `Next, from ${g.next.from}: ${g.next.condition.pattern.name} (${scheduleText(g.next.condition, null)}; ${g.next.condition.laneText})`,
          { width },
        );
      const mapTop = doc.y + 18;
      doc
        .font('bold')
        .fontSize(10)
        .fillColor(INK)
        .text(`Oil map of ${c.pattern.name} (foul line at the bottom)`, x0, mapTop - 14, { lineBreak: false });
      oilMap(doc, c, x0 + 34, mapTop);
      if (i === 0) legend(doc, x0 + 34 + MAP_W + 24, mapTop);
      doc.y = mapTop + MAP_H + 18;
      doc.x = x0;
      const notes = g.current?.notes ?? (g.current ? null : g.next?.condition.notes);
      if (notes) {
        doc.font('bold').fontSize(10.5).fillColor(INK).text('Notes', x0, doc.y, { width });
        doc.font('body').text(notes, x0, doc.y, { width });
      }
      doc.moveDown(1);
    });

    if (doc.y + 40 > PAGE_BOTTOM) doc.addPage();
    doc
      .font('body')
      .fontSize(9)
      .fillColor('#5c3900')
      .text(
        'Caution: oil carried onto the approach and onto shoes causes falls — check your soles before every shot. The numbers describe the pattern as applied; the lanes change as they are bowled.',
        x0,
        doc.y,
        { width },
      );
    doc.fillColor('#444').text('Made with Lanewright.', x0, doc.y + 6);
    doc.end();
  });
}

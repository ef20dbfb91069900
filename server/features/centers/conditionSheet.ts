import path from 'node:path';
import { createRequire } from 'node:module';
import PDFDocument from 'pdfkit';
import { oilGrid } from '../../../engine/index';
import type { Center, Condition } from '../../../shared/centers';
import { laneRanges } from './lanes';

const require = createRequire(import.meta.url);
const fontDir = path.join(path.dirname(require.resolve('@fontsource/source-sans-3/package.json')), 'files');
const FONT_REGULAR = path.join(fontDir, 'source-sans-3-latin-400-normal.woff');
const FONT_BOLD = path.join(fontDir, 'source-sans-3-latin-700-normal.woff');

const TEAL = '#0f5f5c';
/** Pale (dry) to deep (heavy) blue, as on screen. */
function oilColour(t: number): string {
  const c = Math.max(0, Math.min(1, t));
  const mix = (a: number, b: number) => Math.round(a + (b - a) * c);
  return `#${[mix(0xf1, 0x0b), mix(0xf6, 0x3d), mix(0xfb, 0x91)].map((v) => v.toString(16).padStart(2, '0')).join('')}`;
}

/**
 * The front-desk sheet of a published condition (A4, fonts embedded): center, lanes, dates, lane surface, notes,
 * the pattern's numbers and its oil map, and the approach caution.
 */
export function conditionSheetPdf(center: Center, c: Condition): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const doc = new PDFDocument({
      size: 'A4',
      margin: 48,
      info: { Title: `${center.name} — lane condition`, Author: 'Lanewright', Subject: c.pattern.name },
    });
    const chunks: Buffer[] = [];
    doc.on('data', (b: Buffer) => chunks.push(b));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    doc.registerFont('body', FONT_REGULAR);
    doc.registerFont('bold', FONT_BOLD);

    const s = c.pattern.summary;
    doc.font('bold').fontSize(22).fillColor(TEAL).text(center.name);
    doc
      .font('body')
      .fontSize(11)
      .fillColor('#333')
      .text(`${center.town} · lane condition published ${c.publishedAt.slice(0, 10)}`);
    doc.moveDown(0.8);
    doc.font('bold').fontSize(16).fillColor('#111').text(c.pattern.name);
    doc.font('body').fontSize(12);
    doc.text(`Lanes: ${laneRanges(c.lanes)}`);
    doc.text(`In force: ${c.validFrom}${c.validTo ? ` to ${c.validTo}` : ' until further notice'}`);
    doc.text(`Lane surface: ${c.laneText}`);
    doc.moveDown(0.6);

    const rows: [string, string][] = [
      ['Length', `${s.lengthFt} ft (${s.lengthClass})`],
      ['Volume', `${s.volumeMl.toFixed(2)} mL (${s.volumeClass})`],
      ['Forward / reverse', `${s.forwardMl.toFixed(2)} mL / ${s.reverseMl.toFixed(2)} mL`],
      ['Ratio', `${s.ratio === null ? 'no oil outside' : `${s.ratio.toFixed(1)} : 1`} (${s.ratioClass}; boards 18–22 vs 3–7 and 33–37)`],
    ];
    const x0 = doc.x;
    for (const [k, v] of rows) {
      const y = doc.y;
      doc.font('bold').text(k, x0, y, { width: 130 });
      doc.font('body').text(v, x0 + 140, y);
    }
    if (c.notes) {
      doc.moveDown(0.6).font('bold').text('Notes', x0);
      doc.font('body').text(c.notes, x0, doc.y, { width: 500 });
    }

    // Oil map: boards across (right-hand gutter on the right as seen from the approach), feet up the page.
    const maxFt = Math.min(60, Math.max(10, Math.ceil(s.lengthFt) + 4));
    const grid = oilGrid({ name: c.pattern.name, sweeps: c.pattern.sweeps }, { boardStep: 1, ftStep: 1, maxFt });
    let peak = 0;
    for (const col of grid.values) for (const v of col) peak = Math.max(peak, v);
    const mapTop = doc.y + 16;
    const mapH = Math.min(300, 790 - mapTop - 60);
    const cellW = 8;
    const cellH = mapH / grid.ft.length;
    const left = x0 + 30;
    doc
      .font('bold')
      .fontSize(11)
      .text('Oil map (foul line at the bottom)', x0, mapTop - 14);
    grid.boards.forEach((board, bi) => {
      grid.ft.forEach((_, fi) => {
        const v = grid.values[bi][fi];
        const x = left + (39 - board) * cellW;
        const y = mapTop + mapH - (fi + 1) * cellH;
        doc.rect(x, y, cellW, cellH).fill(oilColour(peak > 0 ? v / peak : 0));
      });
    });
    doc
      .lineWidth(0.5)
      .strokeColor('#666')
      .rect(left, mapTop, 39 * cellW, mapH)
      .stroke();
    doc.font('body').fontSize(8).fillColor('#333');
    for (const ft of [0, 10, 20, 30, 40, 50, 60].filter((f) => f <= maxFt))
      doc.text(`${ft} ft`, x0, mapTop + mapH - (ft / maxFt) * mapH - 4, { width: 28, align: 'right' });
    doc.text('board 39', left, mapTop + mapH + 3);
    doc.text('board 1', left + 39 * cellW - 30, mapTop + mapH + 3);

    doc
      .font('body')
      .fontSize(9)
      .fillColor('#7a4b00')
      .text(
        'Caution: oil carried onto the approach and onto shoes causes falls — check your soles before every shot. The numbers describe the pattern as applied; the lanes change as they are bowled.',
        x0,
        mapTop + mapH + 20,
        { width: 500 },
      );
    doc.fillColor('#555').text('Made with Lanewright.', x0, doc.y + 6);
    doc.end();
  });
}

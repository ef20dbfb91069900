// node scripts/icons.mjs: draws the app's icons (a lane with its oil, on the teal of the app bar) into client/public/
// as PNGs with sharp. The PNGs are committed; run this again only when the drawing changes.
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import sharp from 'sharp';

const out = path.join(path.dirname(fileURLToPath(import.meta.url)), '..', 'client', 'public');

/** The drawing on a square of `size`; `inset` is the share of each side kept clear (maskable icons keep a safe zone). */
function svg(size, inset) {
  const pad = size * inset;
  const inner = size - 2 * pad;
  const laneW = inner * 0.34;
  const laneH = inner * 0.78;
  const x = pad + (inner - laneW) / 2;
  const y = pad + (inner - laneH) / 2;
  const boards = Array.from({ length: 7 }, (_, i) => {
    const bx = x + (laneW / 7) * (i + 1);
    return `<line x1="${bx}" y1="${y}" x2="${bx}" y2="${y + laneH}" stroke="#c38a3f" stroke-width="${size / 192}"/>`;
  }).join('');
  const oilH = laneH * 0.55;
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${size}" height="${size}" viewBox="0 0 ${size} ${size}">
  <rect width="${size}" height="${size}" fill="#083f40"/>
  <rect x="${x}" y="${y}" width="${laneW}" height="${laneH}" rx="${size / 48}" fill="#e4bf7f"/>
  ${boards}
  <rect x="${x}" y="${y + laneH - oilH}" width="${laneW}" height="${oilH}" fill="#7fb0e0" fill-opacity="0.85"/>
  <circle cx="${x + laneW / 2}" cy="${y + laneH * 0.2}" r="${laneW * 0.22}" fill="#052b2c"/>
</svg>`;
}

const ICONS = [
  { file: 'icon-192.png', size: 192, inset: 0.06 },
  { file: 'icon-512.png', size: 512, inset: 0.06 },
  { file: 'icon-maskable-512.png', size: 512, inset: 0.16 },
  { file: 'apple-touch-icon.png', size: 180, inset: 0.06 },
];

for (const icon of ICONS) {
  await sharp(Buffer.from(svg(icon.size, icon.inset)))
    .png({ compressionLevel: 9 })
    .toFile(path.join(out, icon.file));
  console.log(`client/public/${icon.file}`);
}

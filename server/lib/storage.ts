import sharp from 'sharp';
import crypto from 'node:crypto';
import fs from 'node:fs/promises';
import path from 'node:path';
import { config } from '../config/index';

/** Where uploaded bytes live. Local disk by default; another backend implements the same three calls. */
export interface FileStorage {
  put(bytes: Buffer, ext: string): Promise<string>;
  get(key: string): Promise<Buffer>;
  remove(key: string): Promise<void>;
}

const KEY = /^[a-f0-9]{32}\.(png|jpg|webp)$/;

/** Stores files under UPLOAD_DIR (outside the web root) with generated names; keys are never user-chosen. */
export function localStorage(dir = path.resolve(config.UPLOAD_DIR)): FileStorage {
  const where = (key: string) => {
    if (!KEY.test(key)) throw new Error('bad storage key');
    return path.join(dir, key);
  };
  return {
    async put(bytes, ext) {
      await fs.mkdir(dir, { recursive: true });
      const key = `${crypto.randomBytes(16).toString('hex')}.${ext}`;
      await fs.writeFile(where(key), bytes, { flag: 'wx', mode: 0o640 });
      return key;
    },
    get: (key) => fs.readFile(where(key)),
    remove: (key) => fs.rm(where(key), { force: true }),
  };
}

export const storage: FileStorage = localStorage();

const IMAGE_TYPES = {
  png: { ext: 'png', type: 'image/png' },
  jpeg: { ext: 'jpg', type: 'image/jpeg' },
  webp: { ext: 'webp', type: 'image/webp' },
} as const;
/** Largest photo accepted, in pixels (about 6000 × 4000): a small file can claim a huge canvas ("decompression bomb"). */
export const MAX_IMAGE_PIXELS = 24_000_000;

/**
 * The image type of an upload, from decoding it whole with an image library (sharp, libvips) — not from its
 * first bytes, its name or the client's claim: a file that only starts like a PNG, a truncated or corrupt image,
 * another format (SVG, GIF, TIFF …) or a canvas past MAX_IMAGE_PIXELS is refused (null).
 */
export async function decodeImage(b: Buffer): Promise<{ ext: 'png' | 'jpg' | 'webp'; type: string; width: number; height: number } | null> {
  try {
    const image = sharp(b, { failOn: 'warning', limitInputPixels: MAX_IMAGE_PIXELS, animated: false });
    const meta = await image.metadata();
    const kind = meta.format && meta.format in IMAGE_TYPES ? IMAGE_TYPES[meta.format as keyof typeof IMAGE_TYPES] : null;
    if (!kind || !meta.width || !meta.height) return null;
    await image.raw().toBuffer(); // every pixel decoded: a damaged file fails here
    return { ...kind, width: meta.width, height: meta.height };
  } catch {
    return null;
  }
}

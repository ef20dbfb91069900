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

/** The image type from the file's first bytes (not from its name or the client's claim). */
export function sniffImage(b: Buffer): { ext: 'png' | 'jpg' | 'webp'; type: string } | null {
  if (b.length >= 8 && b.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]))) return { ext: 'png', type: 'image/png' };
  if (b.length >= 3 && b[0] === 0xff && b[1] === 0xd8 && b[2] === 0xff) return { ext: 'jpg', type: 'image/jpeg' };
  if (b.length >= 12 && b.subarray(0, 4).toString('latin1') === 'RIFF' && b.subarray(8, 12).toString('latin1') === 'WEBP') return { ext: 'webp', type: 'image/webp' };
  return null;
}

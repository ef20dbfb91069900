import { describe, expect, it } from 'vitest';
import { Ball, Upload } from '../../../server/models/index';
import { api, createUser, errorOf } from '../../helpers/api';
import { createBall } from '../../helpers/fixtures';

// The smallest valid PNG: signature, IHDR (1×1, greyscale), IDAT, IEND (PNG specification, W3C/ISO 15948).
const PNG_1X1 = Buffer.from(
  '89504e470d0a1a0a0000000d49484452000000010000000108000000003a7e9b550000000a49444154789c63000100000500010d0a2db40000000049454e44ae426082',
  'hex',
);

const binary = (res: unknown, cb: (err: Error | null, body: Buffer) => void) => {
  const r = res as NodeJS.ReadableStream;
  const chunks: Buffer[] = [];
  r.on('data', (c: Buffer) => chunks.push(c));
  r.on('end', () => cb(null, Buffer.concat(chunks)));
};

describe('ball photos', () => {
  it('stores a PNG under a generated name, serves it back to the owner only, and removes it', async () => {
    const me = await createUser();
    const other = await createUser();
    const ball = await createBall(me.user.id);
    const put = await api
      .put(`/api/arsenal/${ball.id}/photo`)
      .set(me.auth)
      .attach('file', PNG_1X1, { filename: '../../etc/passwd.png', contentType: 'image/png' });
    expect(put.status).toBe(200);
    expect(put.body.item.hasPhoto).toBe(true);
    const row = await Ball.findByPk(ball.id);
    const up = await Upload.findByPk(row!.photoUploadId!);
    expect(up!.storageKey).toMatch(/^[a-f0-9]{32}\.png$/);
    expect(up!.sizeBytes).toBe(PNG_1X1.length);
    const got = await api.get(`/api/arsenal/${ball.id}/photo`).set(me.auth).buffer(true).parse(binary);
    expect(got.status).toBe(200);
    expect(got.headers['content-type']).toBe('image/png');
    expect(Buffer.compare(got.body as Buffer, PNG_1X1)).toBe(0);
    expect((await api.get(`/api/arsenal/${ball.id}/photo`).set(other.auth)).status).toBe(404);
    expect(
      (
        await api
          .put(`/api/arsenal/${ball.id}/photo`)
          .set(other.auth)
          .attach('file', PNG_1X1, { filename: 'x.png', contentType: 'image/png' })
      ).status,
    ).toBe(404);
    const del = await api.delete(`/api/arsenal/${ball.id}/photo`).set(me.auth);
    expect(del.body.item.hasPhoto).toBe(false);
    expect(await Upload.findByPk(up!.id)).toBeNull();
    expect((await api.get(`/api/arsenal/${ball.id}/photo`).set(me.auth)).status).toBe(404);
  });

  it('refuses a file that claims to be an image but is not, another type, and a photo over 2 MiB', async () => {
    const me = await createUser();
    const ball = await createBall(me.user.id);
    const fake = await api
      .put(`/api/arsenal/${ball.id}/photo`)
      .set(me.auth)
      .attach('file', Buffer.from('<script>alert(1)</script>'), { filename: 'x.png', contentType: 'image/png' });
    expect(fake.status).toBe(400);
    expect(errorOf(fake.body).code).toBe('unsupported_file');
    const gif = await api
      .put(`/api/arsenal/${ball.id}/photo`)
      .set(me.auth)
      .attach('file', Buffer.from('GIF89a'), { filename: 'x.gif', contentType: 'image/gif' });
    expect(gif.status).toBe(400);
    const big = Buffer.concat([PNG_1X1, Buffer.alloc(2 * 1024 * 1024)]);
    const tooBig = await api
      .put(`/api/arsenal/${ball.id}/photo`)
      .set(me.auth)
      .attach('file', big, { filename: 'big.png', contentType: 'image/png' });
    expect(tooBig.status).toBe(413);
    expect((await Ball.findByPk(ball.id))!.photoUploadId).toBeNull();
  });
});

import type { Test } from 'supertest';

/** A supertest request whose body is collected as raw bytes (zips, PNGs). */
export const binary = (res: Test): Test =>
  res.buffer(true).parse((r, cb) => {
    const chunks: Buffer[] = [];
    r.on('data', (c: Buffer) => chunks.push(c));
    r.on('end', () => cb(null, Buffer.concat(chunks)));
  });

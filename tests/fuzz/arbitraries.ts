import fc from 'fast-check';
import * as Y from 'yjs';
import * as encoding from 'lib0/encoding';

// What the fuzzer sends. Mostly near misses of real requests (the keys and shapes the schemas know,
// with wrong types, sizes and characters), so inputs get past the first check and reach the code
// behind it; some plain noise.

const KEYS = [
  'name', 'email', 'password', 'smiles', 'molfile', 'role', 'displayName', 'description', 'resolution', 'mapping',
  'beads', 'message', 'body', 'text', 'reason', 'tags', 'format', 'version', 'token', 'currentPassword', 'newPassword',
  'disabled', 'admin', 'atoms', 'id', 'type', 'centre', 'weight', 'index', 'moleculeId', 'beadId', 'resolved', 'notes',
  'library', 'options', 'temperature', 'sizeClass', 'charge', 'min', 'max', 'locked', 'from', 'to', 'parentId',
];

const text = fc.oneof(
  fc.string({ maxLength: 24 }),
  fc.string({ unit: 'binary', maxLength: 24 }),
  fc.constantFrom('', ' ', '\u0000', 'CCO', 'c1ccccc1', 'modeller@example.org', 'student', 'supervisor', '4:1', 'mass', 'geometry', 'csv', '1', '-1', 'x'.repeat(300), '../../etc/passwd', '<script>', '%00', '{}', 'null'),
);
const scalar = fc.oneof(text, fc.integer(), fc.double(), fc.boolean(), fc.constant(null), fc.constantFrom(0, -1, 1, 2 ** 31, 2 ** 53, Number.MAX_VALUE));
const bead = fc.record(
  { id: text, name: text, centre: fc.oneof(text, fc.constantFrom('mass', 'geometry')), type: fc.option(text), atoms: fc.array(fc.record({ index: fc.oneof(fc.nat(40), fc.integer()), weight: fc.oneof(fc.double(), fc.constantFrom(1, 0.5)) }), { maxLength: 4 }) },
  { requiredKeys: [] },
);
const value: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 4, arbitrary: scalar },
  { weight: 1, arbitrary: fc.array(scalar, { maxLength: 4 }) },
  { weight: 1, arbitrary: fc.record({ beads: fc.array(bead, { maxLength: 3 }) }, { requiredKeys: [] }) },
  { weight: 1, arbitrary: fc.jsonValue({ maxDepth: 2 }) },
);

export const jsonBody: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 6, arbitrary: fc.dictionary(fc.constantFrom(...KEYS), value, { maxKeys: 5 }) },
  { weight: 1, arbitrary: fc.jsonValue({ maxDepth: 3 }) },
  { weight: 1, arbitrary: fc.constant(undefined) },
);

/** A value for a path parameter: a real id, or something that is not one. */
export const pathValue = (realIds: number[]) =>
  fc.oneof(
    { weight: 5, arbitrary: fc.constantFrom(...realIds) },
    { weight: 2, arbitrary: fc.oneof(fc.nat(50), fc.constantFrom('0', '-1', '1e3', '1.5', '99999999999999999999', 'abc', '%00', '%2e%2e', '%F0%9F%98%80', 'NaN', '0x10')) },
  );

export const query = fc.option(
  fc.dictionary(fc.constantFrom('format', 'version', 'q', 'limit', 'before', 'after', 'from', 'to', 'a', 'b', 'cursor', 'resolved', 'beadId'), fc.oneof(fc.string({ maxLength: 12 }), fc.nat(20).map(String)), { maxKeys: 3 }),
  { nil: undefined },
);

/** A body as bytes, under a content type and encoding that may not match it. */
export const rawBody = fc.record({
  bytes: fc.oneof(fc.uint8Array({ maxLength: 200 }), jsonBody.map((b) => new TextEncoder().encode(JSON.stringify(b) ?? ''))),
  contentType: fc.constantFrom('application/json', 'application/json; charset=latin1', 'application/json; charset=utf-16', 'text/plain', 'multipart/form-data', 'application/x-www-form-urlencoded', 'application/octet-stream', ''),
  contentEncoding: fc.constantFrom(undefined, 'gzip', 'deflate', 'br', 'identity', 'zstd', 'gzip, br', 'x-unknown'),
});

const MOLFILE = ['', '  Beadloom', '', '  3  2  0  0  0  0  0  0  0  0999 V2000', '    0.0000    0.0000    0.0000 C   0  0', '    1.5000    0.0000    0.0000 C   0  0', '    2.2000    1.2000    0.0000 O   0  0', '  1  2  1  0', '  2  3  1  0', 'M  END'].join('\n');

/** A multipart upload: boundary, part headers and file content, each possibly broken. */
export const multipart = fc
  .record({
    boundary: fc.oneof(fc.constant('FuzzBoundary'), fc.string({ minLength: 1, maxLength: 20 })),
    declared: fc.oneof(fc.constant('FuzzBoundary'), fc.string({ maxLength: 20 })),
    field: fc.oneof(fc.constantFrom('file', 'name', 'moleculeId'), fc.string({ maxLength: 10 })),
    header: fc.oneof(fc.constant(''), fc.string({ unit: 'binary', maxLength: 30 }), fc.constantFrom('Content-Type: chemical/x-mdl-molfile', 'Content-\u0000Type: x', 'X: \r\n\r\n')),
    content: fc.oneof(fc.constant(MOLFILE), fc.string({ unit: 'binary', maxLength: 200 }), fc.nat(MOLFILE.length).map((n) => MOLFILE.slice(0, n)), fc.constant(`${MOLFILE}\n$$$$\n${MOLFILE}`)),
    end: fc.boolean(),
    extraField: fc.option(fc.tuple(fc.constantFrom('name', 'moleculeId', 'x'), fc.string({ maxLength: 20 }))),
  })
  .map((m) => {
    const parts = [`--${m.boundary}\r\nContent-Disposition: form-data; name="${m.field}"; filename="fuzz.mol"\r\n${m.header}\r\n\r\n${m.content}\r\n`];
    if (m.extraField) parts.push(`--${m.boundary}\r\nContent-Disposition: form-data; name="${m.extraField[0]}"\r\n\r\n${m.extraField[1]}\r\n`);
    return { contentType: `multipart/form-data; boundary=${m.declared}`, body: Buffer.from(parts.join('') + (m.end ? `--${m.boundary}--\r\n` : ''), 'utf8') };
  });

const SMILES_ALPHABET = 'CNOSPFIBclnosb()[]=#$@+-.:/\\%*H0123456789'.split('');
export const smiles = fc.oneof(
  { weight: 4, arbitrary: fc.array(fc.constantFrom(...SMILES_ALPHABET), { minLength: 1, maxLength: 40 }).map((a) => a.join('')) },
  { weight: 1, arbitrary: fc.string({ minLength: 1, maxLength: 30 }) },
  { weight: 1, arbitrary: fc.string({ unit: 'grapheme', minLength: 1, maxLength: 20 }) },
);

/** A collab frame: noise, a sync or awareness message with a random body, or a real Yjs update of random content. */
export const socketFrame = fc.oneof(
  fc.uint8Array({ maxLength: 64 }),
  fc.tuple(fc.constantFrom(0, 1, 2, 3, 100, 101, 102, 103), fc.constantFrom(0, 1, 2, 3), fc.uint8Array({ maxLength: 48 })).map(([type, sub, rest]) => {
    const e = encoding.createEncoder();
    encoding.writeVarUint(e, type);
    if (type === 0) encoding.writeVarUint(e, sub);
    encoding.writeVarUint8Array(e, rest);
    return encoding.toUint8Array(e);
  }),
  fc.tuple(fc.constantFrom('beads', 'atoms', 'meta', 'x'), fc.string({ maxLength: 12 }), jsonBody).map(([map, key, v]) => {
    const doc = new Y.Doc();
    doc.getMap(map).set(key, v === undefined ? null : (JSON.parse(JSON.stringify(v) ?? 'null') as never));
    const e = encoding.createEncoder();
    encoding.writeVarUint(e, 0);
    encoding.writeVarUint(e, 2);
    encoding.writeVarUint8Array(e, Y.encodeStateAsUpdate(doc));
    return encoding.toUint8Array(e);
  }),
);

import { crc32 } from 'node:zlib';
import { Resvg } from '@resvg/resvg-js';
import type { ExportSource } from './export-source';
import { stateLabel } from './export-source';
import { toSvg } from './svg';
import { bundledFontFiles } from './fonts';

// The mapping picture as PNG: the SVG picture rasterised by resvg (no browser, no network) at twice
// its size, with the app's bundled Open Sans only (fonts.ts; system fonts are never loaded), with tEXt chunks (PNG 1.2 §11.3.4) "Title" and "Comment" naming the mapping, version and
// SHA-256, inserted after the IHDR chunk.

function textChunk(keyword: string, text: string): Buffer {
  const data = Buffer.concat([Buffer.from(keyword, 'latin1'), Buffer.from([0]), Buffer.from(text.replace(/[^\x20-\x7e]/g, '?'), 'latin1')]);
  const type = Buffer.from('tEXt', 'latin1');
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(Buffer.concat([type, data])) >>> 0);
  return Buffer.concat([length, type, data, crc]);
}

export function toPng(s: ExportSource): Buffer {
  const png = Buffer.from(new Resvg(toSvg(s), { fitTo: { mode: 'zoom', value: 2 }, font: { loadSystemFonts: false, fontFiles: bundledFontFiles(), defaultFontFamily: 'Open Sans', sansSerifFamily: 'Open Sans' } }).render().asPng());
  const afterIhdr = 8 + 4 + 4 + png.readUInt32BE(8) + 4;
  const chunks = [textChunk('Title', `${s.mappingName} ${stateLabel(s)}`), textChunk('Comment', `Beadloom mapping; version ${stateLabel(s)}; sha256 ${s.sha256}`)];
  return Buffer.concat([png.subarray(0, afterIhdr), ...chunks, png.subarray(afterIhdr)]);
}

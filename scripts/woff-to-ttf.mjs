// Unpacks a WOFF (v1) font into the plain TrueType it wraps (each table zlib-inflated), so the
// PDF renderer reads plain TTF from fonts/ (fontkit failed decoding glyphs from the WOFF files).
// Usage: node scripts/woff-to-ttf.mjs node_modules/@fontsource/<family>/files/<file>.woff fonts/<file>.ttf
import { readFileSync, writeFileSync } from 'node:fs';
import { inflateSync } from 'node:zlib';

const [input, output] = process.argv.slice(2);
const woff = readFileSync(input);
if (woff.toString('latin1', 0, 4) !== 'wOFF') throw new Error(`${input} is not a WOFF file`);
const flavor = woff.readUInt32BE(4);
const numTables = woff.readUInt16BE(12);
const tables = [];
for (let i = 0; i < numTables; i++) {
  const at = 44 + i * 20;
  const tag = woff.toString('latin1', at, at + 4);
  const offset = woff.readUInt32BE(at + 4);
  const compLength = woff.readUInt32BE(at + 8);
  const origLength = woff.readUInt32BE(at + 12);
  const checksum = woff.readUInt32BE(at + 16);
  const raw = woff.subarray(offset, offset + compLength);
  const data = compLength < origLength ? inflateSync(raw) : raw;
  tables.push({ tag, checksum, data });
}
const pow = 2 ** Math.floor(Math.log2(numTables));
const header = Buffer.alloc(12 + numTables * 16);
header.writeUInt32BE(flavor, 0);
header.writeUInt16BE(numTables, 4);
header.writeUInt16BE(pow * 16, 6);
header.writeUInt16BE(Math.log2(pow), 8);
header.writeUInt16BE(numTables * 16 - pow * 16, 10);
let offset = header.length;
const bodies = [];
tables.forEach((t, i) => {
  const at = 12 + i * 16;
  header.write(t.tag, at, 'latin1');
  header.writeUInt32BE(t.checksum, at + 4);
  header.writeUInt32BE(offset, at + 8);
  header.writeUInt32BE(t.data.length, at + 12);
  const padded = Buffer.alloc((t.data.length + 3) & ~3);
  t.data.copy(padded);
  bodies.push(padded);
  offset += padded.length;
});
writeFileSync(output, Buffer.concat([header, ...bodies]));

import { deflateSync } from 'node:zlib';

/** CRC-32 of a PNG chunk's type and data. source: ISO/IEC 15948 (PNG), Annex D */
export function crc32(bytes: Buffer): number {
  let c = ~0;
  for (const b of bytes) {
    c ^= b;
    for (let k = 0; k < 8; k++) c = c & 1 ? (c >>> 1) ^ 0xedb88320 : c >>> 1;
  }
  return ~c >>> 0;
}

export function pngChunk(type: string, data: Buffer): Buffer {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([len, body, crc]);
}

/** A valid 1-bit greyscale PNG of side × side black pixels: tiny on disk, huge once decoded. */
export function pngBomb(side: number): Buffer {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(side, 0);
  ihdr.writeUInt32BE(side, 4);
  ihdr[8] = 1; // bit depth
  ihdr[9] = 0; // greyscale
  const rowBytes = 1 + Math.ceil(side / 8); // filter byte + packed bits
  const raw = Buffer.alloc(rowBytes * side); // all zero: filter 0, black
  const signature = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  return Buffer.concat([signature, pngChunk('IHDR', ihdr), pngChunk('IDAT', deflateSync(raw, { level: 9 })), pngChunk('IEND', Buffer.alloc(0))]);
}

/** The PNG with a tEXt chunk (metadata an upload must not keep) right after IHDR. */
export function withTextChunk(png: Buffer, keyword: string, text: string): Buffer {
  const ihdrEnd = 8 + 8 + 13 + 4;
  return Buffer.concat([png.subarray(0, ihdrEnd), pngChunk('tEXt', Buffer.from(`${keyword}\0${text}`, 'latin1')), png.subarray(ihdrEnd)]);
}

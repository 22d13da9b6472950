import { promisify } from 'node:util';
import zlib from 'node:zlib';

/** PNG file signature. Source: PNG specification (ISO/IEC 15948, W3C PNG 3rd ed.) §5.2. */
const SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

function chunk(type: string, data: Buffer): Buffer {
  const out = Buffer.alloc(12 + data.length);
  out.writeUInt32BE(data.length, 0);
  out.write(type, 4, 'latin1');
  data.copy(out, 8);
  // The CRC covers the chunk type and data, not the length (PNG spec §5.3).
  out.writeUInt32BE(zlib.crc32(out.subarray(4, 8 + data.length)), 8 + data.length);
  return out;
}

/** The zlib stream's input: each scanline with its filter type byte (0 = none) in front. */
function scanlines(width: number, height: number, rgb: Uint8Array): Buffer {
  if (!Number.isInteger(width) || !Number.isInteger(height) || width < 1 || height < 1) {
    throw new RangeError(`a PNG needs at least one pixel, not ${width} × ${height}`);
  }
  const rowBytes = width * 3;
  if (rgb.length !== rowBytes * height) throw new RangeError('pixel data does not match the image size');
  const raw = Buffer.alloc((rowBytes + 1) * height);
  for (let y = 0; y < height; y++) {
    raw.set(rgb.subarray(y * rowBytes, (y + 1) * rowBytes), y * (rowBytes + 1) + 1);
  }
  return raw;
}

function assemble(width: number, height: number, compressed: Buffer): Buffer {
  const header = Buffer.alloc(13);
  header.writeUInt32BE(width, 0);
  header.writeUInt32BE(height, 4);
  header[8] = 8; // bit depth
  header[9] = 2; // colour type: truecolour
  header[10] = 0; // compression: deflate
  header[11] = 0; // filter method 0
  header[12] = 0; // no interlace
  return Buffer.concat([SIGNATURE, chunk('IHDR', header), chunk('IDAT', compressed), chunk('IEND', Buffer.alloc(0))]);
}

/**
 * Encodes 8-bit RGB pixels (3 bytes per pixel, rows top to bottom) as a PNG: colour type 2,
 * filter 0 on every row, one zlib stream in one IDAT chunk.
 *
 * @example encodePngRgb(1, 1, Uint8Array.of(255, 0, 0)) // a one-pixel red image
 */
export function encodePngRgb(width: number, height: number, rgb: Uint8Array, level = 6): Buffer {
  return assemble(width, height, zlib.deflateSync(scanlines(width, height, rgb), { level }));
}

const deflate = promisify(zlib.deflate);

/** As encodePngRgb, compressing on libuv's thread pool so a big picture does not hold up other requests. */
export async function encodePngRgbAsync(width: number, height: number, rgb: Uint8Array, level = 6): Promise<Buffer> {
  return assemble(width, height, await deflate(scanlines(width, height, rgb), { level }));
}

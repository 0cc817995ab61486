import { crc32, deflateSync } from 'node:zlib';

/**
 * A small invented "site photo" as PNG bytes, drawn here (no camera, no image library): grass below a sky, and a
 * darker blot where water pools, placed by `seed` so each fault's photo differs. Good enough to show and embed.
 */
export function demoPhotoPng(seed: number, width = 240, height = 180): Buffer {
  const raw = Buffer.alloc((width * 3 + 1) * height);
  const cx = width * (0.3 + (0.4 * ((seed * 37) % 100)) / 100);
  const cy = height * (0.55 + (0.3 * ((seed * 53) % 100)) / 100);
  for (let y = 0; y < height; y++) {
    const row = y * (width * 3 + 1);
    raw[row] = 0; // filter: none
    for (let x = 0; x < width; x++) {
      const sky = y < height * 0.35;
      const d = Math.hypot((x - cx) / 40, (y - cy) / 18);
      const wet = !sky && d < 1;
      const noise = ((x * 7 + y * 13 + seed * 29) % 17) - 8;
      const [r, g, b] = sky ? [170, 205, 235] : wet ? [60, 90, 70] : [70 + noise, 140 + noise, 60];
      raw.set([r, g, b], row + 1 + x * 3);
    }
  }
  const header = Buffer.alloc(13);
  header.writeUInt32BE(width, 0);
  header.writeUInt32BE(height, 4);
  header.set([8, 2, 0, 0, 0], 8); // 8-bit RGB, no interlace
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', header),
    chunk('IDAT', deflateSync(raw)),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

function chunk(type: string, data: Buffer): Buffer {
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body) >>> 0);
  return Buffer.concat([length, body, crc]);
}

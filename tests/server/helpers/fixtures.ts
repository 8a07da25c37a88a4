import { Jimp } from 'jimp';

/** A real PNG drawn with jimp: a few stripes so that it compresses like a screenshot. */
export async function pngBytes(width = 640, height = 400): Promise<Buffer> {
  const img = new Jimp({ width, height, color: 0xf6f1e6ff });
  for (let x = 0; x < width; x++) {
    const y = Math.round(height / 2 + (height / 3) * Math.sin((x / width) * 6 * Math.PI));
    for (let dy = -1; dy <= 1; dy++) if (y + dy >= 0 && y + dy < height) img.setPixelColor(0x1c2a45ff, x, y + dy);
  }
  return img.getBuffer('image/png');
}

/** A step capture: `time_s,voltage_v` at 1 ns, 0 V then 1 V. */
export function stepCsv(samples = 1000): Buffer {
  const rows = ['time_s,voltage_v'];
  for (let i = 0; i < samples; i++) rows.push(`${(i * 1e-9).toExponential(3)},${i > samples / 10 ? '1.000' : '0.000'}`);
  return Buffer.from(rows.join('\n'));
}

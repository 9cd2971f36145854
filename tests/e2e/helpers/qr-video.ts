import { writeFile } from 'node:fs/promises';
import QRCode from 'qrcode';

/**
 * A Y4M clip (what Chromium's fake camera plays) showing one QR code, written without ffmpeg:
 * 4:2:0 frames of a white field with the code's modules in black, centred, with a quiet zone.
 */
export async function writeQrVideo(file: string, text: string, size = 480, frames = 10): Promise<void> {
  const { modules } = QRCode.create(text, { errorCorrectionLevel: 'M' });
  const n = modules.size;
  const cell = Math.floor((size * 0.7) / n);
  const offset = Math.floor((size - cell * n) / 2);
  const y = Buffer.alloc(size * size, 235);
  for (let row = 0; row < n; row++) {
    for (let col = 0; col < n; col++) {
      if (!modules.get(row, col)) continue;
      for (let dy = 0; dy < cell; dy++)
        y.fill(
          16,
          (offset + row * cell + dy) * size + offset + col * cell,
          (offset + row * cell + dy) * size + offset + (col + 1) * cell,
        );
    }
  }
  const chroma = Buffer.alloc((size / 2) * (size / 2) * 2, 128);
  const header = Buffer.from(`YUV4MPEG2 W${size} H${size} F10:1 Ip A1:1 C420\n`);
  const frame = Buffer.concat([Buffer.from('FRAME\n'), y, chroma]);
  await writeFile(file, Buffer.concat([header, ...Array.from({ length: frames }, () => frame)]));
}

// A fake camera for browser tests: one 640x480 YUV4MPEG2 frame showing a real QR label, written in
// plain Node (no ffmpeg). Chromium's --use-file-for-fake-video-capture loops the frame, so the
// app's camera sees the label continuously, as a phone held over the item would.
import { mkdtempSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import QRCode from 'qrcode';

const WIDTH = 640;
const HEIGHT = 480;
/** QR codes need a light margin of at least four modules around the symbol. */
const QUIET_MODULES = 4;
/** Room left around the label inside the frame, as when a hand holds a phone over it. */
const FRAME_MARGIN_PX = 60;

const BLACK = 16; // studio-range luma: what a camera reports for black print
const WHITE = 235;
const GREY = 128; // background around the label, and both chroma planes (no colour)

/** The luma plane: a grey scene with a white label carrying the QR code in its middle. */
export function qrLumaPlane(text: string): Uint8Array {
  const qr = QRCode.create(text, { errorCorrectionLevel: 'M' });
  const size = qr.modules.size;
  const span = size + QUIET_MODULES * 2;
  const scale = Math.floor((HEIGHT - FRAME_MARGIN_PX * 2) / span);
  if (scale < 2) throw new Error(`QR code for "${text}" is too dense for a ${WIDTH}x${HEIGHT} frame`);
  const labelPx = span * scale;
  const left = Math.floor((WIDTH - labelPx) / 2);
  const top = Math.floor((HEIGHT - labelPx) / 2);

  const luma = new Uint8Array(WIDTH * HEIGHT).fill(GREY);
  for (let y = 0; y < labelPx; y += 1) {
    const row = Math.floor(y / scale) - QUIET_MODULES;
    for (let x = 0; x < labelPx; x += 1) {
      const col = Math.floor(x / scale) - QUIET_MODULES;
      const inside = row >= 0 && row < size && col >= 0 && col < size;
      const dark = inside && qr.modules.get(row, col) === 1;
      luma[(top + y) * WIDTH + left + x] = dark ? BLACK : WHITE;
    }
  }
  return luma;
}

/** The whole y4m file: stream header, one FRAME, Y then U and V (4:2:0, quarter size each). */
export function qrY4m(text: string): Buffer {
  const header = Buffer.from(`YUV4MPEG2 W${WIDTH} H${HEIGHT} F30:1 Ip A1:1 C420jpeg\nFRAME\n`, 'ascii');
  const chroma = Buffer.alloc((WIDTH / 2) * (HEIGHT / 2) * 2, GREY);
  return Buffer.concat([header, Buffer.from(qrLumaPlane(text)), chroma]);
}

/** Writes the frame to a fresh temporary file and returns its path (for launchBrowser's fakeVideo). */
export function writeQrVideo(text: string): string {
  const dir = mkdtempSync(path.join(os.tmpdir(), 'voltcrib-camera-'));
  const file = path.join(dir, 'label.y4m');
  writeFileSync(file, qrY4m(text));
  return file;
}

// A video file for Chromium's fake camera (--use-file-for-fake-video-capture): a barcode drawn from bwip-js's
// module matrix onto a white 640×480 frame, as uncompressed YUV4MPEG2 (4:2:0).
import { writeFileSync } from "node:fs";
import bwipjs from "bwip-js/node";

const W = 640;
const H = 480;
const WHITE = 235;
const BLACK = 16;

type Matrix = { pixs: number[]; pixx: number; pixy: number };
type Bars = { sbs: number[] };

export function writeFakeCamera(
  file: string,
  symbol: "datamatrix" | "qrcode" | "code128",
  text: string,
): void {
  const y = new Uint8Array(W * H).fill(WHITE);
  const paint = (x0: number, y0: number, w: number, h: number) => {
    for (let r = y0; r < y0 + h; r++) y.fill(BLACK, r * W + x0, r * W + x0 + w);
  };
  const [raw] = bwipjs.raw(symbol, text, "") as (Matrix | Bars)[];
  if (raw && "pixs" in raw) {
    const m = Math.floor(Math.min(W, H) / (Math.max(raw.pixx, raw.pixy) + 8));
    const x0 = Math.floor((W - raw.pixx * m) / 2);
    const y0 = Math.floor((H - raw.pixy * m) / 2);
    raw.pixs.forEach((on, i) => {
      if (on) paint(x0 + (i % raw.pixx) * m, y0 + Math.floor(i / raw.pixx) * m, m, m);
    });
  } else if (raw) {
    // Bars and spaces alternate, starting with a bar; widths in modules.
    const modules = raw.sbs.reduce((a, b) => a + b, 0);
    const m = Math.floor(W / (modules + 20));
    let x = Math.floor((W - modules * m) / 2);
    raw.sbs.forEach((width, i) => {
      if (i % 2 === 0) paint(x, H / 2 - 80, width * m, 160);
      x += width * m;
    });
  }
  const chroma = new Uint8Array((W / 2) * (H / 2) * 2).fill(128);
  const frame = Buffer.concat([Buffer.from("FRAME\n"), y, chroma]);
  const header = Buffer.from(`YUV4MPEG2 W${W} H${H} F10:1 Ip A1:1 C420jpeg\n`);
  writeFileSync(file, Buffer.concat([header, ...Array.from({ length: 5 }, () => frame)]));
}

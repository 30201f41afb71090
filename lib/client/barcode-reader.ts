"use client";
// Reads Code 128, Data Matrix and QR codes from camera frames: the browser's BarcodeDetector where it has all three,
// otherwise the ZXing decoder (@zxing/library, bundled with the app and loaded only when needed; nothing fetched).

export type DecoderEngine = "native" | "zxing";

export interface FrameDecoder {
  engine: DecoderEngine;
  /** The text of a barcode seen in the video's current frame, or null when there is none. */
  decode(video: HTMLVideoElement): Promise<string | null>;
}

// BarcodeDetector is not in TypeScript's DOM library yet (Shape Detection API).
interface DetectedBarcode {
  rawValue: string;
}
interface BarcodeDetectorInstance {
  detect(source: CanvasImageSource): Promise<DetectedBarcode[]>;
}
interface BarcodeDetectorClass {
  new (opts: { formats: string[] }): BarcodeDetectorInstance;
  getSupportedFormats(): Promise<string[]>;
}

const NATIVE_FORMATS = ["code_128", "data_matrix", "qr_code"];
/** Frames are scaled down to this width before the JS decoder reads them (speed; markers fill the view). */
const MAX_WIDTH = 800;

async function nativeDecoder(): Promise<FrameDecoder | null> {
  const Detector = (globalThis as unknown as { BarcodeDetector?: BarcodeDetectorClass }).BarcodeDetector;
  if (!Detector) return null;
  try {
    const supported = await Detector.getSupportedFormats();
    if (!NATIVE_FORMATS.every((f) => supported.includes(f))) return null;
    const detector = new Detector({ formats: NATIVE_FORMATS });
    return {
      engine: "native",
      decode: async (video) => {
        if (video.readyState < 2) return null;
        const found = await detector.detect(video);
        return found[0]?.rawValue ?? null;
      },
    };
  } catch {
    return null;
  }
}

async function zxingDecoder(): Promise<FrameDecoder> {
  const z = await import("@zxing/library");
  const reader = new z.MultiFormatReader();
  const hints = new Map<import("@zxing/library").DecodeHintType, unknown>([
    [
      z.DecodeHintType.POSSIBLE_FORMATS,
      [z.BarcodeFormat.CODE_128, z.BarcodeFormat.DATA_MATRIX, z.BarcodeFormat.QR_CODE],
    ],
    [z.DecodeHintType.TRY_HARDER, true],
  ]);
  reader.setHints(hints);
  const canvas = document.createElement("canvas");
  const ctx = canvas.getContext("2d", { willReadFrequently: true })!;
  let frame = 0;

  return {
    engine: "zxing",
    decode: async (video) => {
      const vw = video.videoWidth;
      const vh = video.videoHeight;
      if (video.readyState < 2 || !vw || !vh) return null;
      const scale = Math.min(1, MAX_WIDTH / Math.max(vw, vh));
      const w = Math.round(vw * scale);
      const h = Math.round(vh * scale);
      // Every other frame is read turned a quarter, so a Code 128 held upright reads too.
      const turned = frame++ % 2 === 1;
      canvas.width = turned ? h : w;
      canvas.height = turned ? w : h;
      ctx.save();
      if (turned) {
        ctx.translate(h, 0);
        ctx.rotate(Math.PI / 2);
      }
      ctx.drawImage(video, 0, 0, w, h);
      ctx.restore();
      const { data, width, height } = ctx.getImageData(0, 0, canvas.width, canvas.height);
      const lum = new Uint8ClampedArray(width * height);
      for (let i = 0, j = 0; j < lum.length; i += 4, j++) {
        // ITU-R BT.601 luma weights, in integers.
        lum[j] = (data[i]! * 77 + data[i + 1]! * 150 + data[i + 2]! * 29) >> 8;
      }
      try {
        const bitmap = new z.BinaryBitmap(
          new z.HybridBinarizer(new z.RGBLuminanceSource(lum, width, height)),
        );
        return reader.decodeWithState(bitmap).getText();
      } catch {
        // NotFound, Checksum and Format exceptions all mean: nothing readable in this frame.
        return null;
      } finally {
        reader.reset();
      }
    },
  };
}

export async function createFrameDecoder(): Promise<FrameDecoder> {
  return (await nativeDecoder()) ?? (await zxingDecoder());
}

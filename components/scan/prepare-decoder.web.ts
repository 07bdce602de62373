// Chromium on Linux (and Firefox, Safari) has no built-in BarcodeDetector, so expo-camera falls
// back to the `barcode-detector` package, whose ZXing WebAssembly is by default fetched from a
// public CDN at run time — and on a closed lab network that fails silently (no scan, no error).
// scripts/build-web.ts copies the same wasm (its sha256 matches what barcode-detector expects)
// into public/, which the web export serves at the root; this points the decoder there.
// The import is dynamic so the decoder stays out of the main bundle until a scanner mounts, and it
// names the same module expo-camera imports, so the decoder is one lazy chunk: two different
// entry points would each carry it and the bundler would hoist it into the chunk every page loads.
const WASM_PATH = '/zxing_reader.wasm';

let prepared: Promise<void> | null = null;

/** Call before CameraView mounts; resolves once the decoder is instantiated from our own origin. */
export function prepareDecoder(): Promise<void> {
  prepared ??= import('barcode-detector')
    .then(({ prepareZXingModule }) =>
      prepareZXingModule({
        overrides: {
          locateFile: (path: string, prefix: string) => (path.endsWith('.wasm') ? WASM_PATH : prefix + path),
        },
        fireImmediately: true,
      }),
    )
    .then(() => undefined)
    .catch((error: unknown) => {
      // Let a later mount try again (a flaky connection while the wasm loaded).
      prepared = null;
      throw error;
    });
  return prepared;
}

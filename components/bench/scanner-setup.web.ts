/**
 * QR decoding on the web. expo-camera uses the browser's BarcodeDetector; where there is none
 * (Firefox, headless Chromium on Linux) we install the barcode-detector polyfill, which runs zxing-cpp
 * compiled to WebAssembly. Its default is to fetch the .wasm from a CDN, which fails offline and
 * leaks to a third party, so we point it at our own copy, served beside the app:
 *
 *   node_modules/zxing-wasm/dist/reader/zxing_reader.wasm  →  served at  /zxing_reader.wasm
 *
 * (resolve it with require.resolve('zxing-wasm/reader/zxing_reader.wasm'); the build copies it into
 * public/ so `expo export` puts it at the root of the web output.) The version must match the one
 * barcode-detector bundles (zxing-wasm 3.1.3 here), or the module refuses it.
 *
 * Loaded when asked for, not with the app: a static import would put the decoder (some 45 kB of
 * script) in the chunk every page loads at start, since expo-camera also imports it (lazily). Both
 * ask for the same module, 'barcode-detector', so the web export keeps it in one chunk of its own,
 * fetched when the bench opens. That module installs the polyfill only where the browser has no
 * BarcodeDetector of its own.
 */
export const zxingWasmPath = '/zxing_reader.wasm';

const overrides = {
  locateFile: (path: string, prefix: string) =>
    path.endsWith('.wasm')
      ? new URL(zxingWasmPath, globalThis.location?.origin ?? 'http://localhost').href
      : prefix + path,
};

let installing: Promise<typeof import('barcode-detector')> | null = null;

/**
 * Installs the decoder once (resolves when it is in place); `warm` also starts loading the wasm so the
 * first scan is quick.
 */
export async function setUpScanner(warm = false): Promise<void> {
  if (!installing) {
    installing = import('barcode-detector').then((zxing) => {
      // Same effect as setZXingModuleOverrides({ locateFile }), which the library now marks deprecated.
      zxing.prepareZXingModule({ overrides, fireImmediately: false });
      return zxing;
    });
    // A failed load is tried again on the next call rather than remembered.
    installing.catch(() => {
      installing = null;
    });
  }
  const zxing = await installing;
  if (warm) {
    zxing.prepareZXingModule({ overrides, fireImmediately: true }).catch(() => {
      // The scanner shows its own error on the first failed read.
    });
  }
}

/**
 * QR decoding on the web. expo-camera uses the browser's BarcodeDetector; where there is none
 * (Firefox, headless Chromium on Linux) we install the barcode-detector ponyfill, which runs zxing-cpp
 * compiled to WebAssembly. Its default is to fetch the .wasm from a CDN, which fails offline and
 * leaks to a third party, so we point it at our own copy, served beside the app:
 *
 *   node_modules/zxing-wasm/dist/reader/zxing_reader.wasm  →  served at  /zxing_reader.wasm
 *
 * (resolve it with require.resolve('zxing-wasm/reader/zxing_reader.wasm'); the build copies it into
 * public/ so `expo export` puts it at the root of the web output.) The version must match the one
 * barcode-detector bundles (zxing-wasm 3.1.3 here), or the module refuses it.
 */
import { BarcodeDetector, prepareZXingModule } from 'barcode-detector/ponyfill';

export const zxingWasmPath = '/zxing_reader.wasm';

const overrides = {
  locateFile: (path: string, prefix: string) =>
    path.endsWith('.wasm') ? new URL(zxingWasmPath, globalThis.location?.origin ?? 'http://localhost').href : prefix + path,
};

let installed = false;

/** Installs the decoder once; `warm` also starts loading the wasm so the first scan is quick. */
export function setUpScanner(warm = false): void {
  if (!installed) {
    installed = true;
    // Same effect as setZXingModuleOverrides({ locateFile }), which the library now marks deprecated.
    prepareZXingModule({ overrides, fireImmediately: false });
    const g = globalThis as { BarcodeDetector?: unknown };
    if (typeof g.BarcodeDetector === 'undefined') g.BarcodeDetector = BarcodeDetector;
  }
  if (warm) {
    prepareZXingModule({ overrides, fireImmediately: true }).catch(() => {
      // The scanner shows its own error on the first failed read.
    });
  }
}

setUpScanner();

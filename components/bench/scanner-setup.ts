/** Native builds decode QR codes with the platform's own scanner: nothing to set up. */
export const zxingWasmPath = '';

export function setUpScanner(_warm = false): void {}

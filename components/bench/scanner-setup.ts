/** Native builds decode QR codes with the platform's own scanner: nothing to set up. */
export const zxingWasmPath = '';

export async function setUpScanner(_warm = false): Promise<void> {}

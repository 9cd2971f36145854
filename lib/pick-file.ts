import { Platform } from 'react-native';

export type PickedFile = { file: File | null; error: string | null };

/**
 * One file chosen from the computer through the browser's own chooser (a hidden file input), refused
 * when over `maxBytes`. The phone app has no document picker: there `unavailable` says where to do it.
 * Cancelling gives neither a file nor an error.
 */
export function pickWebFile(opts: { accept: string; maxBytes: number; unavailable: string }): Promise<PickedFile> {
  if (Platform.OS !== 'web' || typeof document === 'undefined')
    return Promise.resolve({ file: null, error: opts.unavailable });
  return new Promise((resolve) => {
    const input = document.createElement('input');
    input.type = 'file';
    input.accept = opts.accept;
    input.style.display = 'none';
    const done = (r: PickedFile) => {
      input.remove();
      resolve(r);
    };
    input.addEventListener('change', () => {
      const f = input.files?.[0];
      if (!f) return done({ file: null, error: null });
      if (f.size > opts.maxBytes)
        return done({ file: null, error: `"${f.name}" is larger than ${Math.round(opts.maxBytes / 1024 / 1024)} MB.` });
      done({ file: f, error: null });
    });
    input.addEventListener('cancel', () => done({ file: null, error: null }));
    document.body.appendChild(input);
    input.click();
  });
}

import { readFileSync } from 'node:fs';
import path from 'node:path';
import { colors } from '@/constants/theme';

const root = path.join(__dirname, '..', '..');
const manifest = JSON.parse(readFileSync(path.join(root, 'public', 'manifest.webmanifest'), 'utf8'));
const page = readFileSync(path.join(root, 'public', 'index.html'), 'utf8');

describe('the installable app', () => {
  it('opens standalone at the app root, in our paper and ink', () => {
    expect(manifest).toMatchObject({
      name: 'Pitchcard',
      short_name: 'Pitchcard',
      display: 'standalone',
      start_url: '/',
      scope: '/',
    });
    expect(manifest.background_color).toBe(colors.paper);
    expect(manifest.theme_color).toBe(colors.ink);
  });

  it('names a 192 and a 512 px icon and a maskable one, all made by the build', () => {
    const icons = manifest.icons as { src: string; sizes: string; purpose: string }[];
    expect(
      icons
        .filter((i) => i.purpose === 'any')
        .map((i) => i.sizes)
        .sort(),
    ).toEqual(['192x192', '512x512']);
    expect(icons.some((i) => i.purpose === 'maskable' && i.sizes === '512x512')).toBe(true);
    const build = readFileSync(path.join(root, 'scripts', 'build-offline.mjs'), 'utf8');
    for (const i of icons) expect(build).toContain(`'${path.basename(i.src)}'`);
  });

  it('is linked from the page template, with the same theme colour and no inline script', () => {
    expect(page).toContain('<link rel="manifest" href="/manifest.webmanifest" />');
    expect(page).toContain(`<meta name="theme-color" content="${colors.ink}" />`);
    expect(page).toContain('%WEB_TITLE%');
    expect(page).not.toMatch(/<script/i);
  });
});

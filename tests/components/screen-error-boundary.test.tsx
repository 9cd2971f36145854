// What a route shows when drawing it threw (Expo Router's per-route `ErrorBoundary` export, docs.expo.dev
// "Error handling"): the error in words and a "Try again" that draws the route anew; and every layout
// and tab exports it, so one failing screen never blanks the app.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { ScreenErrorBoundary } from '@/components/ui/screen-error-boundary';
import { renderWeb } from './render-web';

describe('a screen that stopped working', () => {
  it('says so with the error in words, and "Try again" draws it anew', async () => {
    const retry = jest.fn(async () => undefined);
    const r = renderWeb(
      <ScreenErrorBoundary error={new Error('the part drawing could not read its outline')} retry={retry} />,
    );
    expect(r.text()).toContain('This screen stopped working');
    expect(r.text()).toContain('the part drawing could not read its outline');
    await r.press('retry');
    expect(retry).toHaveBeenCalledTimes(1);
  });

  it('is exported by the root layout, the signed-in layout and every tab', () => {
    const root = path.join(__dirname, '..', '..', 'app');
    const routes = [
      '_layout.tsx',
      '(app)/_layout.tsx',
      '(app)/builds/_layout.tsx',
      '(app)/catalogue/_layout.tsx',
      '(app)/coupons/_layout.tsx',
      '(app)/findings/_layout.tsx',
      '(app)/studies/_layout.tsx',
      '(app)/travelers/_layout.tsx',
      '(app)/index.tsx',
      '(app)/bench.tsx',
      '(app)/people.tsx',
      '(app)/phone.tsx',
      '(app)/account.tsx',
    ];
    const without = routes.filter(
      (f) =>
        !/^export \{ ScreenErrorBoundary as ErrorBoundary \} from '@\/components\/ui\/screen-error-boundary';$/m.test(
          readFileSync(path.join(root, f), 'utf8'),
        ),
    );
    expect(without).toEqual([]);
  });
});

// Parts of the app loaded or drawn only when needed (components/navigation): a screen body fetched when
// it first opens, which offers to try again when the fetch fails; a list page beneath a page opened from
// its link, drawn once it is first shown. React's lazy/Suspense contract from its documentation
// (react.dev, "lazy"): a rejected load stays rejected, hence a fresh lazy component on retry.
import { Text } from 'react-native';
import { lazyScreen } from '@/components/navigation/lazy-screen';
import { WhenShown } from '@/components/navigation/when-shown';
import { renderWeb } from './render-web';

let mockFocused = false;
jest.mock('expo-router', () => ({
  ...jest.requireActual('../helpers/expo-router-stub'),
  useIsFocused: () => mockFocused,
}));

function Body({ name }: { name: string }) {
  return <Text testID="body">Study {name}</Text>;
}

describe('a screen whose code loads when it opens', () => {
  it('shows it once loaded, with its props', async () => {
    const Screen = lazyScreen('The study', async () => Body);
    const r = renderWeb(<Screen name="W-1" />);
    await r.settle();
    expect(r.byTestId('body').textContent).toBe('Study W-1');
  });

  it('says the page did not load when the fetch fails, and loads it on "Try again"', async () => {
    let calls = 0;
    const Screen = lazyScreen('The study', async () => {
      calls += 1;
      if (calls === 1) throw new Error('Failed to fetch the page');
      return Body;
    });
    const quiet = jest.spyOn(console, 'error').mockImplementation(() => undefined);
    const r = renderWeb(<Screen name="W-2" />);
    await r.settle();
    quiet.mockRestore();
    expect(r.text()).toContain('The study did not load');
    expect(r.queryByTestId('body')).toBeNull();
    await r.press('retry');
    await r.settle();
    expect(calls).toBe(2);
    expect(r.byTestId('body').textContent).toBe('Study W-2');
  });
});

describe('a list page beneath a page opened from its link', () => {
  it('is not drawn while hidden, is drawn when shown, and stays drawn when covered again', async () => {
    mockFocused = false;
    const list = () => (
      <WhenShown>
        <Text testID="list">Parts</Text>
      </WhenShown>
    );
    const r = renderWeb(list());
    expect(r.queryByTestId('list')).toBeNull();
    mockFocused = true;
    r.rerender(list());
    await r.settle();
    expect(r.queryByTestId('list')).not.toBeNull();
    mockFocused = false;
    r.rerender(list());
    await r.settle();
    expect(r.queryByTestId('list')).not.toBeNull();
  });
});

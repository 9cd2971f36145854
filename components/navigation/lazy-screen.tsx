import { Component, lazy, Suspense, useState, type ComponentType, type ReactNode } from 'react';
import { View } from 'react-native';
import { colors } from '@/constants/theme';
import { ErrorState, LoadingState } from '@/components/ui/states';

/**
 * A screen body whose code is fetched when the screen first opens. The web export (async routes) puts
 * every module that two pages share into one chunk that the app loads at start, sign-in page included;
 * a large part of the app that several pages use (the studies) stays out of it when those pages reach
 * it only through one `import()` of one module, which Metro then keeps in a chunk of its own.
 *
 * `load` must be the same `import()` of the same module for every page of the part, or the pages'
 * chunks would share the part again. A failed fetch (no signal) offers to try again.
 */
export function lazyScreen<P extends object>(title: string, load: () => Promise<ComponentType<P>>): ComponentType<P> {
  const make = () => lazy(() => load().then((c) => ({ default: c })));
  function LazyScreen(props: P) {
    // A new lazy component on retry: React keeps a rejected one rejected.
    const [Body, setBody] = useState(make);
    return (
      <Retry title={title} onRetry={() => setBody(make)}>
        <Suspense
          fallback={
            <Plain>
              <LoadingState what={`Opening ${title.toLowerCase()}`} />
            </Plain>
          }
        >
          <Body {...props} />
        </Suspense>
      </Retry>
    );
  }
  LazyScreen.displayName = `Lazy(${title})`;
  return LazyScreen;
}

/**
 * No screen header while the body loads: the real screen's header takes the focus when it opens
 * (components/ui/screen.tsx), and a stand-in header would take it first.
 */
function Plain({ children }: { children: ReactNode }) {
  return <View style={{ flex: 1, backgroundColor: colors.paper, justifyContent: 'center' }}>{children}</View>;
}

class Retry extends Component<{ title: string; onRetry: () => void; children: ReactNode }, { error: unknown }> {
  state = { error: undefined as unknown };
  static getDerivedStateFromError(error: unknown) {
    return { error };
  }
  render() {
    if (this.state.error === undefined) return this.props.children;
    return (
      <Plain>
        <ErrorState
          error={this.state.error}
          title={`${this.props.title} did not load`}
          onRetry={() => {
            this.props.onRetry();
            this.setState({ error: undefined });
          }}
        />
      </Plain>
    );
  }
}

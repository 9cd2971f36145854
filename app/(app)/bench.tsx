import { BenchScreen } from '@/components/bench/bench-screen';

export { ScreenErrorBoundary as ErrorBoundary } from '@/components/ui/screen-error-boundary';

export default function Bench() {
  return <BenchScreen />;
}

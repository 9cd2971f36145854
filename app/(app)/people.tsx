import { PeopleScreen } from '@/components/people/people-screen';

export { ScreenErrorBoundary as ErrorBoundary } from '@/components/ui/screen-error-boundary';

export default function People() {
  return <PeopleScreen />;
}

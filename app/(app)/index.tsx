import { HomeRedirect } from '@/components/navigation/home-redirect';

export { ScreenErrorBoundary as ErrorBoundary } from '@/components/ui/screen-error-boundary';

export default function Home() {
  return <HomeRedirect />;
}

import { AccountScreen } from '@/components/account/account-screen';

export { ScreenErrorBoundary as ErrorBoundary } from '@/components/ui/screen-error-boundary';

export default function Account() {
  return <AccountScreen />;
}

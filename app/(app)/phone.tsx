import { PhoneSetupScreen } from '@/components/network/phone-setup-screen';

export { ScreenErrorBoundary as ErrorBoundary } from '@/components/ui/screen-error-boundary';

export default function Phone() {
  return <PhoneSetupScreen />;
}

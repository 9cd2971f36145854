import { PhoneSetupScreen } from '@/components/network/phone-setup-screen';

export default function Phone() {
  return <PhoneSetupScreen />;
}

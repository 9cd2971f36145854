import { AccountScreen } from '@/components/account/account-screen';

export default function Account() {
  return <AccountScreen />;
}

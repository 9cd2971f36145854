import { DevMailScreen } from '@/components/dev/dev-mail-screen';

export default function DevMail() {
  return <DevMailScreen />;
}

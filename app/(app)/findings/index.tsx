import { FindingsHomeScreen } from '@/components/findings/findings-home-screen';

export default function Findings() {
  return <FindingsHomeScreen />;
}

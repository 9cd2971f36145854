import { BuildsScreen } from '@/components/builds/builds-screen';

export default function Builds() {
  return <BuildsScreen />;
}

import { useLocalSearchParams } from 'expo-router';
import { KitScreen } from '@/components/kits/kit-screen';
import { oneParam } from '@/components/navigation/param';

export default function Kit() {
  const params = useLocalSearchParams<{ kitId: string }>();
  return <KitScreen kitId={oneParam(params.kitId)} />;
}

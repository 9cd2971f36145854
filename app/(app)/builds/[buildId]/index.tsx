import { useLocalSearchParams } from 'expo-router';
import { BuildScreen } from '@/components/builds/build-screen';
import { oneParam } from '@/components/navigation/param';

export default function Build() {
  const params = useLocalSearchParams<{ buildId: string }>();
  return <BuildScreen buildId={oneParam(params.buildId)} />;
}

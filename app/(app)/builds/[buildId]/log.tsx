import { useLocalSearchParams } from 'expo-router';
import { BuildLogScreen } from '@/components/build-log/build-log-screen';
import { oneParam } from '@/components/navigation/param';

export default function BuildLog() {
  const params = useLocalSearchParams<{ buildId: string }>();
  return <BuildLogScreen buildId={oneParam(params.buildId)} />;
}

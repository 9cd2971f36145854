import { useLocalSearchParams } from 'expo-router';
import { FindingScreen } from '@/components/findings/finding-screen';
import { oneParam } from '@/components/navigation/param';

export default function Finding() {
  const params = useLocalSearchParams<{ findingId: string }>();
  return <FindingScreen findingId={oneParam(params.findingId)} />;
}

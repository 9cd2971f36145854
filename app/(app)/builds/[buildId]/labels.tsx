import { useLocalSearchParams } from 'expo-router';
import { LabelsScreen } from '@/components/builds/labels-screen';
import { oneParam } from '@/components/navigation/param';

export default function Labels() {
  const params = useLocalSearchParams<{ buildId: string }>();
  return <LabelsScreen buildId={oneParam(params.buildId)} />;
}

import { useLocalSearchParams } from 'expo-router';
import { oneParam } from '@/components/navigation/param';
import { LabelsScreen } from '@/components/travelers/labels-screen';

/** A build's labels from its own page: the same screen as /travelers/labels?build=<id>. */
export default function Labels() {
  const params = useLocalSearchParams<{ buildId: string }>();
  return <LabelsScreen buildId={oneParam(params.buildId)} />;
}

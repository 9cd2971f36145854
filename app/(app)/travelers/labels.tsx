import { useLocalSearchParams } from 'expo-router';
import { oneParam } from '@/components/navigation/param';
import { LabelsScreen } from '@/components/travelers/labels-screen';

/** /travelers/labels?build=<id>: every label of one build, on the stock chosen. */
export default function BuildLabels() {
  const params = useLocalSearchParams<{ build: string }>();
  return <LabelsScreen buildId={oneParam(params.build)} />;
}

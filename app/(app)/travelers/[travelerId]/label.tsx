import { useLocalSearchParams } from 'expo-router';
import { oneParam } from '@/components/navigation/param';
import { LabelsScreen } from '@/components/travelers/labels-screen';

export default function PartLabel() {
  const params = useLocalSearchParams<{ travelerId: string }>();
  return <LabelsScreen travelerId={oneParam(params.travelerId)} />;
}

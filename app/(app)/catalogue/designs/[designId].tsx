import { useLocalSearchParams } from 'expo-router';
import { DesignScreen } from '@/components/designs/design-screen';
import { oneParam } from '@/components/navigation/param';

export default function Design() {
  const params = useLocalSearchParams<{ designId: string }>();
  return <DesignScreen designId={oneParam(params.designId)} />;
}

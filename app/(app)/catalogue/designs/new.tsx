import { useLocalSearchParams } from 'expo-router';
import { DesignCreateScreen } from '@/components/designs/design-create-screen';
import { oneParam } from '@/components/navigation/param';

export default function NewDesign() {
  const params = useLocalSearchParams<{ kitModelId?: string }>();
  return <DesignCreateScreen kitModelId={oneParam(params.kitModelId) || undefined} />;
}

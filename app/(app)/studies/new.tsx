import { useLocalSearchParams } from 'expo-router';
import { oneParam } from '@/components/navigation/param';
import { NewStudyScreen } from '@/components/studies/lazy-screens';

export default function NewStudy() {
  const params = useLocalSearchParams<{ kitModelId?: string }>();
  return <NewStudyScreen kitModelId={oneParam(params.kitModelId) || undefined} />;
}

import { useLocalSearchParams } from 'expo-router';
import { oneParam } from '@/components/navigation/param';
import { NewWingStudyScreen } from '@/components/studies/lazy-screens';

export default function NewWingStudy() {
  const params = useLocalSearchParams<{ kitModelId?: string }>();
  return <NewWingStudyScreen kitModelId={oneParam(params.kitModelId) || undefined} />;
}

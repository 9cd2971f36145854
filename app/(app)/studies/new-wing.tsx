import { useLocalSearchParams } from 'expo-router';
import { oneParam } from '@/components/navigation/param';
import { NewWingStudyScreen } from '@/components/studies/wing-screen';

export default function NewWingStudy() {
  const params = useLocalSearchParams<{ kitModelId?: string }>();
  return <NewWingStudyScreen kitModelId={oneParam(params.kitModelId) || undefined} />;
}

import { useLocalSearchParams } from 'expo-router';
import { oneParam } from '@/components/navigation/param';
import { StudyScreen } from '@/components/studies/lazy-screens';

export default function Study() {
  const params = useLocalSearchParams<{ studyId: string; revision?: string }>();
  const n = Number(oneParam(params.revision));
  // Anything but a whole revision number shows the latest.
  return <StudyScreen studyId={oneParam(params.studyId)} revision={Number.isInteger(n) && n > 0 ? n : undefined} />;
}

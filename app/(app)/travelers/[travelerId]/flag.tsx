import { useLocalSearchParams } from 'expo-router';
import { FlagScreen } from '@/components/findings/flag-screen';
import { oneParam } from '@/components/navigation/param';

export default function Flag() {
  const params = useLocalSearchParams<{ travelerId: string; holes?: string }>();
  const holes = oneParam(params.holes)
    .split(',')
    .map((h) => h.trim())
    .filter(Boolean);
  return <FlagScreen travelerId={oneParam(params.travelerId)} initialHoleIds={holes} />;
}

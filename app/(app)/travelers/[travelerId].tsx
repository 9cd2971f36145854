import { useLocalSearchParams } from 'expo-router';
import { oneParam } from '@/components/navigation/param';
import { TravelerScreen } from '@/components/travelers/traveler-screen';

export default function Traveler() {
  const params = useLocalSearchParams<{ travelerId: string }>();
  return <TravelerScreen travelerId={oneParam(params.travelerId)} />;
}

import { useLocalSearchParams } from 'expo-router';
import { oneParam } from '@/components/navigation/param';
import { TokenScreen } from '@/components/travelers/token-screen';

export default function ScannedLabel() {
  const params = useLocalSearchParams<{ token: string }>();
  return <TokenScreen token={oneParam(params.token)} />;
}

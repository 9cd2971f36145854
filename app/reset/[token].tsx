import { useLocalSearchParams } from 'expo-router';
import { ResetScreen } from '@/components/auth/reset-screen';
import { oneParam } from '@/components/navigation/param';

export default function NewPassword() {
  const params = useLocalSearchParams<{ token: string }>();
  return <ResetScreen token={oneParam(params.token)} />;
}

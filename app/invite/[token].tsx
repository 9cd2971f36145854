import { useLocalSearchParams } from 'expo-router';
import { InviteScreen } from '@/components/auth/invite-screen';
import { oneParam } from '@/components/navigation/param';

export default function Invitation() {
  const params = useLocalSearchParams<{ token: string }>();
  return <InviteScreen token={oneParam(params.token)} />;
}

import { useRouter } from 'expo-router';
import { Button } from '@/components/ui/button';
import { Screen } from '@/components/ui/screen';
import { EmptyState } from '@/components/ui/states';

export function NotFoundScreen() {
  const router = useRouter();
  return (
    <Screen title="No such page">
      <EmptyState
        title="There is nothing at this address."
        body="The link may be old or mistyped. Scanned labels open through the bench."
        action={<Button label="Go to the start" onPress={() => router.replace('/')} testID="go-home" />}
      />
    </Screen>
  );
}

import { Screen } from '@/components/ui/screen';
import { EmptyState } from '@/components/ui/states';
import { useRole } from '@/hooks/use-session';
import { MyFindingsScreen } from './my-findings-screen';
import { ReviewQueueScreen } from './review-queue-screen';

/** One address for findings: the inspector's review queue, or the builder's own list. */
export function FindingsHomeScreen() {
  const role = useRole();
  if (role === 'inspector') return <ReviewQueueScreen />;
  if (role === 'builder') return <MyFindingsScreen />;
  return (
    <Screen title="Findings" account>
      <EmptyState title="Findings belong to builders and inspectors." body="Your role does not review findings here." />
    </Screen>
  );
}

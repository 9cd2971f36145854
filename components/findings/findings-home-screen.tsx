import { Screen } from '@/components/ui/screen';
import { EmptyState } from '@/components/ui/states';
import { useRole } from '@/hooks/use-session';
import { MyFindingsScreen } from './my-findings-screen';
import { ReviewQueueScreen } from './review-queue-screen';

/**
 * One address for findings: the inspector's review queue, the builder's own list, and for the kit
 * supplier's engineer (the design authority) the same queue over their kits' builds, with the
 * findings awaiting their approval first.
 */
export function FindingsHomeScreen() {
  const role = useRole();
  if (role === 'inspector') return <ReviewQueueScreen />;
  if (role === 'builder') return <MyFindingsScreen />;
  if (role === 'supplier') {
    return (
      <ReviewQueueScreen
        title="Approvals"
        subtitle="Findings on the builds of your kits: those awaiting your approval first"
        testID="supplier-findings-screen"
        emptyBody="Findings raised on the builds of your kits show here; a repair or use as is waits for your approval."
        first={{ status: 'awaiting_approval', title: 'Awaiting your approval', empty: 'Nothing awaits your approval.' }}
      />
    );
  }
  return (
    <Screen title="Findings" account>
      <EmptyState title="Findings belong to the people on a build." body="Your role does not see findings here." />
    </Screen>
  );
}

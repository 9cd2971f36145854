import { useRouter } from 'expo-router';
import { useMemo, useState } from 'react';
import { isOpenFinding } from '@/db/contracts';
import { Choice } from '@/components/ui/choice';
import { PagedList } from '@/components/ui/paged-list';
import { Screen } from '@/components/ui/screen';
import { EmptyState } from '@/components/ui/states';
import { useFindingsQuery } from '@/hooks/queries/findings';
import { pagedItems } from '@/hooks/queries/paged';
import { FindingRow } from './finding-row';

/** The builder's own findings: what waits on the inspector or the design authority, and the work ordered. */
export function MyFindingsScreen() {
  const router = useRouter();
  const [show, setShow] = useState<'open' | 'all'>('open');
  // Open or all is asked of the server, newest first, a page at a time.
  const q = useFindingsQuery({ status: show === 'open' ? 'open' : undefined }, { keepPrevious: true });
  // While the other choice loads, the rows of the last one stay shown, less those it does not take.
  const rows = useMemo(
    () => pagedItems(q.data).filter((f) => show === 'all' || isOpenFinding(f.status)),
    [q.data, show],
  );
  return (
    <Screen title="Findings" subtitle="Findings on your builds" account scroll={false} testID="my-findings-screen">
      <PagedList
        q={q}
        rows={rows}
        loading="Loading findings"
        what="findings"
        moreTestID="findings-more"
        renderRow={(f) => <FindingRow f={f} onPress={() => router.push(`/findings/${f.id}`)} />}
        filters={
          <Choice
            testIDPrefix="findings-show"
            value={show}
            onChange={setShow}
            options={[
              { value: 'open', label: 'Open' },
              { value: 'all', label: 'All' },
            ]}
          />
        }
        empty={
          q.isPlaceholderData ? null : (
            <EmptyState
              title={show === 'open' ? 'No open findings.' : 'No findings yet.'}
              body="Flag a suspect hole from its traveler; it shows here until it is closed."
            />
          )
        }
      />
    </Screen>
  );
}

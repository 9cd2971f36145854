import { useRouter } from 'expo-router';
import { useEffect, useMemo, useState } from 'react';
import type { TravelerSummary } from '@/db/contracts';
import { Choice } from '@/components/ui/choice';
import { TextBox } from '@/components/ui/field';
import { PagedList } from '@/components/ui/paged-list';
import { Screen } from '@/components/ui/screen';
import { EmptyState } from '@/components/ui/states';
import { pagedItems } from '@/hooks/queries/paged';
import { useTravelersQuery } from '@/hooks/queries/travelers';
import { liveFirst, TravelerCard } from './traveler-card';

type Show = 'open' | 'all' | 'signed';

/**
 * The parts shown: by sign-off and text, live parts before replaced ones. The server filters the same
 * way; this one narrows the rows already loaded at once, while the server's answer for the new filter comes.
 */
export function filterTravelers(rows: readonly TravelerSummary[], show: Show, text: string): TravelerSummary[] {
  const t = text.trim().toLowerCase();
  return liveFirst(rows).filter((r) => {
    if (show === 'open' && r.signedOff) return false;
    if (show === 'signed' && !r.signedOff) return false;
    if (!t) return true;
    return [r.partNumber, r.partName, r.serial, r.shortCode, r.kitSerial].some((s) => s.toLowerCase().includes(t));
  });
}

/** The text as typed, once typing has paused: one request per search, not one per key. */
function useSettled(text: string, ms = 300): string {
  const [settled, setSettled] = useState(text);
  useEffect(() => {
    const timer = setTimeout(() => setSettled(text), ms);
    return () => clearTimeout(timer);
  }, [text, ms]);
  return settled;
}

/** Every part of the person's builds, a page at a time. */
export function TravelersScreen() {
  const router = useRouter();
  const [show, setShow] = useState<Show>('open');
  const [text, setText] = useState('');
  const search = useSettled(text.trim());
  const q = useTravelersQuery({ show, q: search }, { keepPrevious: true });
  const loaded = useMemo(() => pagedItems(q.data), [q.data]);
  const rows = useMemo(() => filterTravelers(loaded, show, text), [loaded, show, text]);
  const filtered = show !== 'all' || search !== '';

  return (
    <Screen title="Parts" subtitle="The travelers of your builds" account scroll={false} testID="travelers-screen">
      <PagedList
        q={q}
        rows={rows}
        loading="Loading parts"
        what="parts"
        moreTestID="parts-more"
        renderRow={(t) => <TravelerCard t={t} onPress={() => router.push(`/travelers/${t.id}`)} />}
        filters={
          <>
            <Choice
              testIDPrefix="parts-show"
              value={show}
              onChange={setShow}
              options={[
                { value: 'open', label: 'In progress' },
                { value: 'signed', label: 'Signed off' },
                { value: 'all', label: 'All' },
              ]}
            />
            <TextBox
              value={text}
              onChangeText={setText}
              placeholder="Find by part, serial or code"
              testID="parts-search"
              accessibilityLabel="Find a part"
            />
          </>
        }
        empty={
          <EmptyState
            title={filtered ? 'Nothing matches.' : 'No parts yet.'}
            body={filtered ? 'Try another filter or search.' : 'Parts appear here when a supplier ships you a build.'}
          />
        }
      />
    </Screen>
  );
}

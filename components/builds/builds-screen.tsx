import { useRouter } from 'expo-router';
import { Button } from '@/components/ui/button';
import { PagedList } from '@/components/ui/paged-list';
import { Screen } from '@/components/ui/screen';
import { EmptyState } from '@/components/ui/states';
import { useBuildsQuery } from '@/hooks/queries/builds';
import { pagedItems } from '@/hooks/queries/paged';
import type { Role } from '@/db/contracts';
import { useRole } from '@/hooks/use-session';
import { BuildRow } from './build-row';

/** What the list holds for each reader (the admin's tabs have no builds page: see role-tabs). */
const subtitles: Partial<Record<Role, string>> = {
  supplier: 'Kits you have shipped',
  builder: 'Builds you work on',
  inspector: 'Builds you inspect',
};

export function BuildsScreen() {
  const router = useRouter();
  const role = useRole();
  const q = useBuildsQuery();
  const isSupplier = role === 'supplier';
  const rows = pagedItems(q.data);
  return (
    <Screen
      title="Builds"
      subtitle={role ? subtitles[role] : undefined}
      account
      scroll={false}
      testID="builds-screen"
      right={
        isSupplier ? (
          <Button label="Ship a build" compact onPress={() => router.push('/builds/new')} testID="ship-build" />
        ) : undefined
      }
    >
      <PagedList
        q={q}
        rows={rows}
        loading="Loading builds"
        what="builds"
        moreTestID="builds-more"
        renderRow={(b) => <BuildRow b={b} onPress={() => router.push(`/builds/${b.id}`)} />}
        empty={
          <EmptyState
            title="No builds yet."
            body={
              isSupplier
                ? 'Ship a kit to a builder: each published part becomes a traveler with its own QR label.'
                : role === 'builder'
                  ? 'Builds show here when a supplier ships you a kit, or a build’s owner adds you as a helper.'
                  : 'Builds show here when a supplier or a build’s owner adds you as an inspector.'
            }
          />
        }
      />
    </Screen>
  );
}

import { useRouter } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { partKindLabels, type KitModel, type PartDesignSummary } from '@/db/contracts';
import { space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { ListRow } from '@/components/ui/list-row';
import { LoadMore } from '@/components/ui/load-more';
import { Screen } from '@/components/ui/screen';
import { Section } from '@/components/ui/sheet';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { useDesignPagesQuery } from '@/hooks/queries/designs';
import { useKitPagesQuery } from '@/hooks/queries/kits';
import { pagedItems } from '@/hooks/queries/paged';
import { useUnits } from '@/hooks/use-units';

const statusWords = { draft: 'draft', published: 'published', superseded: 'superseded' } as const;

function DesignRow({ d, onPress }: { d: PartDesignSummary; onPress: () => void }) {
  return (
    <ListRow
      testID={`design-${d.partNumber}`}
      label={[
        `${d.partNumber} ${d.name}, ${partKindLabels[d.kind]}`,
        d.latest ? `latest revision ${d.latest.letter} ${statusWords[d.latest.status]}` : null,
        d.publishedLetter ? `builders get revision ${d.publishedLetter}` : 'not published',
      ]
        .filter(Boolean)
        .join(', ')}
      onPress={onPress}
      style={styles.row}
      chevron
    >
      <View style={{ flex: 1 }}>
        <Txt bold>
          <Mono bold>{d.partNumber}</Mono> {d.name}
        </Txt>
        <Txt variant="small" tone="soft">
          {partKindLabels[d.kind]}
          {d.latest ? (
            <>
              {' '}
              · latest{' '}
              <Mono variant="small" bold>
                {d.latest.letter}
              </Mono>{' '}
              {statusWords[d.latest.status]}
            </>
          ) : null}
          {d.publishedLetter ? (
            <>
              {' '}
              · builders get{' '}
              <Mono variant="small" bold>
                {d.publishedLetter}
              </Mono>
            </>
          ) : (
            ' · not published'
          )}
        </Txt>
      </View>
    </ListRow>
  );
}

/** One kit with its part designs, a page at a time (by part number). */
function KitBlock({ kit }: { kit: KitModel }) {
  const router = useRouter();
  const u = useUnits();
  const q = useDesignPagesQuery(kit.id);
  const designs = pagedItems(q.data);
  return (
    <Section
      title={`${kit.code} · ${kit.name}`}
      testID={`kit-${kit.code}`}
      aside={
        <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.xs }}>
          <Button
            label="Kit model…"
            variant="quiet"
            compact
            onPress={() => router.push(`/catalogue/kits/${kit.id}`)}
            testID={`kit-page-${kit.code}`}
          />
          <Button
            label="New part design"
            variant="quiet"
            compact
            onPress={() => router.push(`/catalogue/designs/new?kitModelId=${kit.id}`)}
            testID={`new-design-${kit.code}`}
          />
        </View>
      }
    >
      <Txt variant="small" tone="soft">
        <Mono variant="small">{u.mass(kit.weightLb)}</Mono> gross · wing{' '}
        <Mono variant="small">{u.area(kit.wingAreaSqFt)}</Mono> · stall{' '}
        <Mono variant="small">{kit.stallSpeedKeas} KEAS</Mono> · {kit.airfoil} · {kit.category}
      </Txt>
      {q.isPending ? (
        <LoadingState what={`Loading the part designs of ${kit.code}`} />
      ) : q.isError ? (
        <ErrorState error={q.error} onRetry={() => void q.refetch()} />
      ) : designs.length ? (
        <View>
          {designs.map((d) => (
            <DesignRow key={d.id} d={d} onPress={() => router.push(`/catalogue/designs/${d.id}`)} />
          ))}
          <LoadMore
            hasNextPage={q.hasNextPage}
            isFetchingNextPage={q.isFetchingNextPage}
            fetchNextPage={q.fetchNextPage}
            shown={designs.length}
            what="part designs"
            testID={`designs-more-${kit.code}`}
          />
        </View>
      ) : (
        <Txt tone="soft">No part designs yet.</Txt>
      )}
    </Section>
  );
}

/** The supplier's catalogue: kit models and the part designs of each. */
export function CatalogueScreen() {
  const router = useRouter();
  const kits = useKitPagesQuery();
  const rows = pagedItems(kits.data);
  return (
    <Screen
      title="Catalogue"
      subtitle="Kit models and their part designs"
      account
      testID="catalogue-screen"
      right={
        <Button
          label="New kit model"
          variant="secondary"
          compact
          onPress={() => router.push('/catalogue/new-kit')}
          testID="new-kit"
        />
      }
    >
      {kits.isPending ? (
        <LoadingState what="Loading the catalogue" />
      ) : kits.isError ? (
        <ErrorState error={kits.error} onRetry={() => void kits.refetch()} />
      ) : !rows.length ? (
        <EmptyState
          title="No kit models yet."
          body="Start with a kit model: its weight, wing and speeds. Then add the parts."
          action={
            <Button label="New kit model" onPress={() => router.push('/catalogue/new-kit')} testID="new-kit-empty" />
          }
        />
      ) : (
        <>
          {rows.map((k) => (
            <KitBlock key={k.id} kit={k} />
          ))}
          <LoadMore
            hasNextPage={kits.hasNextPage}
            isFetchingNextPage={kits.isFetchingNextPage}
            fetchNextPage={kits.fetchNextPage}
            shown={rows.length}
            what="kit models"
            testID="kits-more"
          />
        </>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  // Tighter than other lists: a kit's designs are many short rows.
  row: { paddingVertical: space.sm },
});

import { View } from 'react-native';
import {
  creditColumnLabels,
  creditColumns,
  fabricationCaution,
  shareText,
  type FabricationCounts,
} from '@/db/contracts';
import { space } from '@/constants/theme';
import { Caution } from '@/components/ui/caution';
import { GridTable, type GridColumn, type GridRow } from '@/components/ui/grid-table';
import { Section } from '@/components/ui/sheet';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { useFabricationQuery } from '@/hooks/queries/builds';

const columns: GridColumn[] = [
  { key: 'part', title: 'Part', width: 120 },
  ...creditColumns.map((c) => ({ key: c, title: creditColumnLabels[c], width: 96, align: 'right' as const })),
  { key: 'inspections', title: 'Inspections', width: 88, align: 'right' },
  { key: 'notDone', title: 'Not done', width: 80, align: 'right' },
  { key: 'share', title: 'Builder’s share', width: 96, align: 'right' },
];

function cellsOf(label: React.ReactNode, c: FabricationCounts): GridRow['cells'] {
  return {
    part: label,
    ...Object.fromEntries(creditColumns.map((k) => [k, <Mono key={k}>{String(c.credited[k])}</Mono>])),
    inspections: <Mono>{String(c.inspections)}</Mono>,
    notDone: <Mono>{String(c.notDone)}</Mono>,
    share: <Mono bold>{shareText(c.builderShare)}</Mono>,
  };
}

/** Whose work each part's done steps were, summed for the build, with the caution that this decides nothing. */
export function FabricationSection({ buildId }: { buildId: string }) {
  const q = useFabricationQuery(buildId);
  return (
    <Section title="Fabrication and assembly">
      {q.isPending ? (
        <LoadingState what="Summing the steps" />
      ) : q.isError ? (
        <ErrorState error={q.error} onRetry={() => q.refetch()} />
      ) : (
        <View style={{ gap: space.sm }}>
          <Txt tone="soft">
            Each done step counts once, for whoever did its work: the builder (making a piece or joining pieces), a
            helper, commercial help or the kit supplier. Inspections count for nobody.
          </Txt>
          <GridTable
            label="Fabrication and assembly by part"
            testID="fabrication-table"
            fold={8}
            columns={columns}
            rows={[
              ...q.data.parts.map((p) => ({
                key: p.travelerId,
                testID: `fabrication-${p.partNumber}`,
                cells: cellsOf(<Mono bold>{p.partNumber}</Mono>, p),
              })),
              {
                key: 'total',
                testID: 'fabrication-total',
                keep: true,
                cells: cellsOf(<Txt bold>The build</Txt>, q.data.total),
              },
            ]}
          />
          <Caution text={fabricationCaution} testID="fabrication-caution" />
        </View>
      )}
    </Section>
  );
}

import { View } from 'react-native';
import { stepKindLabels, type Revision } from '@/db/contracts';
import { space } from '@/constants/theme';
import { KeyValue } from '@/components/ui/sheet';
import { Mono, Txt } from '@/components/ui/text';
import { ZonesTable } from '@/components/travelers/zones-table';
import { useUnits } from '@/hooks/use-units';

/** A revision's numbers as they are frozen: for published and superseded revisions. */
export function RevisionView({ r }: { r: Revision }) {
  const u = useUnits();
  return (
    <View style={{ gap: space.md }} testID={`revision-view-${r.letter}`}>
      <KeyValue label="Material">{r.material}</KeyValue>
      <KeyValue label="Gauge">
        <Mono bold>{u.length(r.gaugeIn)}</Mono>
      </KeyValue>
      <KeyValue label="Rivet">
        <Mono bold>{r.rivetSpec}</Mono>
      </KeyValue>
      <KeyValue label="Drill">
        <Mono bold>
          {r.drillSize} · ⌀ {u.length(r.drillDiameterIn)}
        </Mono>
      </KeyValue>
      <KeyValue label="Edge distance">
        <Mono bold>{u.length(r.edgeDistanceIn)}</Mono>
      </KeyValue>
      <KeyValue label="Chord">
        <Mono>{u.length(r.chordIn)}</Mono>
      </KeyValue>
      <ZonesTable lines={r.lines} />
      {r.steps.length ? (
        <View style={{ gap: space.xs }}>
          <Txt bold>Shop steps</Txt>
          {r.steps.map((s, i) => (
            <Txt key={i}>
              <Mono>{i + 1}.</Mono> {s.text}{' '}
              <Txt variant="small" tone="soft">
                ({stepKindLabels[s.kind]}
                {s.inspectionPoint ? ', inspection point' : ''})
              </Txt>
            </Txt>
          ))}
        </View>
      ) : null}
    </View>
  );
}

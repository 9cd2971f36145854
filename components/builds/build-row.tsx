import { View } from 'react-native';
import type { BuildSummary } from '@/db/contracts';
import { space } from '@/constants/theme';
import { ListRow, RowBar } from '@/components/ui/list-row';
import { Mono, Txt } from '@/components/ui/text';

export function BuildRow({ b, onPress }: { b: BuildSummary; onPress: () => void }) {
  return (
    <ListRow
      testID={`build-${b.kitSerial}`}
      // Everything the row shows in words, its warning included: a button's name is all that is read of it.
      label={`Build ${b.kitSerial}, ${b.kitName}, builder ${b.builders.map((x) => x.name).join(', ') || 'none'}, inspector ${b.inspectors.map((x) => x.name).join(', ') || 'none'}, ${b.travelerCount} parts, ${b.holesDone} of ${b.holesTotal} holes${b.openFindings ? `, ${b.openFindings} open finding${b.openFindings === 1 ? '' : 's'}` : ''}`}
      onPress={onPress}
      chevron
    >
      <View style={{ flex: 1, gap: 2 }}>
        <Txt bold>
          <Mono bold>{b.kitSerial}</Mono> {b.kitName}
        </Txt>
        <Txt variant="small" tone="soft">
          Builder {b.builders.map((x) => x.name).join(', ') || '–'} · inspector{' '}
          {b.inspectors.map((x) => x.name).join(', ') || '–'}
        </Txt>
        <RowBar done={b.holesDone} total={b.holesTotal} />
        <View style={{ flexDirection: 'row', gap: space.md, flexWrap: 'wrap' }}>
          <Mono variant="small">
            {b.travelerCount} parts · {b.holesDone}/{b.holesTotal} holes
          </Mono>
          {b.openFindings ? (
            <Txt variant="small" bold tone="warning">
              ▲ {b.openFindings} open
            </Txt>
          ) : null}
        </View>
      </View>
    </ListRow>
  );
}

import { useMemo, useState } from 'react';
import { View } from 'react-native';
import type { BuildLogPart } from '@/db/contracts';
import { space } from '@/constants/theme';
import { Choice } from '@/components/ui/choice';
import { TextBox } from '@/components/ui/field';
import { Txt } from '@/components/ui/text';

const SHOWN = 8;

/** testID-safe form of a part number. */
export const partKey = (p: Pick<BuildLogPart, 'partNumber'>) => p.partNumber.replace(/[^A-Za-z0-9-]+/g, '_');

/**
 * One part or all of them. A small kit shows every part as a chip; a big one shows a box to type the
 * part number into and the first few parts that match, so hundreds of parts never become a wall of chips.
 */
export function PartPicker({
  parts,
  value,
  onChange,
}: {
  parts: readonly BuildLogPart[];
  value: string | null;
  onChange: (travelerId: string | null) => void;
}) {
  const [typed, setTyped] = useState('');
  const many = parts.length > SHOWN;
  const matching = useMemo(() => {
    const words = typed.trim().toLowerCase().split(/\s+/).filter(Boolean);
    const hits = parts.filter((p) =>
      words.every((w) => `${p.partNumber} ${p.partName} ${p.serial}`.toLowerCase().includes(w)),
    );
    const chosen = parts.find((p) => p.travelerId === value);
    const shown = hits.slice(0, SHOWN);
    return chosen && !shown.includes(chosen) ? [chosen, ...shown] : shown;
  }, [parts, typed, value]);
  const hidden = many ? parts.length - matching.length : 0;

  return (
    <View style={{ gap: space.sm }}>
      {many ? (
        <TextBox
          value={typed}
          onChangeText={setTyped}
          placeholder="Type a part number or name"
          testID="log-part-find"
          accessibilityLabel="Find a part"
          autoCapitalize="characters"
        />
      ) : null}
      <Choice<string>
        testIDPrefix="log-part"
        value={value ?? 'all'}
        onChange={(v) => onChange(v === 'all' ? null : v)}
        options={[
          { value: 'all', label: 'All parts' },
          ...matching.map((p) => ({ value: p.travelerId, label: p.partNumber, hint: p.partName, key: partKey(p) })),
        ]}
      />
      {hidden > 0 ? (
        <Txt variant="small" tone="faint">
          {hidden} more {hidden === 1 ? 'part' : 'parts'}: type to narrow.
        </Txt>
      ) : null}
    </View>
  );
}

import { useState } from 'react';
import { StyleSheet, View, type LayoutChangeEvent } from 'react-native';
import { colors, hairline, space } from '@/constants/theme';
import { Button } from './button';
import { Label } from './text';

export type GridColumn = {
  key: string;
  title: string;
  /** Width in the table layout (px): wide enough for the column's longest value, never shrunk. */
  width: number;
  align?: 'left' | 'right';
};

export type GridRow = {
  key: string;
  testID?: string;
  /** Listed even when a stacked table folds (the row on show). */
  keep?: boolean;
  cells: Record<string, React.ReactNode>;
};

/** A stacked row's block: blocks sit side by side where the space holds two or more of this width. */
const BLOCK_WIDTH = 280;

/**
 * A small table of numbers (a pitch schedule, a zone's loads). Columns keep their width, so values
 * never run together ("0.008.001.00") or break. When the space is narrower than the columns (a phone, a
 * pane beside a form, or text at 200 %) each row stacks into a block of "name value" pairs, blocks side
 * by side where they fit: nothing is hidden off an edge (a sideways-scrolling table hid the margins,
 * the last columns, with no hint). Table and list roles, so a screen reader reads each value with its
 * column's name.
 */
export function GridTable({
  columns,
  rows,
  label,
  testID,
  fold,
}: {
  columns: GridColumn[];
  rows: GridRow[];
  label: string;
  testID?: string;
  /**
   * Stacked, list this many rows (and any row to keep) and the rest on request: ten ribs' blocks of ten
   * figures each buried what follows them on a phone.
   */
  fold?: number;
}) {
  const [width, setWidth] = useState(0);
  const [all, setAll] = useState(false);
  const needed = columns.reduce((n, c) => n + c.width, 0);
  const stacked = width > 0 && width < needed;
  const onLayout = (e: LayoutChangeEvent) => setWidth(Math.round(e.nativeEvent.layout.width));

  if (stacked) {
    const folds = fold !== undefined && rows.length > fold + 1;
    const listed = folds && !all ? rows.filter((r, i) => i < fold || r.keep) : rows;
    return (
      <View onLayout={onLayout} testID={testID} style={{ gap: space.sm }}>
        <View role="list" aria-label={label} style={[styles.stack, width >= 2 * BLOCK_WIDTH && styles.stackWide]}>
          {listed.map((r) => (
            <View
              key={r.key}
              testID={r.testID}
              role="listitem"
              style={[styles.block, width >= 2 * BLOCK_WIDTH && styles.blockWide]}
            >
              {columns.map((c) => (
                <View key={c.key} style={styles.pair}>
                  <Label style={styles.pairName}>{c.title}</Label>
                  <View style={styles.pairValue}>{r.cells[c.key]}</View>
                </View>
              ))}
            </View>
          ))}
        </View>
        {folds ? (
          <Button
            label={all ? `Show the first ${fold}` : `Show all ${rows.length}`}
            variant="secondary"
            compact
            onPress={() => setAll((a) => !a)}
            testID={testID ? `${testID}-show-all` : undefined}
            accessibilityLabel={all ? `${label}: show the first ${fold}` : `${label}: show all ${rows.length}`}
            style={{ alignSelf: 'flex-start' }}
          />
        ) : null}
      </View>
    );
  }

  const table = (
    <View role="table" aria-label={label} style={[styles.table, { minWidth: needed }]}>
      <View role="row" style={[styles.row, styles.head]}>
        {columns.map((c) => (
          <View key={c.key} role="columnheader" style={[styles.cell, { width: c.width, flexGrow: c.width }]}>
            <Label align={c.align}>{c.title}</Label>
          </View>
        ))}
      </View>
      {rows.map((r) => (
        <View key={r.key} role="row" style={styles.row} testID={r.testID}>
          {columns.map((c) => (
            <View
              key={c.key}
              role="cell"
              style={[styles.cell, { width: c.width, flexGrow: c.width }, c.align === 'right' && styles.right]}
            >
              {r.cells[c.key]}
            </View>
          ))}
        </View>
      ))}
    </View>
  );
  return (
    <View onLayout={onLayout} testID={testID}>
      {table}
    </View>
  );
}

const styles = StyleSheet.create({
  table: { borderTopWidth: hairline, borderColor: colors.ink },
  row: {
    flexDirection: 'row',
    alignItems: 'stretch',
    borderBottomWidth: hairline,
    borderColor: colors.rule,
    minHeight: 36,
  },
  head: { borderColor: colors.ink, alignItems: 'flex-end' },
  cell: { paddingHorizontal: space.xs, paddingVertical: space.xs, justifyContent: 'center', flexShrink: 0 },
  right: { alignItems: 'flex-end' },
  stack: { gap: space.sm },
  stackWide: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.lg },
  block: { borderTopWidth: hairline, borderColor: colors.ink, paddingTop: space.xs, gap: 2 },
  blockWide: { flexBasis: BLOCK_WIDTH, flexGrow: 1, maxWidth: 2 * BLOCK_WIDTH },
  pair: { flexDirection: 'row', alignItems: 'baseline', gap: space.sm, flexWrap: 'wrap' },
  pairName: { minWidth: 96 },
  pairValue: { flexShrink: 1, alignItems: 'flex-start' },
});

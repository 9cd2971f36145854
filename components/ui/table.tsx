import { useState } from 'react';
import { FlatList, Pressable, StyleSheet, View, type ListRenderItem } from 'react-native';
import { colors, hairline, space, touch } from '@/constants/theme';
import { useWide } from '@/hooks/use-wide';
import { Txt } from './text';

export type SortDir = 'asc' | 'desc';
export type SortState<K extends string> = { key: K; dir: SortDir };

export type Column<T, K extends string = string> = {
  key: string;
  title: string;
  /** Relative width on a wide screen. */
  flex?: number;
  render: (row: T) => React.ReactNode;
  /** When set, the header sorts by this key. */
  sortKey?: K;
  /** Left out of the stacked phone layout (e.g. repeated in the row's title). */
  hideOnPhone?: boolean;
  /** The narrowest the column may be before its values no longer fit (px, padding included); default 88. */
  minWidth?: number;
};

const COLUMN_MIN = 88;

/** A wide row's cell: never under its column's least width, sharing what is left by `flex`. */
const cellSize = (c: { flex?: number; minWidth?: number }) => ({
  flexGrow: c.flex ?? 1,
  flexShrink: 0,
  flexBasis: c.minWidth ?? COLUMN_MIN,
});

type Props<T, K extends string> = {
  rows: readonly T[];
  columns: Column<T, K>[];
  rowKey: (row: T) => string;
  sort?: SortState<K>;
  onSort?: (key: K) => void;
  onRowPress?: (row: T) => void;
  rowTestID?: (row: T) => string;
  rowLabel?: (row: T) => string;
  empty?: React.ReactNode;
  header?: React.ReactElement;
  /** Under the last row, scrolled with the rows (a paged list's LoadMore). */
  footer?: React.ReactElement;
};

/**
 * A drawing-sheet table: thin rules, sortable headers. On a phone, or in a pane narrower than its
 * columns need (a table beside a form), each row stacks its cells and the sort headers become a row of
 * buttons above the list: squeezed columns broke words and ran values over each other. Rows are a
 * FlatList so long queues stay fast.
 */
export function Table<T, K extends string>({
  rows,
  columns,
  rowKey,
  sort,
  onSort,
  onRowPress,
  rowTestID,
  rowLabel,
  empty,
  header,
  footer,
}: Props<T, K>) {
  const wideScreen = useWide();
  const [width, setWidth] = useState(0);
  const needed = columns.reduce((n, c) => n + (c.minWidth ?? COLUMN_MIN), 0);
  const wide = wideScreen && !(width > 0 && width < needed);
  const sortable = columns.filter((c) => c.sortKey);

  const sortButton = (c: Column<T, K>, style?: object) => {
    const on = sort?.key === c.sortKey;
    const arrow = on ? (sort?.dir === 'asc' ? ' ▲' : ' ▼') : '';
    return (
      <Pressable
        key={c.key}
        testID={`sort-${c.sortKey}`}
        accessibilityRole="button"
        accessibilityLabel={`Sort by ${c.title}${on ? (sort?.dir === 'asc' ? ', ascending' : ', descending') : ''}`}
        onPress={() => c.sortKey && onSort?.(c.sortKey)}
        style={[styles.sortBtn, on && styles.sortOn, style]}
      >
        <Txt variant="label" tone={on ? 'accent' : 'soft'} bold={on}>
          {c.title}
          {arrow}
        </Txt>
      </Pressable>
    );
  };

  const renderItem: ListRenderItem<T> = ({ item }) => {
    const cells = wide ? (
      <View style={styles.wideRow}>
        {columns.map((c) => (
          <View key={c.key} style={[styles.cell, cellSize(c)]}>
            {c.render(item)}
          </View>
        ))}
      </View>
    ) : (
      <View style={styles.phoneRow}>
        {columns
          .filter((c) => !c.hideOnPhone)
          .map((c) => (
            <View key={c.key} style={styles.phoneCell}>
              <Txt variant="label" tone="faint" style={{ width: 84 }}>
                {c.title}
              </Txt>
              <View style={{ flex: 1 }}>{c.render(item)}</View>
            </View>
          ))}
      </View>
    );
    if (!onRowPress) return <View testID={rowTestID?.(item)}>{cells}</View>;
    return (
      <Pressable
        testID={rowTestID?.(item)}
        accessibilityRole="button"
        accessibilityLabel={rowLabel?.(item)}
        onPress={() => onRowPress(item)}
        style={({ pressed, hovered }: { pressed: boolean; hovered?: boolean }) => [
          { minHeight: touch },
          (pressed || hovered) && { backgroundColor: colors.accentSoft },
        ]}
      >
        {cells}
      </Pressable>
    );
  };

  return (
    <FlatList
      data={rows as T[]}
      keyExtractor={rowKey}
      renderItem={renderItem}
      ItemSeparatorComponent={() => <View style={styles.sep} />}
      ListEmptyComponent={empty ? <View>{empty}</View> : null}
      ListFooterComponent={footer}
      ListHeaderComponent={
        <View>
          {header}
          {wide ? (
            <View style={styles.headRow}>
              {columns.map((c) => (
                <View key={c.key} style={[styles.cell, cellSize(c)]}>
                  {c.sortKey && onSort ? (
                    sortButton(c)
                  ) : (
                    <Txt variant="label" tone="soft">
                      {c.title}
                    </Txt>
                  )}
                </View>
              ))}
            </View>
          ) : sortable.length && onSort ? (
            <View style={styles.phoneSort}>
              <Txt variant="label" tone="soft">
                Sort by
              </Txt>
              {sortable.map((c) => sortButton(c, styles.phoneSortBtn))}
            </View>
          ) : null}
        </View>
      }
      stickyHeaderIndices={undefined}
      initialNumToRender={20}
      windowSize={7}
      style={{ flex: 1 }}
      onLayout={(e) => setWidth(Math.round(e.nativeEvent.layout.width))}
      contentContainerStyle={{ paddingBottom: space.xxl }}
    />
  );
}

const styles = StyleSheet.create({
  headRow: {
    flexDirection: 'row',
    alignItems: 'center',
    borderBottomWidth: 2,
    borderBottomColor: colors.ink,
    paddingVertical: space.xs,
  },
  wideRow: { flexDirection: 'row', alignItems: 'center', paddingVertical: space.sm, minHeight: touch },
  cell: { paddingHorizontal: space.sm, minWidth: 0 },
  phoneRow: { paddingVertical: space.md, paddingHorizontal: space.xs, gap: space.xs },
  phoneCell: { flexDirection: 'row', alignItems: 'baseline', gap: space.sm },
  sep: { height: hairline, backgroundColor: colors.rule },
  // 48 px like every other control: a sort header is tapped by a gloved hand on a wide tablet too.
  sortBtn: { minHeight: touch, minWidth: touch, justifyContent: 'center' },
  sortOn: {},
  phoneSort: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.sm,
    flexWrap: 'wrap',
    paddingBottom: space.sm,
    borderBottomWidth: 2,
    borderBottomColor: colors.ink,
  },
  phoneSortBtn: {
    minHeight: touch,
    paddingHorizontal: space.md,
    borderWidth: hairline,
    borderColor: colors.rule,
    backgroundColor: colors.paperRaised,
  },
});

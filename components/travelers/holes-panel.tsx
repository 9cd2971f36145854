import { useCallback, useEffect, useLayoutEffect, useMemo, useRef, useState } from 'react';
import { Platform, StyleSheet, View, type LayoutChangeEvent } from 'react-native';
import type { FastenerLine, Hole } from '@/db/contracts';
import { colors, hairline, space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { Field, TextBox } from '@/components/ui/field';
import { moveFocusTo } from '@/components/ui/focus';
import { Notice } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { useUnits } from '@/hooks/use-units';
import { CHIP_GAP, CHIP_MIN, ChipProbe, HoleChip } from './hole-chip';
import { findTarget, holeItems, itemOffsets, renderRuns, windowRange, type HoleItem } from './hole-window';
import type { RunPick, RunPlan } from './run-selection';
import { usePageScroll, visibleSpan } from './use-page-scroll';

/**
 * A part with up to this many holes is drawn whole (every demo part; the page's find and a screen
 * reader's reading order see every hole). Beyond it only the holes near the screen are drawn.
 */
export const DRAW_ALL_HOLES = 200;
/** Columns before the list's width is known (a test's DOM, the first frame). */
const DEFAULT_COLS = 4;
/** At the least this many holes are drawn about the screen, however short the window. */
const MIN_HOLES = 60;
/** Heights used until an item has been laid out once (px, chip and heading at 100 % text). */
const ROW_GUESS = 84;
const HEAD_GUESS = 40;
const FIRST_GUESS = { row: ROW_GUESS, head: HEAD_GUESS };
const NO_HEIGHTS: ReadonlyMap<string, number> = new Map();

/** Items' laid-out heights (px by key) for a count of columns, and the guess for those not laid out yet. */
type LaidOut = { cols: number; heights: ReadonlyMap<string, number>; guess: { row: number; head: number } };

type Props = {
  lines: FastenerLine[];
  holes: Hole[];
  canTick: boolean;
  mode: 'tap' | 'run';
  pick: RunPick;
  run: Hole[];
  plan: RunPlan | null;
  focusId: string | null;
  onHolePress: (h: Hole) => void;
  onStartRun: () => void;
  onCancelRun: () => void;
  onTickRun: () => void;
  message: { tone: 'error' | 'info'; text: string } | null;
};

export function HolesPanel({
  lines,
  holes,
  canTick,
  mode,
  pick,
  run,
  plan,
  focusId,
  onHolePress,
  onStartRun,
  onCancelRun,
  onTickRun,
  message,
}: Props) {
  const u = useUnits();
  const runSet = useMemo(() => new Set(run.map((h) => h.holeId)), [run]);
  // Focus follows the work: into the run bar when a run starts (its button is gone), back to
  // "Tick a run" when it ends; without this focus fell to the page and a keyboard user started over.
  const runBarRef = useRef<View>(null);
  const runModeRef = useRef<View>(null);
  const lastMode = useRef(mode);
  useEffect(() => {
    if (lastMode.current === mode) return;
    lastMode.current = mode;
    moveFocusTo(mode === 'run' ? runBarRef.current : runModeRef.current);
  }, [mode]);

  // Columns: as many chips of the widest content as fit across the list.
  const [listWidth, setListWidth] = useState(0);
  const [chipWidth, setChipWidth] = useState(0);
  const measured = listWidth > 0 && chipWidth > 0;
  const cols = measured
    ? Math.max(1, Math.floor((listWidth + CHIP_GAP) / (Math.max(CHIP_MIN, chipWidth) + CHIP_GAP)))
    : DEFAULT_COLS;
  const colWidth = measured ? Math.floor((listWidth - CHIP_GAP * (cols - 1)) / cols) : undefined;

  const { items, itemOfHole, itemOfLine, holeCount } = useMemo(
    () => holeItems(lines, holes, cols),
    [lines, holes, cols],
  );
  const windowed = Platform.OS === 'web' && holeCount > DRAW_ALL_HOLES;

  // Heights of items laid out so far, by key, for the columns they were laid out in (another count of
  // columns makes other rows); the rest are guessed at the height last measured for their kind (rows are
  // all alike).
  const [laidOut, setLaidOut] = useState<LaidOut>(() => ({ cols, heights: new Map(), guess: FIRST_GUESS }));
  const onItemLayout = useCallback(
    (key: string, h: number) => {
      if (!(h > 0)) return;
      setLaidOut((was) => {
        const heights = was.cols === cols ? was.heights : NO_HEIGHTS;
        if (heights.get(key) === h) return was;
        const kind = key.startsWith('row:') ? 'row' : 'head';
        // As guessed: nothing moves, so nothing to draw again.
        if (!heights.has(key) && was.guess[kind] === h) return was;
        return { cols, heights: new Map(heights).set(key, h), guess: { ...was.guess, [kind]: h } };
      });
    },
    [cols],
  );
  const heights = laidOut.cols === cols ? laidOut.heights : NO_HEIGHTS;
  const guess = laidOut.guess;
  const offsets = useMemo(
    () =>
      windowed
        ? itemOffsets(items.map((it) => heights.get(it.key) ?? (it.kind === 'row' ? guess.row : guess.head)))
        : [],
    [items, windowed, heights, guess],
  );

  const minItems = Math.ceil(MIN_HOLES / cols) + 2;
  const [range, setRange] = useState<[number, number]>([0, minItems]);
  const listRef = useRef<View>(null);
  const placeWindow = useCallback(() => {
    if (!windowed) return;
    const span = visibleSpan(listRef.current);
    const next: [number, number] = span
      ? // Half a window's height drawn beyond each edge of the screen: a fling or a Tab lands on drawn holes.
        windowRange(offsets, span.top, span.bottom, Math.max(300, (span.bottom - span.top) / 2), minItems)
      : windowRange(offsets, 0, 0, 0, minItems);
    setRange((r) => (r[0] === next[0] && r[1] === next[1] ? r : next));
  }, [windowed, offsets, minItems]);
  useLayoutEffect(placeWindow, [placeWindow]);
  usePageScroll(placeWindow, windowed);

  // The list's width and the widest chip's, read before the first paint and again on every resize
  // (fonts arriving, a phone turned, text made larger).
  const probeRef = useRef<View>(null);
  useLayoutEffect(() => {
    const w = visibleSpan(listRef.current)?.width ?? 0;
    if (w > 0) setListWidth(Math.floor(w));
    const p = visibleSpan(probeRef.current)?.width ?? 0;
    if (p > 0) setChipWidth(Math.ceil(p));
  }, []);
  const onListLayout = useCallback((e: LayoutChangeEvent) => setListWidth(Math.floor(e.nativeEvent.layout.width)), []);

  // Keyboard focus and a hole asked for by id stay drawn however far the page scrolls from them.
  const [focusedHole, setFocusedHole] = useState<string | null>(null);
  // Let go only once focus has left the list, after the blur: dropping the pin during the blur would
  // take away the row that Tab is moving focus to (it landed on the page's body).
  const onFocusHole = useCallback((id: string | null) => {
    if (id) {
      setFocusedHole(id);
      return;
    }
    setTimeout(() => {
      const list = listRef.current as unknown as HTMLElement | null;
      const now = typeof document === 'undefined' ? null : document.activeElement;
      if (!list?.contains?.(now)) setFocusedHole(null);
    }, 0);
  }, []);
  const [wanted, setWanted] = useState<{ holeId?: string; line?: string; n: number } | null>(null);
  const keep: number[] = [];
  // With two items either side of it (one may be a heading), so Tab and Shift+Tab go on to the next
  // hole along the line, not to whatever is drawn where the page has been scrolled to.
  if (focusedHole && itemOfHole.has(focusedHole)) {
    const at = itemOfHole.get(focusedHole)!;
    keep.push(at - 2, at - 1, at, at + 1, at + 2);
  }
  if (wanted?.holeId && itemOfHole.has(wanted.holeId)) keep.push(itemOfHole.get(wanted.holeId)!);
  // A line's heading with its first rows, so Tab from the heading lands on the line's first hole.
  if (wanted?.line && itemOfLine.has(wanted.line))
    for (let i = 0; i < 4; i++) keep.push(itemOfLine.get(wanted.line)! + i);
  useLayoutEffect(() => {
    if (!wanted) return;
    const list = listRef.current as unknown as HTMLElement | null;
    const node = list?.querySelector?.<HTMLElement>(
      `[data-testid="${wanted.holeId ? `hole-${wanted.holeId}` : `holes-${wanted.line}`}"]`,
    );
    if (node) {
      node.scrollIntoView?.({ block: 'center' });
      moveFocusTo(node);
    }
  }, [wanted]);
  // Once the page has scrolled there the window covers it (and focus holds it): let it go.
  useEffect(() => {
    if (!wanted) return;
    const id = setTimeout(() => setWanted((w) => (w === wanted ? null : w)), 500);
    return () => clearTimeout(id);
  }, [wanted]);

  const [goTo, setGoTo] = useState('');
  const [goToError, setGoToError] = useState<string | undefined>();
  const go = () => {
    const target = findTarget(goTo, holes, lines);
    if (!target) {
      setGoToError(
        goTo.trim()
          ? `No hole or line ${goTo.trim()} on this part.`
          : 'Type a hole id, such as U-07, or a line, such as U.',
      );
      return;
    }
    setGoToError(undefined);
    setWanted((w) =>
      'hole' in target
        ? { holeId: target.hole.holeId, n: (w?.n ?? 0) + 1 }
        : { line: target.line.code, n: (w?.n ?? 0) + 1 },
    );
  };

  // The longest id and station of the part set the width of every column.
  const probe = useMemo(() => {
    let holeId = '';
    let station = '';
    for (const h of holes) {
      if (h.holeId.length > holeId.length) holeId = h.holeId;
      const s = u.station(h.stationIn);
      if (s.length > station.length) station = s;
    }
    return { holeId, station };
  }, [holes, u]);

  const renderItem = (it: HoleItem) => {
    if (it.kind === 'head') {
      return (
        <Measured
          key={it.key}
          id={it.key}
          onSize={windowed ? onItemLayout : undefined}
          style={[styles.head, it !== items[0] && styles.headAfter]}
        >
          <View testID={`holes-${it.line.code}`}>
            <Txt bold accessibilityRole="header" aria-level={3}>
              <Mono bold>{it.line.code}</Mono> {it.line.name}{' '}
              <Mono variant="small" tone="soft">
                {it.done}/{it.total}
              </Mono>
            </Txt>
          </View>
        </Measured>
      );
    }
    return (
      <Measured key={it.key} id={it.key} onSize={windowed ? onItemLayout : undefined} style={styles.row}>
        {it.holes.map((h) => (
          <HoleChip
            key={h.holeId}
            hole={h}
            station={u.station(h.stationIn)}
            picking={mode === 'run'}
            inRun={mode === 'run' && runSet.has(h.holeId)}
            isRunStart={mode === 'run' && pick?.firstId === h.holeId}
            focused={focusId === h.holeId}
            disabled={!canTick}
            width={colWidth}
            onPress={onHolePress}
            onFocusHole={windowed ? onFocusHole : undefined}
          />
        ))}
      </Measured>
    );
  };

  let body: React.ReactNode[];
  if (!windowed) {
    body = items.map(renderItem);
  } else {
    const runs = renderRuns(offsets, range, keep);
    body = [];
    let end = 0;
    for (const r of runs) {
      if (r.gapBefore > 0) body.push(<View key={`gap:${r.from}`} style={{ height: r.gapBefore }} />);
      for (let i = r.from; i < r.to; i++) body.push(renderItem(items[i]));
      end = r.to;
    }
    const tail = offsets[items.length] - offsets[end];
    if (tail > 0) body.push(<View key="gap:end" style={{ height: tail }} />);
  }

  return (
    <View style={{ gap: space.md }} testID="holes">
      {canTick ? (
        mode === 'tap' ? (
          <View style={styles.bar}>
            <Txt variant="small" tone="soft" style={{ flex: 1, minWidth: 160 }}>
              Tap a hole to tick it in, or tap again to take the tick off.
            </Txt>
            <Button ref={runModeRef} label="Tick a run" variant="secondary" onPress={onStartRun} testID="run-mode" />
          </View>
        ) : (
          <View
            ref={runBarRef}
            style={[styles.bar, styles.runBar]}
            testID="run-bar"
            role="group"
            aria-label="Tick a run"
          >
            <Txt style={{ flex: 1, minWidth: 180 }} testID="run-summary" accessibilityLiveRegion="polite">
              {!pick
                ? 'Tap the first hole of the run.'
                : !pick.lastId
                  ? `From ${pick.firstId}: now tap the last hole of the run on line ${pick.line}.`
                  : plan?.summary}
            </Txt>
            <View style={styles.runButtons}>
              <Button label="Cancel" variant="quiet" onPress={onCancelRun} testID="run-cancel" />
              <Button
                label={
                  plan?.action?.status === 'pending'
                    ? `Untick ${plan.action.holeIds.length}`
                    : `Tick ${plan?.action?.holeIds.length ?? 0} holes`
                }
                disabled={!pick?.lastId || !plan?.action}
                onPress={onTickRun}
                testID="tick-run"
              />
            </View>
          </View>
        )
      ) : null}
      {message ? (
        <Notice tone={message.tone} testID={message.tone === 'error' ? 'tick-error' : 'tick-info'}>
          {message.text}
        </Notice>
      ) : null}
      {windowed ? (
        // A long list shows only the holes near the screen: this reaches any of them at once, by
        // keyboard or screen reader as well as by thumb (and picks a run's far end without scrolling to it).
        <View style={styles.bar}>
          <View style={{ flex: 1, minWidth: 180 }}>
            <Field
              label="Go to a hole"
              hint={`${holeCount} holes on ${lines.length} line${lines.length === 1 ? '' : 's'}: those near the screen are shown as you scroll.`}
              error={goToError}
              testID="hole-go-to-field"
            >
              <TextBox
                value={goTo}
                onChangeText={(s) => {
                  setGoTo(s);
                  setGoToError(undefined);
                }}
                onSubmitEditing={go}
                placeholder="Hole id or line, e.g. U-120"
                accessibilityLabel="Go to a hole: its id or its line"
                autoCorrect={false}
                autoCapitalize="characters"
                mono
                testID="hole-go-to"
              />
            </Field>
          </View>
          <Button
            label="Go"
            variant="secondary"
            onPress={go}
            testID="hole-go-to-go"
            style={{ alignSelf: 'flex-end' }}
          />
        </View>
      ) : null}
      <View ref={listRef} onLayout={onListLayout} testID="holes-list">
        <ChipProbe holeId={probe.holeId} station={probe.station} onWidth={setChipWidth} ref={probeRef} />
        {body}
      </View>
    </View>
  );
}

/** An item of the list that reports its height once laid out (only when the list is windowed). */
function Measured({
  id,
  onSize,
  style,
  children,
}: {
  id: string;
  onSize?: (key: string, h: number) => void;
  style: React.ComponentProps<typeof View>['style'];
  children: React.ReactNode;
}) {
  return (
    <View style={style} onLayout={onSize ? (e) => onSize(id, e.nativeEvent.layout.height) : undefined}>
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  bar: { flexDirection: 'row', alignItems: 'center', gap: space.md, flexWrap: 'wrap' },
  runBar: { backgroundColor: colors.accentSoft, padding: space.md, borderWidth: hairline, borderColor: colors.accent },
  runButtons: { flexDirection: 'row', gap: space.sm },
  // Spacing inside each item, so an item's measured height is the whole step to the next one.
  head: { paddingBottom: space.sm },
  headAfter: { paddingTop: space.md },
  row: { flexDirection: 'row', gap: CHIP_GAP, paddingBottom: CHIP_GAP },
});

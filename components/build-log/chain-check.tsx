import { useRef, useState } from 'react';
import { Platform, StyleSheet, View } from 'react-native';
import {
  chainHeadPattern,
  LOG_CHECK_FILE_MAX_MB,
  logCsvColumns,
  type LogChainBreak,
  type LogChainProblem,
  type LogFileCheck,
} from '@/db/contracts';
import { colors, space } from '@/constants/theme';
import { Button } from '@/components/ui/button';
import { KeyValue, Section } from '@/components/ui/sheet';
import { Notice } from '@/components/ui/states';
import { Mono, Txt } from '@/components/ui/text';
import { errorMessage } from '@/lib/api-client';
import { pickWebFile } from '@/lib/pick-file';
import { useBuildLogCheckMutation, type BuildLogCheck } from '@/hooks/queries/build-log';

/** Where an entry sits in the chosen file: its row as a spreadsheet numbers it (the heading row is 1), and what it says. */
export type FileRow = { row: number; when: string; what: string };
/** What the answer's entries are matched with in the file, and the chain head the file says it was exported at. */
export type LogFileRows = { rows: Map<string, FileRow>; head: { seq: number; hash: string } | null };

// The export's own column names and closing row, as db/contracts/log-chain.ts names them for both sides.
const WHAT = logCsvColumns.what;
const DATE = logCsvColumns.dateDone;
const TIME = logCsvColumns.timeDone;
const HEAD_ROW = chainHeadPattern;

/**
 * The records of a CSV as RFC 4180 writes them (quoted fields may hold commas, quotes and line breaks),
 * a leading byte-order mark dropped. One pass over the text; the file's size is capped before it is read.
 */
export function* csvRecords(text: string): Generator<string[]> {
  let record: string[] = [];
  let field = '';
  let quoted = false;
  for (let i = text.charCodeAt(0) === 0xfeff ? 1 : 0; i < text.length; i++) {
    const c = text[i];
    if (quoted) {
      if (c !== '"') field += c;
      else if (text[i + 1] === '"') {
        field += '"';
        i++;
      } else quoted = false;
    } else if (c === '"') quoted = true;
    else if (c === ',') {
      record.push(field);
      field = '';
    } else if (c === '\r' || c === '\n') {
      if (c === '\r' && text[i + 1] === '\n') i++;
      record.push(field);
      yield record;
      record = [];
      field = '';
    } else field += c;
  }
  if (field || record.length) {
    record.push(field);
    yield record;
  }
}

/**
 * The rows of the file that the answer names (the answer speaks of entries only), and the closing chain-head
 * row. Only the wanted entries are kept, so the map is no longer than the answer's capped lists.
 */
export function readLogRows(text: string, wanted: ReadonlySet<string>): LogFileRows {
  const rows = new Map<string, FileRow>();
  let head: LogFileRows['head'] = null;
  let col: Record<'entry' | 'what' | 'date' | 'time', number> | null = null;
  let row = 0;
  for (const record of csvRecords(text)) {
    row++;
    if (!col) {
      const names = record.map((c) => c.trim());
      col = {
        entry: names.indexOf(logCsvColumns.entry),
        what: names.indexOf(WHAT),
        date: names.indexOf(DATE),
        time: names.indexOf(TIME),
      };
      if (col.entry < 0) return { rows, head };
      continue;
    }
    const cell = (i: number) => (i >= 0 ? (record[i] ?? '').trim() : '');
    const entryId = cell(col.entry);
    if (!entryId) {
      const m = record.map((c) => HEAD_ROW.exec(c.trim())).find(Boolean);
      if (m) head = { seq: Number(m[1]), hash: m[2] };
      continue;
    }
    if (wanted.has(entryId) && !rows.has(entryId))
      rows.set(entryId, {
        row,
        when: [cell(col.date), cell(col.time)].filter(Boolean).join(' '),
        what: cell(col.what),
      });
  }
  return { rows, head };
}

/** Every entry id the answer lists. */
export const namedEntries = (c: LogFileCheck) =>
  new Set([...c.differing.map((d) => d.entryId), ...c.notInDatabase, ...c.breaks.map((b) => b.entryId)]);

export const matches = (c: LogFileCheck) =>
  c.rowsRead > 0 && c.differingCount === 0 && c.notInDatabaseCount === 0 && c.breaks.length === 0;

const short = (hash: string) => (hash.length > 12 ? `${hash.slice(0, 12)}…` : hash || 'none');
const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/** The summary line: it matches, or how many rows differ and how. */
export function checkSummary(c: LogFileCheck): string {
  if (c.rowsRead === 0) return 'The file holds no log entries to check: choose the CSV exported from this build’s log.';
  if (matches(c))
    return `The file matches the log kept here: all ${plural(c.rowsRead, 'entry', 'entries')} have the hash stored for them.`;
  const found = [
    c.differingCount ? `${plural(c.differingCount, 'row')} changed` : '',
    c.notInDatabaseCount ? `${plural(c.notInDatabaseCount, 'row')} not in this build’s log` : '',
    c.breaks.length ? `${plural(c.breaks.length, 'problem')} in the log kept here` : '',
  ].filter(Boolean);
  return `The file does not match: ${found.join(', ')}. ${c.matching} of ${c.rowsRead} rows match.`;
}

const problemWords: Record<LogChainProblem, string> = {
  missing: 'Removed: the entry is gone from the database.',
  changed: 'Changed in the database: the stored entry is no longer what was written.',
  unchained: 'Not in the chain: the entry was stored without a link.',
};

/** Where an entry is, in words: its row in the file with its date and words, or only its id. */
function placeOf(entryId: string, rows: LogFileRows['rows']): string {
  const r = rows.get(entryId);
  if (!r) return `Entry ${entryId}`;
  return [`Row ${r.row}`, r.when, r.what].filter(Boolean).join(' · ');
}

/** Opens the browser's chooser for one CSV (web only): the same hidden input as a notice's PDF, refused here when too large. */
function pickCsv() {
  return pickWebFile({
    accept: 'text/csv,.csv',
    maxBytes: LOG_CHECK_FILE_MAX_MB * 1024 * 1024,
    unavailable: 'An exported log is checked from the web app.',
  });
}

/** The file's text, or null when the browser cannot read it (the answer is then shown by entry id alone). */
function readText(file: Blob): Promise<string | null> {
  return new Promise((resolve) => {
    const reader = new FileReader();
    reader.onload = () => resolve(typeof reader.result === 'string' ? reader.result : null);
    reader.onerror = () => resolve(null);
    reader.readAsText(file);
  });
}

/** One differing entry: where it is, then what differs, in words. */
function Finding({ place, what, detail, testID }: { place: string; what: string; detail?: string; testID: string }) {
  return (
    <View role="listitem" style={styles.item} testID={testID}>
      <Txt variant="small" bold>
        {place}
      </Txt>
      <Txt variant="small">{what}</Txt>
      {detail ? (
        <Mono variant="small" tone="soft" wrap>
          {detail}
        </Mono>
      ) : null}
    </View>
  );
}

/** "and 12 more" under a list the server capped. */
function More({ shown, count }: { shown: number; count: number }) {
  return count > shown ? <Txt variant="small" tone="soft">{`and ${count - shown} more, not listed.`}</Txt> : null;
}

function CheckResult({ answer, file }: { answer: BuildLogCheck; file: LogFileRows }) {
  const c = answer.check;
  const ok = matches(c);
  const head = answer.chain?.head ?? null;
  return (
    <View style={{ gap: space.md }} testID="log-check-result">
      <Notice tone={ok ? 'ok' : 'caution'} testID="log-check-summary" focusOnShow>
        {checkSummary(c)}
      </Notice>
      <View style={{ gap: space.xs }} testID="log-check-head">
        <KeyValue label="File">{answer.name}</KeyValue>
        <KeyValue label="Exported at">
          {file.head ? <Mono wrap>{`link ${file.head.seq} · ${file.head.hash}`}</Mono> : 'the file does not say'}
        </KeyValue>
        <KeyValue label="Chain head here">
          {head ? <Mono wrap>{`link ${head.seq} · ${head.hash}`}</Mono> : 'no entries chained yet'}
        </KeyValue>
      </View>
      {c.differing.length ? (
        <View role="list" aria-label="Rows changed" style={styles.list} testID="log-check-changed">
          {c.differing.map((d) => (
            <Finding
              key={d.entryId}
              place={placeOf(d.entryId, file.rows)}
              what={`Changed: the row’s entry hash is not the one stored for entry ${d.entryId}. The row, or the entry stored here, was altered after the export.`}
              detail={`file ${short(d.fileHash)} · stored ${short(d.storedHash)}`}
              testID={`log-check-changed-${d.entryId}`}
            />
          ))}
          <More shown={c.differing.length} count={c.differingCount} />
        </View>
      ) : null}
      {c.notInDatabase.length ? (
        <View role="list" aria-label="Rows not in this log" style={styles.list} testID="log-check-added">
          {c.notInDatabase.map((id, i) => (
            <Finding
              key={`${id}-${i}`}
              place={placeOf(id, file.rows)}
              what={`Added: entry ${id} is in the file but not in this build’s log. The row was added to the file, or comes from another build.`}
              testID={`log-check-added-${i}`}
            />
          ))}
          <More shown={c.notInDatabase.length} count={c.notInDatabaseCount} />
        </View>
      ) : null}
      {c.breaks.length ? (
        <View role="list" aria-label="Problems in the log kept here" style={styles.list} testID="log-check-breaks">
          {c.breaks.map((b: LogChainBreak) => (
            <Finding
              key={`${b.entryId}-${b.problem}`}
              place={`${b.seq === null ? 'No link' : `Link ${b.seq}`} · ${placeOf(b.entryId, file.rows)}`}
              what={problemWords[b.problem]}
              testID={`log-check-break-${b.entryId}`}
            />
          ))}
        </View>
      ) : null}
    </View>
  );
}

/**
 * Checks a CSV exported from this log against the hash chain kept here: the server compares each row's
 * entry hash with the stored one; the rows it names are found in the file for their row numbers and words.
 */
export function ChainCheck({ buildId }: { buildId: string }) {
  const checker = useBuildLogCheckMutation(buildId);
  const [pickError, setPickError] = useState<string | null>(null);
  const [result, setResult] = useState<{ answer: BuildLogCheck; file: LogFileRows } | null>(null);
  const [reading, setReading] = useState(false);
  // A later choice wins over an earlier answer still on its way.
  const turn = useRef(0);
  const web = Platform.OS === 'web';

  const choose = async () => {
    setPickError(null);
    checker.reset();
    const { file, error } = await pickCsv();
    setPickError(error);
    if (!file) return;
    const mine = ++turn.current;
    setResult(null);
    setReading(true);
    try {
      const answer = await checker.mutateAsync({ file, name: file.name });
      const text = await readText(file);
      const rows = text === null ? { rows: new Map(), head: null } : readLogRows(text, namedEntries(answer.check));
      if (mine === turn.current) setResult({ answer, file: rows });
    } catch {
      /* the server's words are in checker.error */
    } finally {
      if (mine === turn.current) setReading(false);
    }
  };

  return (
    <Section title="Check an exported log" testID="log-check">
      <Txt variant="small" tone="soft">
        A CSV exported from this log can be checked against the log kept here: any row changed, added or removed is
        named, with its row in the file.
      </Txt>
      {web ? (
        <Button
          label="Choose a CSV to check"
          variant="secondary"
          onPress={() => void choose()}
          busy={reading}
          busyLabel="Checking the file"
          testID="log-check-choose"
        />
      ) : (
        <Txt variant="small">Open Pitchcard in a browser to check an exported file.</Txt>
      )}
      {pickError ? (
        <Notice tone="error" testID="log-check-error">
          {pickError}
        </Notice>
      ) : null}
      {checker.isError && !reading ? (
        <Notice tone="error" testID="log-check-error" focusOnShow>
          {`Not checked: ${errorMessage(checker.error)}`}
        </Notice>
      ) : null}
      {result && !reading ? <CheckResult answer={result.answer} file={result.file} /> : null}
    </Section>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
  item: { gap: 2, borderLeftWidth: 3, borderLeftColor: colors.caution, paddingLeft: space.sm },
});

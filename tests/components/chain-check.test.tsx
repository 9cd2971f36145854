import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import type { LogChainReport, LogFileCheck } from '@/db/contracts';
import { ChainCheck } from '@/components/build-log/chain-check';
import { csvChainHead, csvHead, csvLines } from '@/server/build-log/build-log-csv';
import { logEntry } from '../fixtures/build-log';
import { renderWeb } from './render-web';

// Three entries of build b1 as the export writes them (the app's own CSV writer), the first with a note that
// spans two lines: a spreadsheet still shows it as one row, so the entries sit in rows 2, 3 and 4.
const A = 't:0b6f3c1e-0000-4000-8000-000000000001';
const B = 'f:0b6f3c1e-0000-4000-8000-000000000002';
const C = 'b:0b6f3c1e-0000-4000-8000-000000000003';
const hash = (d: string) => d.repeat(64);
const entries = [
  logEntry({ id: A, hash: hash('a'), note: 'Hole looks oval,\n"re-drill" next' }),
  logEntry({ id: B, hash: hash('b'), at: '2026-11-04T15:00:00.000Z', text: 'Flagged hole U-09 as suspect.' }),
  logEntry({ id: C, hash: hash('c'), at: '2026-11-05T09:30:00.000Z', text: 'Shipped the wing kit.' }),
];
const head = { seq: 3, hash: hash('c') };
const csv = `${csvHead()}${csvLines(entries, 'UTC', 'https://pitchcard.example')}${csvChainHead(head)}`;
const file = () => new File([csv], 'build-log-NK2-0147.csv', { type: 'text/csv' });

const chain: LogChainReport = { length: 3, head, ok: true, breaks: [] };
const answer = (over: Partial<LogFileCheck> = {}): LogFileCheck => ({
  rowsRead: 3,
  matching: 3,
  differing: [],
  differingCount: 0,
  notInDatabase: [],
  notInDatabaseCount: 0,
  breaks: [],
  ...over,
});

type Reply = { status: number; body: unknown };
const original = globalThis.fetch;
let sent: { url: string; init?: RequestInit }[] = [];

/** The server: POST …/log/check answers `check`, GET …/log/chain answers the chain. */
function serve(check: Reply) {
  sent = [];
  globalThis.fetch = jest.fn(async (url: string, init?: RequestInit) => {
    sent.push({ url, init });
    const r: Reply = url.endsWith('/log/check') ? check : { status: 200, body: chain };
    return { ok: r.status < 400, status: r.status, text: async () => JSON.stringify(r.body) };
  }) as unknown as typeof fetch;
}

/** The browser's file chooser: the hidden input gets `f` as if the person picked it. */
function picks(f: File) {
  return jest.spyOn(HTMLInputElement.prototype, 'click').mockImplementation(function (this: HTMLInputElement) {
    Object.defineProperty(this, 'files', { value: [f] });
    this.dispatchEvent(new Event('change'));
  });
}

async function checkFile(check: Reply) {
  serve(check);
  const click = picks(file());
  const qc = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  const r = renderWeb(
    <QueryClientProvider client={qc}>
      <ChainCheck buildId="b1" />
    </QueryClientProvider>,
  );
  try {
    await r.press('log-check-choose');
    await r.settle();
  } finally {
    click.mockRestore();
  }
  return r;
}

afterEach(() => {
  globalThis.fetch = original;
});

describe('checking an exported log', () => {
  it('sends the chosen CSV as the "file" field and says it matches, with the chain head', async () => {
    const r = await checkFile({ status: 200, body: answer() });
    const post = sent.find((s) => s.url.endsWith('/api/builds/b1/log/check'))!;
    expect(post.init?.method).toBe('POST');
    const sentFile = (post.init?.body as FormData).get('file') as File;
    expect(sentFile.name).toBe('build-log-NK2-0147.csv');

    expect(r.byTestId('log-check-summary').textContent).toBe(
      'The file matches the log kept here: all 3 entries have the hash stored for them.',
    );
    const headLine = r.byTestId('log-check-head').textContent;
    expect(headLine).toContain(`Exported atlink 3 · ${hash('c')}`);
    expect(headLine).toContain(`Chain head herelink 3 · ${hash('c')}`);
    expect(r.queryByTestId('log-check-changed')).toBeNull();
    expect(r.queryByTestId('log-check-error')).toBeNull();
  });

  it('names each differing row by its row in the file, its words and what differs', async () => {
    const r = await checkFile({
      status: 200,
      body: answer({
        matching: 1,
        differing: [{ entryId: C, fileHash: hash('c'), storedHash: hash('d') }],
        differingCount: 1,
        notInDatabase: [A],
        notInDatabaseCount: 1,
        breaks: [{ seq: 2, entryId: B, problem: 'missing' }],
      }),
    });
    expect(r.byTestId('log-check-summary').textContent).toBe(
      'The file does not match: 1 row changed, 1 row not in this build’s log, 1 problem in the log kept here. 1 of 3 rows match.',
    );
    const changed = r.byTestId(`log-check-changed-${C}`).textContent;
    expect(changed).toContain('Row 4 · 2026-11-05');
    expect(changed).toContain('Shipped the wing kit.');
    expect(changed).toContain(`Changed: the row’s entry hash is not the one stored for entry ${C}.`);
    expect(changed).toContain('file cccccccccccc… · stored dddddddddddd…');
    const added = r.byTestId('log-check-added-0').textContent;
    expect(added).toContain('Row 2 · 2026-11-03');
    expect(added).toContain(`Added: entry ${A} is in the file but not in this build’s log.`);
    const removed = r.byTestId(`log-check-break-${B}`).textContent;
    expect(removed).toContain('Link 2 · Row 3 · 2026-11-04');
    expect(removed).toContain('Removed: the entry is gone from the database.');
  });

  it('shows the server’s own words when it refuses the file', async () => {
    const message =
      'the file has no "Entry" and "Entry hash" columns: export the build\'s log as CSV again and check that file';
    const r = await checkFile({
      status: 400,
      body: { error: { code: 'bad_request', message, fields: { file: 'no entry hash columns' } } },
    });
    expect(r.byTestId('log-check-error').textContent).toBe(`Not checked: ${message}`);
    expect(r.queryByTestId('log-check-result')).toBeNull();
  });
});

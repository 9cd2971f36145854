import { Readable } from 'node:stream';
import { CsvError, parse } from 'csv-parse';
import {
  LOG_CHECK_LIST_MAX,
  logCsvColumns,
  logEntryIdPattern,
  type LogChainBreak,
  type LogChainReport,
  type LogFileCheck,
} from '../../db/contracts';
import type { AppContext } from '../context';
import { listVisibleBuilds } from '../builds/builds-repository';
import { badRequest, notFound } from '../http-error';
import {
  chainHead,
  checkChain,
  STORED_HASHES_MAX,
  storedHashes,
  type ChainBreakRow,
  type LogSourceLetter,
} from './log-chain-repository';

type Deps = Pick<AppContext, 'db'>;

/** An uploaded file as multer holds it in memory. */
export type UploadedLog = { buffer: Buffer };

/** Longest cell text an answer repeats from the file: a hash is 64 characters, an entry id 38. */
const ECHO_MAX = 100;
/** Bytes handed to the CSV parser at a time. */
const CHUNK = 64 * 1024;

const breakOf = (r: ChainBreakRow): LogChainBreak => ({
  seq: r.seq,
  entryId: `${r.source}:${r.eventId}`,
  problem: r.problem,
});

/** Records of the file, parsed as RFC 4180 by csv-parse; the byte-order mark an export starts with is dropped. */
function csvRecords(buffer: Buffer): AsyncIterable<string[]> {
  const chunks = (function* () {
    for (let i = 0; i < buffer.length; i += CHUNK) yield buffer.subarray(i, i + CHUNK);
  })();
  return Readable.from(chunks).pipe(
    parse({ bom: true, relax_column_count: true, skip_empty_lines: true, max_record_size: 1024 * 1024 }),
  );
}

/** The 400s a file gets before any row is compared: none, not text, not a CSV of ours. */
function plainCsvText(file: UploadedLog | undefined): Buffer {
  if (!file) throw badRequest('attach the exported log as a CSV file in the "file" field', { file: 'no file' });
  if (!file.buffer.length) throw badRequest('the file is empty: attach the exported log CSV', { file: 'empty' });
  if (file.buffer.includes(0))
    throw badRequest('the file is not a CSV (it holds binary data): attach the exported log CSV', {
      file: 'not a CSV',
    });
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(file.buffer);
  } catch {
    throw badRequest('the file is not UTF-8 text: attach the exported log CSV as it was downloaded', {
      file: 'not UTF-8 text',
    });
  }
  return file.buffer;
}

export const logChainService = ({ db }: Deps) => {
  async function mustSee(user: Express.User, buildId: string) {
    const [build] = await listVisibleBuilds(db, user, buildId);
    if (!build) throw notFound('build');
  }

  const breaks = async (user: Express.User, buildId: string) => (await checkChain(db, user, buildId)).map(breakOf);

  return {
    /** 404 for a build the person may not see: the router asks before it reads an upload. */
    mustSee,

    /** The build's chain: its length, its last link and what the database's own check finds. */
    async chain(user: Express.User, buildId: string): Promise<LogChainReport> {
      await mustSee(user, buildId);
      const [{ length, head }, found] = await Promise.all([chainHead(db, user, buildId), breaks(user, buildId)]);
      return { length, head, ok: found.length === 0, breaks: found };
    },

    /**
     * An exported CSV against the stored chain: each row's `Entry hash` beside the hash stored for its
     * `Entry`. Rows are compared in batches of STORED_HASHES_MAX as they are parsed, so the work is one
     * lookup per batch whatever the file holds (its size is capped by the upload).
     */
    async checkFile(user: Express.User, buildId: string, file: UploadedLog | undefined): Promise<LogFileCheck> {
      await mustSee(user, buildId);
      const text = plainCsvText(file);
      const out: LogFileCheck = {
        rowsRead: 0,
        matching: 0,
        differing: [],
        differingCount: 0,
        notInDatabase: [],
        notInDatabaseCount: 0,
        breaks: [],
      };
      const unknown = (entryId: string) => {
        out.notInDatabaseCount++;
        if (out.notInDatabase.length < LOG_CHECK_LIST_MAX) out.notInDatabase.push(entryId.slice(0, ECHO_MAX));
      };
      let batch: { entryId: string; source: LogSourceLetter; eventId: string; fileHash: string }[] = [];
      const compare = async () => {
        const stored = await storedHashes(db, user, buildId, batch);
        for (const row of batch) {
          const storedHash = stored.get(row.entryId);
          if (storedHash === undefined) unknown(row.entryId);
          else if (storedHash === row.fileHash) out.matching++;
          else {
            out.differingCount++;
            if (out.differing.length < LOG_CHECK_LIST_MAX)
              out.differing.push({ entryId: row.entryId, fileHash: row.fileHash.slice(0, ECHO_MAX), storedHash });
          }
        }
        batch = [];
      };

      let columns: { entry: number; hash: number } | null = null;
      try {
        for await (const record of csvRecords(text)) {
          if (!columns) {
            const names = record.map((c) => c.trim());
            const entry = names.indexOf(logCsvColumns.entry);
            const hash = names.indexOf(logCsvColumns.entryHash);
            if (entry < 0 || hash < 0)
              throw badRequest(
                `the file has no "${logCsvColumns.entry}" and "${logCsvColumns.entryHash}" columns: export the build's log as CSV again and check that file`,
                { file: 'no entry hash columns' },
              );
            columns = { entry, hash };
            continue;
          }
          // The closing row (the chain head) and any row without an entry id are not entries.
          const entryId = (record[columns.entry] ?? '').trim();
          if (!entryId) continue;
          out.rowsRead++;
          if (!logEntryIdPattern.test(entryId)) {
            unknown(entryId);
            continue;
          }
          const fileHash = (record[columns.hash] ?? '').trim().toLowerCase();
          batch.push({ entryId, source: entryId[0] as LogSourceLetter, eventId: entryId.slice(2), fileHash });
          if (batch.length === STORED_HASHES_MAX) await compare();
        }
      } catch (err) {
        if (err instanceof CsvError)
          throw badRequest(`the file is not a CSV that can be read: ${err.message}`, { file: 'not a CSV' });
        throw err;
      }
      if (!columns) throw badRequest('the file has no rows: attach the exported log CSV', { file: 'no rows' });
      if (batch.length) await compare();
      out.breaks = await breaks(user, buildId);
      return out;
    },
  };
};

import { z } from 'zod';

/**
 * The build log's hash chain, as the API reports it. Every log entry (`b:`, `f:` or `t:` and the event's
 * id) has a link: its place in the build's chain (`seq`, 1…n in the order written) and a SHA-256 over the
 * previous link's hash and the event's stored fields (server/build-log/README.md, "Hash chain").
 */

/** What the chain check finds wrong with one entry. */
export const logChainProblems = [
  /** The link's event is gone from the database. */
  'missing',
  /** The event (or its link) is not what was written: its hash no longer follows from the stored previous one. */
  'changed',
  /** An event of the build has no link at all. */
  'unchained',
] as const;
export type LogChainProblem = (typeof logChainProblems)[number];

/** Most breaks, differing rows or unknown entries an answer lists; the counts beside them are whole. */
export const LOG_CHECK_LIST_MAX = 50;
/** Largest exported log a check takes, in megabytes (the upload is held in memory while it is read). */
export const LOG_CHECK_FILE_MAX_MB = 20;

/** The exported CSV's columns that the file check (server and screen) reads; the export writes them under these names. */
export const logCsvColumns = {
  entry: 'Entry',
  entryHash: 'Entry hash',
  what: 'What happened',
  dateDone: 'Date done',
  timeDone: 'Time done',
} as const;

/** The export's closing row, in its "What happened" cell: the chain's head when the file was made. */
export const chainHeadCell = (head: { seq: number; hash: string } | null) =>
  head ? `Chain head at export: link ${head.seq}, ${head.hash}` : 'Chain head at export: no entries chained yet';
/** The same cell read back: link and hash. */
export const chainHeadPattern = /^Chain head at export: link (\d+), ([0-9a-f]{64})$/;

/** A log entry's id: the source letter, a colon and the event's uuid. */
export const logEntryIdPattern = /^[bft]:[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;

const hash = z.string().regex(/^[0-9a-f]{64}$/);

export const logChainBreak = z.object({
  /** The link's place in the chain; null for an event without a link. */
  seq: z.number().int().positive().nullable(),
  entryId: z.string().regex(logEntryIdPattern),
  problem: z.enum(logChainProblems),
});
export type LogChainBreak = z.infer<typeof logChainBreak>;

/** GET /api/builds/:id/log/chain */
export const logChainReport = z.object({
  /** Links stored for the build. */
  length: z.number().int().nonnegative(),
  /** The last link: what an export's closing row quotes. */
  head: z.object({ seq: z.number().int().positive(), hash }).nullable(),
  ok: z.boolean(),
  /** At most LOG_CHECK_LIST_MAX, in chain order, unlinked events last. */
  breaks: z.array(logChainBreak),
});
export type LogChainReport = z.infer<typeof logChainReport>;

/** POST /api/builds/:id/log/check: an exported CSV against the stored chain. */
export const logFileCheck = z.object({
  /** Rows of the file with an entry id (the closing chain-head row and blank rows are not counted). */
  rowsRead: z.number().int().nonnegative(),
  /** Rows whose hash is the one stored for their entry. */
  matching: z.number().int().nonnegative(),
  differing: z.array(z.object({ entryId: z.string(), fileHash: z.string(), storedHash: hash })),
  differingCount: z.number().int().nonnegative(),
  /** Entry ids of the file that this build's chain does not have. */
  notInDatabase: z.array(z.string()),
  notInDatabaseCount: z.number().int().nonnegative(),
  /** The stored chain's own check, as GET …/log/chain reports it. */
  breaks: z.array(logChainBreak),
});
export type LogFileCheck = z.infer<typeof logFileCheck>;

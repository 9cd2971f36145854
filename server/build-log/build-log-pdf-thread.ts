import os from 'node:os';
import { Writable } from 'node:stream';
import { parentPort, Worker, workerData } from 'node:worker_threads';
import path from 'node:path';
import type { BuildLogEntry } from '../../db/contracts';
import { startLogPdf, type PdfHead, type PdfOptions, type Thumbs } from './build-log-pdf';

/**
 * The PDF is laid out in a worker thread of its own: pdfkit's layout, its deflate of every page and the
 * garbage both make took most of an export's time, and on the request thread even in slices of a few
 * milliseconds they held every other request (the health check among them) behind them. The request
 * thread now only reads batches from PostgreSQL, hands them over and writes the bytes that come back.
 *
 * One thread per export, ended with it. Its heap is capped (HEAP_MB): a document that needed more would
 * end its own thread and cut its own download, never the server.
 */

const HEAP_MB = 128;
/**
 * PDF threads at once in one process: each may hold HEAP_MB, so exports beyond these are answered 503
 * before any work starts (a burst of downloads must not take the server's memory with it).
 */
export const MAX_PDF_THREADS = 2;
let threadsReserved = 0;

/** A place for one more PDF thread, or null when MAX_PDF_THREADS are taken; the release may be called more than once. */
export function reservePdfThread(): (() => void) | null {
  if (threadsReserved >= MAX_PDF_THREADS) return null;
  threadsReserved++;
  let released = false;
  return () => {
    if (!released) {
      released = true;
      threadsReserved--;
    }
  };
}
/** The thread's nice value (0 normal, 19 lowest): an export may wait; the requests beside it should not. */
const NICE = 10;
/** Marks the threads started here, so that importing this module in any other thread serves nothing. */
const MARK = 'pitchcard-build-log-pdf';

type ToThread =
  | { type: 'start'; head: PdfHead; opts: PdfOptions }
  | { type: 'add'; entries: readonly BuildLogEntry[]; thumbs: [string, Uint8Array][] }
  | { type: 'end' };
type FromThread = { type: 'bytes'; chunk: Uint8Array } | { type: 'added' } | { type: 'ended' };

/** The thread's side: one document, fed batch by batch; every batch is acknowledged once laid out. */
function serveThread(port: NonNullable<typeof parentPort>): void {
  // On Linux a nice value belongs to the thread (setpriority with pid 0, see setpriority(2)): this one
  // yields the CPU to the request thread when cores are short. Elsewhere it would be the whole process.
  if (process.platform === 'linux') {
    try {
      os.setPriority(NICE);
    } catch {
      /* not allowed here: the export still runs */
    }
  }
  let pdf: ReturnType<typeof startLogPdf> | null = null;
  const out = new Writable({
    write(chunk: Buffer, _enc, done) {
      port.postMessage({ type: 'bytes', chunk } satisfies FromThread);
      done();
    },
  });
  port.on('message', (m: ToThread) => {
    if (m.type === 'start') pdf = startLogPdf(out, m.head, m.opts);
    else if (m.type === 'add') {
      // Structured clone hands Buffers over as plain Uint8Arrays; pdfkit reads images from Buffers.
      const thumbs: Thumbs = new Map(
        m.thumbs.map(([id, b]) => [id, Buffer.from(b.buffer, b.byteOffset, b.byteLength)]),
      );
      pdf!.add(m.entries, thumbs);
      port.postMessage({ type: 'added' } satisfies FromThread);
    } else {
      // After the writes the end flushed (they are handed on in the ticks that follow it).
      pdf!.end().then(() => setImmediate(() => port.postMessage({ type: 'ended' } satisfies FromThread)));
    }
  });
}

/** Where the thread starts: the compiled file as it is; from the sources, this file compiled by tsx in that thread. */
function threadEntry(): { file: string; eval: boolean } {
  if (__filename.endsWith('.js')) return { file: __filename, eval: false };
  // A worker thread starts with plain Node: the parent's TypeScript loader (tsx, ts-jest) is not there.
  return {
    file: `require('tsx/cjs/api').require(${JSON.stringify(`./${path.basename(__filename)}`)}, ${JSON.stringify(__filename)});`,
    eval: true,
  };
}

export type PdfThread = {
  /** Lays out one batch; resolves when the thread has done it (its bytes have reached `onBytes` by then). */
  add(entries: readonly BuildLogEntry[], thumbs: Thumbs): Promise<void>;
  /** Closes the document; resolves after its last byte. */
  end(): Promise<void>;
  /** Ends the thread now (the reader left, or the export failed). */
  stop(): Promise<void>;
};

/** Starts a document in a new thread; its bytes go to `onBytes` in order. */
export function startPdfThread(head: PdfHead, opts: PdfOptions, onBytes: (chunk: Buffer) => void): PdfThread {
  const entry = threadEntry();
  const worker = new Worker(entry.file, {
    eval: entry.eval,
    workerData: MARK,
    resourceLimits: { maxOldGenerationSizeMb: HEAP_MB },
    stdout: false,
    stderr: false,
  });
  let waiting: { type: FromThread['type']; resolve: () => void; reject: (err: Error) => void } | null = null;
  let failure: Error | null = null;
  const fail = (err: Error) => {
    failure ??= err;
    waiting?.reject(failure);
    waiting = null;
  };
  worker.on('message', (m: FromThread) => {
    if (m.type === 'bytes') onBytes(Buffer.from(m.chunk.buffer, m.chunk.byteOffset, m.chunk.byteLength));
    else if (waiting?.type === m.type) {
      const w = waiting;
      waiting = null;
      w.resolve();
    }
  });
  worker.on('error', (err) => fail(err));
  worker.on('exit', (code) =>
    fail(new Error(`the PDF thread ended (exit code ${code}) before the document was finished`)),
  );
  const ask = (msg: ToThread, answer: FromThread['type']) =>
    new Promise<void>((resolve, reject) => {
      if (failure) {
        reject(failure);
        return;
      }
      waiting = { type: answer, resolve, reject };
      worker.postMessage(msg);
    });
  worker.postMessage({ type: 'start', head, opts } satisfies ToThread);
  return {
    add: (entries, thumbs) => ask({ type: 'add', entries, thumbs: [...thumbs] }, 'added'),
    end: async () => {
      await ask({ type: 'end' }, 'ended');
      await worker.terminate();
    },
    stop: async () => {
      await worker.terminate();
    },
  };
}

if (parentPort && workerData === MARK) serveThread(parentPort);

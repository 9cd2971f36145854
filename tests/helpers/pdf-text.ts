import { inflateSync } from 'node:zlib';
import { execFile } from 'node:child_process';
import { join } from 'node:path';
import supertest from 'supertest';
import type request from 'supertest';

/**
 * The text a PDF shows, one string per text-showing operator (TJ/Tj), in the order its content streams
 * draw it. Reads the subset of PDF 1.x (ISO 32000-1, from memory) that pdfkit writes: indirect objects
 * with FlateDecode streams, fonts with a ToUnicode CMap (bfrange arrays, 2-byte codes) for embedded
 * TrueType faces, one-byte codes for the standard 14 fonts. Enough to check what an export prints
 * without a system tool that may be missing.
 */
export function pdfTextRuns(pdf: Buffer): string[] {
  const raw = pdf.toString('latin1');
  const objects = new Map<number, { dict: string; stream: Buffer | null }>();
  const heads = [...raw.matchAll(/(?:^|[\r\n])(\d+) 0 obj\b/g)];
  heads.forEach((m, i) => {
    const start = m.index! + m[0].length;
    const end = i + 1 < heads.length ? heads[i + 1].index! : raw.length;
    const body = raw.slice(start, end);
    const s = /\bstream\r?\n/.exec(body);
    if (!s) {
      objects.set(Number(m[1]), { dict: body, stream: null });
      return;
    }
    const dict = body.slice(0, s.index);
    const from = start + s.index + s[0].length;
    const len = /\/Length (\d+)(?! \d+ R)/.exec(dict);
    const to = len ? from + Number(len[1]) : start + body.indexOf('endstream');
    let data = pdf.subarray(from, to);
    if (/\/FlateDecode/.test(dict)) data = inflateSync(data);
    objects.set(Number(m[1]), { dict, stream: data });
  });

  // Font resource names (pdfkit's are unique in a document) → their ToUnicode maps, when they have one.
  const cmaps = new Map<number, Map<number, string>>();
  const cmapOf = (objNum: number) => {
    let map = cmaps.get(objNum);
    if (!map) {
      map = new Map();
      const text = objects.get(objNum)?.stream?.toString('latin1') ?? '';
      for (const block of text.matchAll(/beginbfrange([\s\S]*?)endbfrange/g)) {
        for (const r of block[1].matchAll(/<([0-9a-fA-F]+)>\s*<([0-9a-fA-F]+)>\s*\[([^\]]*)\]/g)) {
          const first = parseInt(r[1], 16);
          [...r[3].matchAll(/<([0-9a-fA-F\s]*)>/g)].forEach((d, k) => {
            const units = d[1]
              .trim()
              .split(/\s+/)
              .filter(Boolean)
              .map((h) => parseInt(h, 16));
            map!.set(first + k, String.fromCharCode(...units));
          });
        }
      }
      cmaps.set(objNum, map);
    }
    return map;
  };
  const fonts = new Map<string, Map<number, string> | null>();
  for (const { dict } of objects.values()) {
    for (const m of dict.matchAll(/\/(F\d+) (\d+) 0 R/g)) {
      const font = objects.get(Number(m[2]))?.dict ?? '';
      const tu = /\/ToUnicode (\d+) 0 R/.exec(font);
      fonts.set(m[1], tu ? cmapOf(Number(tu[1])) : null);
    }
  }

  const runs: string[] = [];
  for (const { dict, stream } of objects.values()) {
    if (!stream || /\/Type|\/Subtype|\/Length1/.test(dict)) continue; // fonts, images, CMaps: not page content
    const content = stream.toString('latin1');
    let font: Map<number, string> | null = null;
    for (const op of content.matchAll(
      /\/(F\d+)\s+[\d.]+\s+Tf|\[((?:<[0-9a-fA-F]*>|[-\d.\s])*)\]\s*TJ|<([0-9a-fA-F]*)>\s*Tj/g,
    )) {
      if (op[1]) {
        font = fonts.get(op[1]) ?? null;
        continue;
      }
      const hexes = op[2] !== undefined ? [...op[2].matchAll(/<([0-9a-fA-F]*)>/g)].map((h) => h[1]) : [op[3]];
      const width = font ? 4 : 2;
      let text = '';
      for (const hex of hexes) {
        for (let i = 0; i + width <= hex.length; i += width) {
          const code = parseInt(hex.slice(i, i + width), 16);
          text += font ? (font.get(code) ?? '') : String.fromCharCode(code);
        }
      }
      runs.push(text);
    }
  }
  return runs;
}

/** The runs joined by spaces, white space folded: for "contains" and "comes before" checks. */
export const pdfText = (pdf: Buffer) => pdfTextRuns(pdf).join(' ').replace(/\s+/g, ' ');

/** A supertest parser that keeps the body as bytes (a PDF): `.buffer(true).parse(binaryBody)`. */
export const binaryBody = (r: request.Response, cb: (err: Error | null, body: Buffer) => void) => {
  const c: Buffer[] = [];
  r.on('data', (d: Buffer) => c.push(d));
  r.on('end', () => cb(null, Buffer.concat(c)));
};

/**
 * The text of a PDF as a PDF text library reads it (pdf-parse, on Mozilla's pdf.js), whitespace folded:
 * a check that does not rest on our own reader above. Runs in a child process (see the script).
 */
export function pdfLibraryText(pdf: Buffer): Promise<string> {
  return new Promise((resolve, reject) => {
    const child = execFile(
      process.execPath,
      [join(__dirname, 'pdf-library-text.mjs')],
      { maxBuffer: 64 * 1024 * 1024, timeout: 30_000 },
      (err, stdout) => (err ? reject(err) : resolve(stdout.replace(/\s+/g, ' '))),
    );
    child.stdin!.end(pdf);
  });
}

/** The whole build log as PDF (times in UTC), asked as `token`, its text read by the PDF text library. */
export async function logPdfText(app: Parameters<typeof supertest>[0], buildId: string, token: string) {
  const res = await supertest(app)
    .get(`/api/builds/${buildId}/log.pdf`)
    .query({ tz: 'UTC' })
    .set({ Authorization: `Bearer ${token}` })
    .buffer(true)
    .parse(binaryBody);
  if (res.status !== 200) throw new Error(`the PDF log answered ${res.status}: ${JSON.stringify(res.body)}`);
  return pdfLibraryText(res.body as Buffer);
}

// Prints the text of the PDF read from stdin, extracted by pdf-parse (Mozilla's pdf.js underneath).
// A child process of its own: pdf.js loads its worker by a dynamic import, which jest's module sandbox refuses.
import { Buffer } from 'node:buffer';
import process from 'node:process';
import { PDFParse } from 'pdf-parse';

const chunks = [];
for await (const c of process.stdin) chunks.push(c);
const parser = new PDFParse({ data: new Uint8Array(Buffer.concat(chunks)) });
const { text } = await parser.getText();
await parser.destroy();
process.stdout.write(text);

// PDFs in API tests: fetched as raw bytes and read back with poppler's pdftotext, a tool
// independent of the library that wrote them (pdfkit).
import fs from 'node:fs';
import { execFileSync } from 'node:child_process';
import type TestAgent from 'supertest/lib/agent';

/** GETs a PDF with its body kept as bytes (supertest does not buffer application/pdf by itself). */
export function getPdf(agent: TestAgent, url: string) {
  return agent
    .get(url)
    .buffer(true)
    .parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
}

/** Writes the PDF's bytes to `file` and returns its text as pdftotext -layout reads it. */
export function pdfToText(bytes: Buffer, file: string): string {
  fs.writeFileSync(file, bytes);
  return execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' });
}

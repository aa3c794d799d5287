/**
 * Printable answers in API tests: fetch a PDF whole, render its pages with pdftoppm (poppler,
 * from Debian) at 60 dpi, keep the first page as a screenshot artifact, read its text with
 * pdftotext.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type supertest from 'supertest';
import { expect } from 'vitest';

type Agent = ReturnType<typeof supertest.agent>;

/** GET `url` as bytes and check it is a PDF answered with 200. */
export async function getPdf(agent: Agent, url: string): Promise<Buffer> {
  const res = await agent.get(url).buffer(true).parse((r, cb) => {
    const chunks: Buffer[] = [];
    r.on('data', (c: Buffer) => chunks.push(c));
    r.on('end', () => cb(null, Buffer.concat(chunks)));
  });
  expect(res.status).toBe(200);
  expect(res.headers['content-type']).toMatch(/^application\/pdf/);
  const pdf = res.body as Buffer;
  expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
  return pdf;
}

export interface RenderedPdf {
  /** The PNG of each page, in order. */
  pages: string[];
  /** The PDF's text; `layout` keeps the columns in place. */
  text(layout?: boolean): string;
  /** Remove the temporary folder. */
  remove(): void;
}

/** Render `pdf` page by page in a temporary folder; the first page is kept as tests/.artifacts/screenshots/`name`.png. */
export function renderPdf(pdf: Buffer, name: string): RenderedPdf {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), `${name}-`));
  const file = path.join(dir, `${name}.pdf`);
  fs.writeFileSync(file, pdf);
  execFileSync('pdftoppm', ['-png', '-r', '60', file, path.join(dir, 'page')]);
  const pages = fs.readdirSync(dir).filter((f) => f.endsWith('.png')).sort().map((f) => path.join(dir, f));
  const out = path.resolve(import.meta.dirname, '../.artifacts/screenshots');
  fs.mkdirSync(out, { recursive: true });
  if (pages[0]) fs.copyFileSync(pages[0], path.join(out, `${name}.png`));
  return {
    pages,
    text: (layout = false) => execFileSync('pdftotext', [...(layout ? ['-layout'] : []), file, '-'], { encoding: 'utf8' }),
    remove: () => fs.rmSync(dir, { recursive: true, force: true }),
  };
}

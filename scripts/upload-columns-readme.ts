/**
 * Rewrites the column table of README.md's "CSV upload columns" section from shared/upload-columns.ts
 * (only the text between its two markers). A test fails when the README is out of date.
 *
 *   npx tsx scripts/upload-columns-readme.ts
 */
import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { uploadColumnsMarkdown } from '../shared/upload-columns';

export const START = '<!-- upload-columns:start (generated from shared/upload-columns.ts) -->';
export const END = '<!-- upload-columns:end -->';

export function withColumnTable(readme: string): string {
  const a = readme.indexOf(START);
  const b = readme.indexOf(END);
  if (a === -1 || b < a) throw new Error('README.md has no upload-columns markers');
  return `${readme.slice(0, a + START.length)}\n${uploadColumnsMarkdown()}\n${readme.slice(b)}`;
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const file = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', 'README.md');
  writeFileSync(file, withColumnTable(readFileSync(file, 'utf8')));
  console.log('README.md: upload column table rewritten');
}

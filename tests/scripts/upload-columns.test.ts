import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { UPLOAD_COLUMNS } from '../../shared/upload-columns';
import { EpisodeCreateSchema, AssessmentInputSchema } from '../../shared/schemas/episode';
import { withColumnTable } from '../../scripts/upload-columns-readme';

const readme = readFileSync(path.resolve(import.meta.dirname, '../../README.md'), 'utf8');

describe('shared/upload-columns.ts', () => {
  it('names each column once, and every episode or assessment column fills a field of the shared schemas', () => {
    const names = UPLOAD_COLUMNS.map((c) => c.name);
    expect(new Set(names).size).toBe(names.length);
    const episodeFields = new Set([...Object.keys(EpisodeCreateSchema.shape), 'status', 'dischargeDate', 'dischargeReason']);
    const assessmentFields = new Set(Object.keys(AssessmentInputSchema.shape));
    for (const c of UPLOAD_COLUMNS) {
      if (c.level === 'episode') expect(episodeFields.has(c.field), c.name).toBe(true);
      if (c.level === 'assessment') expect(assessmentFields.has(c.field), c.name).toBe(true);
      if (c.level === 'score') expect(c.name).toBe(`score_${c.field.replace(/-/g, '_')}`);
    }
  });

  it('README.md carries the generated column table (run npx tsx scripts/upload-columns-readme.ts after a change)', () => {
    expect(readme).toContain('## CSV upload columns');
    expect(withColumnTable(readme)).toBe(readme);
    for (const c of UPLOAD_COLUMNS) expect(readme).toContain(`| \`${c.name}\` |`);
  });
});

// The templates (invented demo sites) carry their banks: the compensation design's proposal for
// each, so the page opens a template without running the design. When the design changes, this
// test shows the banks to put in the file (or writes them with KVAR_UPDATE_TEMPLATES=1).
import { readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { proposeChoices } from '../../../src/core/site/compensation.ts';
import { readSiteFile, writeSiteFile } from '../../../src/core/site/siteFile.ts';

const dir = join(import.meta.dirname, '../../../templates');

describe('templates', () => {
  for (const f of readdirSync(dir).filter((n) => n.endsWith('.json'))) {
    it(`${f} carries the design's proposal as its banks`, () => {
      const text = readFileSync(join(dir, f), 'utf8');
      const { site, banks, problems } = readSiteFile(text);
      expect(problems.filter((p) => p.severity === 'error')).toEqual([]);
      const proposed = proposeChoices(site);
      if (process.env.KVAR_UPDATE_TEMPLATES === '1')
        writeFileSync(join(dir, f), writeSiteFile(site, proposed));
      expect(
        banks,
        `${f}: run KVAR_UPDATE_TEMPLATES=1 npx vitest run tests/core/site/templates.test.ts`,
      ).toEqual(proposed);
    });
  }
});

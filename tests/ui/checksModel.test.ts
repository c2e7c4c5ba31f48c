// The Checks panel's model: input problems located by sheet and grid row, design findings by
// bus and case. Sites here are built from the invented templates and then broken on purpose.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { readSiteFile } from '../../src/core/site/siteFile.ts';
import { buildWorkbook } from '../../src/core/workbook/build.ts';
import type { WorkbookDoc } from '../../src/core/workbook/document.ts';
import { collectChecks } from '../../src/ui/panels/checksModel.ts';

function template(name: string): WorkbookDoc {
  const { site } = readSiteFile(
    readFileSync(new URL(`../../templates/${name}.json`, import.meta.url), 'utf8'),
  );
  return buildWorkbook(site, { flavour: 'live' });
}

describe('checks of a workbook', () => {
  it('the solar collector at night: cable charging beyond the leading limit is reported on its bus and case', () => {
    const r = collectChecks(template('solar-collector'));
    const charging = r.items.find((i) => i.code === 'charging-dominates');
    expect(charging?.severity).toBe('warning');
    expect(charging?.where).toMatch(/^bus /);
    expect(charging?.text).toMatch(/^case night: /);
    expect(r.counts.warning).toBeGreaterThanOrEqual(1);
  });

  it('a cos φ of 1.3 typed on the Motors sheet is an input error at that sheet row and column, and the design waits', () => {
    const doc = template('pumping-station');
    const motors = doc.sheets.find((s) => s.name === 'Motors');
    expect(motors).toBeDefined();
    const header = (motors?.cells[0] ?? []) as unknown[];
    const col = header.indexOf('cos φ');
    expect(col).toBeGreaterThan(0);
    (motors?.cells[2] as unknown[])[col] = 1.3;
    const r = collectChecks(doc);
    const bad = r.items.find((i) => i.severity === 'error');
    expect(bad?.target).toEqual({ sheet: 'Motors', row: 3, col });
    // The grid's header names the column, in the place and in the message, not the site file's key.
    expect(bad?.where).toBe('Motors row 3, column cos φ');
    expect(bad?.text).toContain('got 1.3');
    expect(bad?.text).not.toContain('cos_phi');
    expect(r.designSkipped).toMatch(/input errors/);
    expect(r.items.some((i) => i.code !== 'input')).toBe(false);
  });

  it("a line's blank resistance is a warning at its Lines row and column: its kW losses are not counted", () => {
    const doc = template('solar-collector');
    const lines = doc.sheets.find((s) => s.name === 'Lines');
    const header = (lines?.cells[0] ?? []) as unknown[];
    const col = header.indexOf('R (Ω/km)');
    expect(col).toBeGreaterThan(0);
    expect(collectChecks(doc).items.filter((i) => i.target?.sheet === 'Lines')).toEqual([]);
    (lines?.cells[1] as unknown[])[col] = null;
    const r = collectChecks(doc);
    const found = r.items.filter((i) => i.target?.sheet === 'Lines');
    expect(found.map((i) => [i.severity, i.code, i.where])).toEqual([
      ['warning', 'input', 'Lines row 2, column R (Ω/km)'],
    ]);
    expect(found[0]?.text).toMatch(
      /kW losses of line F-A \(3·I²·R\) are not counted before or after compensation/,
    );
    expect(found[0]?.target).toEqual({ sheet: 'Lines', row: 2, col });
    // a warning only: the design's findings are still listed
    expect(r.items.some((i) => i.code === 'charging-dominates')).toBe(true);
  });

  it('a blank bus on any equipment sheet is listed, errors first, and the design findings wait for it', () => {
    const doc = template('solar-collector');
    // Blank the bus of the first item on any equipment sheet that has one (an input error),
    // while the night-time charging warning stays.
    const sheet = doc.sheets.find(
      (s) => s.name !== 'Site' && s.cells.length > 1 && (s.cells[0] ?? []).includes('Bus'),
    );
    const header = (sheet?.cells[0] ?? []) as unknown[];
    (sheet?.cells[1] as unknown[])[header.indexOf('Bus')] = '';
    const r = collectChecks(doc);
    const ranks = r.items.map((i) => ({ error: 0, warning: 1, info: 2 })[i.severity]);
    expect(ranks).toEqual([...ranks].sort((a, b) => a - b));
    expect(r.counts.error).toBeGreaterThan(0);
    expect(r.items[0]?.severity).toBe('error');
    expect(r.items.some((i) => i.code === 'charging-dominates')).toBe(false);
  });

  it('a Site-sheet problem is named by the Site sheet row and points at the value cell', () => {
    const doc = template('cold-store');
    const site = doc.sheets.find((s) => s.name === 'Site');
    const row = (site?.cells ?? []).findIndex((r) => r[0] === 'Frequency');
    expect(row).toBeGreaterThan(0);
    (site?.cells[row] as unknown[])[1] = 55;
    const r = collectChecks(doc);
    const bad = r.items.find((i) => i.severity === 'error');
    expect(bad?.where).toBe(`Site row ${row + 1}, column Frequency`);
    expect(bad?.target).toEqual({ sheet: 'Site', row: row + 1, col: 1 });
    expect(bad?.text).toMatch(/^must be 50 or 60 \(Hz\); got 55/);
    // Nothing is said of an equipment sheet's row by mistake.
    expect(r.items.some((i) => /^(Motors|Loads) row/.test(i.where))).toBe(false);
  });

  it('a bus typo is reported at the row that has it, and the rows named in the text are sheet rows', () => {
    const doc = template('cold-store');
    const loads = doc.sheets.find((s) => s.name === 'Loads');
    const header = (loads?.cells[0] ?? []) as unknown[];
    const busCol = header.indexOf('Bus');
    const lastRow = (loads?.cells.length ?? 0) - 1;
    const typo = `${String((loads?.cells[lastRow] as unknown[])[busCol])}X`;
    (loads?.cells[lastRow] as unknown[])[busCol] = typo;
    const r = collectChecks(doc);
    const bad = r.items.find((i) => i.severity === 'error' && i.text.includes(typo));
    expect(bad?.target).toEqual({ sheet: 'Loads', row: lastRow + 1, col: busCol });
    expect(bad?.where).toBe(`Loads row ${lastRow + 1}, column Bus`);
    expect(bad?.text).toContain(`${typo} (Loads row ${lastRow + 1})`);
    expect(bad?.text).not.toMatch(/\(row \d+\)/);
  });

  it('a design finding on a bus points at that bus on the Buses sheet', () => {
    const doc = template('solar-collector');
    const r = collectChecks(doc);
    const charging = r.items.find((i) => i.code === 'charging-dominates');
    const bus = /^bus (\S+)/.exec(charging?.where ?? '')?.[1];
    const buses = doc.sheets.find((s) => s.name === 'Buses');
    const row = (buses?.cells ?? []).findIndex((c, i) => i > 0 && c[0] === bus);
    expect(row).toBeGreaterThan(0);
    expect(charging?.target).toEqual({ sheet: 'Buses', row: row + 1, col: 0 });
  });
});

// The Checks panel says per bus which choice the Compensation sheet holds: a bank (it stands as
// typed) or a detuning typed alone, with the bank the design proposes for that bus at that
// detuning (sheetChoices.ts, the rule `kvar-ledger balance` follows with a design option).
import { describe, expect, it } from 'vitest';
import { designWithSheet } from '../../../src/core/site/sheetChoices.ts';
import { buildWorkbook } from '../../../src/core/workbook/build.ts';
import { collectChecks } from '../../../src/ui/panels/checksModel.ts';
import { WorkbookSession } from '../../../src/ui/model/session.ts';
import { planCompensationColumns } from '../../../src/core/workbook/compensationColumns.ts';
import { siteFromWorkbook } from '../../../src/core/workbook/readSite.ts';
import { PLANT } from '../../core/workbook/sites.ts';

describe('Checks: the choice per bus', () => {
  it('a bank on the sheet is listed as standing; a detuning typed alone shows the design’s bank for it', () => {
    const s = WorkbookSession.fromDoc(buildWorkbook(PLANT, { flavour: 'live' }));
    const comp = s.engine.getSheetId('Compensation') as number;
    const plan = planCompensationColumns(PLANT.settings.cases);
    const rows = s.sheetContents(comp);
    const withBank = rows.findIndex((r, i) => i > 0 && typeof r[plan.input.steps] === 'number');
    expect(withBank).toBeGreaterThan(0);
    const bus = String(rows[withBank]?.[0]);
    let report = collectChecks(s.toDoc());
    const standing = report.items.filter((i) => i.code === 'bank-choice' && i.where === `bus ${bus}`);
    expect(standing).toHaveLength(1);
    expect(standing[0]?.text).toContain('it stands as it is, and the design proposes nothing more');
    // A workbook whose row holds only a 14 % detuning (as a file may come): the design proposes
    // the bank at 14 %. (On the page, typing it fills the row instead: detuningProposal.test.ts.)
    const saved = s.toDoc();
    const doc = {
      ...saved,
      sheets: saved.sheets.map((sh) => {
        if (sh.name !== 'Compensation') return sh;
        const cells = sh.cells.map((line) => [...line]);
        const line = cells[withBank] ?? [];
        for (const k of ['fixed_kvar', 'step_kvar', 'steps', 'series', 'u_rated_kv', 'reactor_kvar'] as const)
          line[plan.input[k]] = null;
        line[plan.input.p_pct] = 14;
        return { ...sh, cells };
      }),
    };
    const read = siteFromWorkbook(doc);
    const want = designWithSheet(read.site, read.banks).choices.find((c) => c.bus === bus);
    expect(want?.p_pct).toBe(14);
    report = collectChecks(doc);
    const alone = report.items.filter((i) => i.code === 'bank-choice' && i.where === `bus ${bus}`);
    expect(alone).toHaveLength(1);
    expect(alone[0]?.severity).toBe('info');
    expect(alone[0]?.text).toContain('detuning 14 % typed alone on the Compensation sheet (no sizes)');
    expect(alone[0]?.text).toContain(`${want?.steps} stages of ${want?.step_kvar} kvar`);
    expect(alone[0]?.text).toContain('detuned 14 %: type its sizes to keep it');
  });
});

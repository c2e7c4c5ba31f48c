// The Site sheet back into SiteSettings: rows are found by their label in column A, so a row the
// user inserts or moves does not confuse the reader.
import { DEFAULT_CASE, defaultSettings, UNTITLED_SITE } from '../site/defaults.ts';
import type { Requirement, SiteSettings } from '../site/model.ts';
import { error } from '../site/problems.ts';
import type { SheetDoc } from './document.ts';
import { REQUIREMENT_TEXT, SETTING_LABELS } from './settingsLayout.ts';
import { readNumber, readText, report, type ReadContext, type Spot } from './readCells.ts';

function label(doc: SheetDoc, row: number): string {
  const v = doc.cells[row]?.[0];
  return typeof v === 'string' ? v.trim().toLowerCase() : '';
}

function requirementKind(text: string | undefined): 'cosphi' | 'cosphiLag' | 'tanphi' | undefined {
  const t = (text ?? '').toLowerCase().replace(/[\s_]/g, '');
  if (['cosφlagging', 'cosphilagging', REQUIREMENT_TEXT.cosphiLag.replace(/\s/g, '')].includes(t))
    return 'cosphiLag';
  if (['cosφ', 'cosphi', 'cos', 'powerfactor', REQUIREMENT_TEXT.cosphi.replace(/\s/g, '')].includes(t))
    return 'cosphi';
  if (['tanφ', 'tanphi', 'tan', REQUIREMENT_TEXT.tanphi.replace(/\s/g, '')].includes(t)) return 'tanphi';
  return undefined;
}

export function readSettings(doc: SheetDoc | undefined, ctx: ReadContext): SiteSettings {
  if (!doc) {
    ctx.problems.push(
      error({}, 'the workbook has no Site sheet; frequency 50 Hz, cos φ 0.95 and one case "normal" assumed'),
    );
    return defaultSettings(UNTITLED_SITE);
  }
  const rowOf = (key: keyof typeof SETTING_LABELS) =>
    doc.cells.findIndex((_, r) => r > 0 && label(doc, r) === SETTING_LABELS[key].toLowerCase());
  const spot = (row: number, header: string): Spot => ({ sheet: doc.name, row, col: 1, header });
  const num = (key: keyof typeof SETTING_LABELS) => {
    const r = rowOf(key);
    return r < 0 ? undefined : readNumber(doc, spot(r, SETTING_LABELS[key]), ctx);
  };
  const text = (key: keyof typeof SETTING_LABELS) => {
    const r = rowOf(key);
    return r < 0 ? undefined : readText(doc, spot(r, SETTING_LABELS[key]), ctx);
  };

  const name = text('name') ?? 'Untitled site';
  let hz: 50 | 60 = 50;
  const hzGiven = num('hz');
  if (hzGiven === 60 || hzGiven === 50) hz = hzGiven;
  else
    report(
      ctx,
      'error',
      spot(Math.max(rowOf('hz'), 0), SETTING_LABELS.hz),
      `must be 50 or 60 (Hz); got ${hzGiven ?? 'a blank cell'}; 50 Hz assumed`,
    );

  const reqText = text('requirement');
  const kind = requirementKind(reqText);
  let requirement: Requirement;
  if (kind === 'tanphi') {
    const lag = num('tanLag');
    const lead = num('tanLead');
    if (lag === undefined || lag < 0)
      report(
        ctx,
        'error',
        spot(Math.max(rowOf('tanLag'), 0), SETTING_LABELS.tanLag),
        `must be a number ≥ 0 for a tan φ requirement; got ${lag ?? 'a blank cell'}`,
      );
    if (lead === undefined || lead < 0)
      report(
        ctx,
        'error',
        spot(Math.max(rowOf('tanLead'), 0), SETTING_LABELS.tanLead),
        `must be a number ≥ 0 for a tan φ requirement; got ${lead ?? 'a blank cell'}`,
      );
    requirement = { kind: 'tanphi', lagMax: lag ?? 0, leadMax: lead ?? 0 };
  } else {
    if (kind === undefined) {
      report(
        ctx,
        'error',
        spot(Math.max(rowOf('requirement'), 0), SETTING_LABELS.requirement),
        `must be "${REQUIREMENT_TEXT.cosphi}", "${REQUIREMENT_TEXT.cosphiLag}" or "${REQUIREMENT_TEXT.tanphi}"; got ${reqText === undefined ? 'a blank cell' : `"${reqText}"`}; cos φ assumed`,
      );
    }
    const target = num('cosTarget');
    if (target === undefined || !(target > 0 && target <= 1)) {
      report(
        ctx,
        'error',
        spot(Math.max(rowOf('cosTarget'), 0), SETTING_LABELS.cosTarget),
        `must be in (0, 1]; got ${target ?? 'a blank cell'}; 0.95 assumed`,
      );
    }
    requirement = {
      kind: 'cosphi',
      target: target !== undefined && target > 0 && target <= 1 ? target : 0.95,
      ...(kind === 'cosphiLag' ? { lagOnly: true } : {}),
    };
  }

  const refKw = num('refKw');
  if (refKw !== undefined && !(refKw > 0))
    report(
      ctx,
      'error',
      spot(rowOf('refKw'), SETTING_LABELS.refKw),
      `must be > 0 (kW) or blank (the limits then apply to the case's own active power); got ${refKw}`,
    );
  else if (refKw !== undefined) requirement = { ...requirement, refKw };

  const ssc = num('ssc');
  if (ssc !== undefined && !(ssc > 0))
    report(ctx, 'error', spot(rowOf('ssc'), SETTING_LABELS.ssc), `must be > 0 (MVA) or blank; got ${ssc}`);

  const cases: string[] = [];
  const notes: string[] = [];
  doc.cells.forEach((_, r) => {
    if (r === 0) return;
    const l = label(doc, r);
    if (l === SETTING_LABELS.case.toLowerCase()) {
      const c = readText(doc, spot(r, SETTING_LABELS.case), ctx);
      if (c === undefined) return;
      if (cases.some((x) => x.toLowerCase() === c.toLowerCase()))
        report(
          ctx,
          'error',
          spot(r, SETTING_LABELS.case),
          `case "${c}" is listed twice; case names must differ`,
        );
      else cases.push(c);
    } else if (l === SETTING_LABELS.assumption.toLowerCase()) {
      const n = readText(doc, spot(r, SETTING_LABELS.assumption), ctx);
      if (n !== undefined) notes.push(n);
    }
  });
  if (cases.length === 0) {
    ctx.problems.push(
      error(
        {},
        `sheet ${doc.name}: no operating case is listed (rows labelled "${SETTING_LABELS.case}"); one case "${DEFAULT_CASE}" assumed`,
      ),
    );
    cases.push(DEFAULT_CASE);
  }
  return {
    name,
    hz,
    cases,
    requirement,
    ...(ssc !== undefined && ssc > 0 ? { sscMva: ssc } : {}),
    ...(notes.length > 0 ? { notes } : {}),
  };
}

// Checks on the Design options sheet's inputs: a bank input of an option that cannot be read
// (text in a size, a negative size, a step series that does not fit its steps, a formula) is
// said with its row and column, as on the Compensation sheet. The option is not worked out until
// it is mended (the comparison lists it without figures); the balance and the chosen design do
// not depend on it, so the rest of Checks goes on.
import { optionDrafts } from '../../core/workbook/optionDrafts.ts';
import { OPTIONS_SHEET } from '../../core/workbook/optionsLayout.ts';
import type { WorkbookDoc } from '../../core/workbook/document.ts';
import { locateReaderProblem, type CheckItem } from './checksWhere.ts';

export function optionInputItems(doc: WorkbookDoc, cases: readonly string[]): CheckItem[] {
  const sheet = doc.sheets.find((s) => s.name === OPTIONS_SHEET);
  return optionDrafts(sheet, cases).flatMap((d) =>
    d.problems.map((p) => {
      const at = locateReaderProblem(p, doc);
      return {
        severity: p.severity,
        code: 'options',
        where: at.where,
        text: `${at.text}; the option "${d.name}" is not worked out until this is mended`,
        ...(at.target ? { target: at.target } : {}),
      };
    }),
  );
}

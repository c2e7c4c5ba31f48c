// A list without a kind column ("every row is a motor"): the kind is required until a column
// feeds it or one kind is chosen for every row; a name not registered is refused with the kinds
// there are; a kind column, when mapped, decides; blank rows stay skipped.
import { describe, expect, it } from 'vitest';
import { kindNames } from '../../../src/core/kinds/index.ts';
import {
  previewImport,
  proposeMapping,
  tableFromCsvText,
  withColumnTarget,
  withDefaultKind,
} from '../../../src/io/import/index.ts';

const MOTORS = 'Item,Switchboard,Motor kW,Eff %,PF\nP-1,MCC-1,11,91,0.85\n\n,,,,\nP-2,MCC-1,15,92,0.86\n';

function proposal(csv = MOTORS) {
  const t = tableFromCsvText('pumps.csv', csv);
  if (!t.ok) throw new Error(t.problem.message);
  return proposeMapping(t.value);
}

describe('one kind for every row of a list', () => {
  it('kind is missing until chosen; then every row reads as that kind', () => {
    const p = proposal();
    expect(p.missing).toEqual(['kind']);
    const r = withDefaultKind(p, 'Motor');
    if (!r.ok) throw new Error(r.message);
    expect(r.proposal.missing).toEqual([]);
    expect(r.proposal.defaultKind).toBe('motor');
    const pv = previewImport(r.proposal);
    expect(pv.canApply).toBe(true);
    expect(pv.equipment.map((e) => [e.tag, e.kind, e.row])).toEqual([
      ['P-1', 'motor', 2],
      ['P-2', 'motor', 5],
    ]);
    expect(pv.targets).toContain('kind');
    expect(pv.rows.map((x) => x.cells.kind)).toEqual(['motor', 'motor']);
  });

  it('a name that is no kind is refused with the kinds there are', () => {
    const r = withDefaultKind(proposal(), 'pump');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.message).toBe(`"pump" is not a kind of equipment; the kinds are ${kindNames().join(', ')}`);
  });

  it('taking the choice back makes kind required again', () => {
    const chosen = withDefaultKind(proposal(), 'load');
    if (!chosen.ok) throw new Error(chosen.message);
    const back = withDefaultKind(chosen.proposal, null);
    if (!back.ok) throw new Error(back.message);
    expect(back.proposal.missing).toEqual(['kind']);
    expect(back.proposal.defaultKind).toBeUndefined();
  });

  it('a column mapped to kind decides over the choice', () => {
    const csv =
      'Item,Switchboard,Type,Rated kW,Eff %,PF\nP-1,MCC-1,motor,11,91,0.85\nL-1,MCC-1,load,20,,0.9\n';
    const p = proposal(csv);
    expect(p.missing).toEqual([]);
    const typeless = withColumnTarget(p, 2, null);
    expect(typeless.missing).toEqual(['kind']);
    const chosen = withDefaultKind(typeless, 'load');
    if (!chosen.ok) throw new Error(chosen.message);
    expect(previewImport(chosen.proposal).equipment.map((e) => e.kind)).toEqual(['load', 'load']);
    const again = withColumnTarget(chosen.proposal, 2, 'kind');
    expect(previewImport(again).equipment.map((e) => e.kind)).toEqual(['motor', 'load']);
  });
});

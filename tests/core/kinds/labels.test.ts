// Column labels in words for the import: a kind's sheet header where the kind is known, the
// interchange header otherwise, and the per-case load columns as the sheets head them.
import { describe, expect, it } from 'vitest';
import { columnLabel } from '../../../src/core/kinds/index.ts';
import { equipmentPlans } from '../../../src/core/workbook/structure.ts';

describe('columnLabel', () => {
  it('names a motor’s p_kw as the Motors sheet heads it, and a bare p_kw by its own header', () => {
    expect(columnLabel('p_kw', 'motor').label).toBe('Rated output (kW)');
    expect(columnLabel('p_kw').label).toBe('P (kW)');
    expect(columnLabel('p_kw').words).toMatch(/^Rated active power \(kW\); a motor: rated output/);
    expect(columnLabel('i0_pct').label).toBe('No-load current (%)');
    expect(columnLabel('u_kv', 'transformer').label).toBe('U secondary (kV)');
  });

  it('gives every input the header its sheet shows', () => {
    for (const plan of equipmentPlans(['normal', 'night'])) {
      const kind = plan.kinds.length === 1 ? plan.kinds[0]?.name : undefined;
      if (!kind) continue;
      for (const [key, col] of plan.input)
        expect(columnLabel(key, kind).label).toBe(plan.columns[col]?.header);
      const night = plan.loadCase?.[1];
      if (night !== undefined) expect(columnLabel('load:night').label).toBe(plan.columns[night]?.header);
    }
  });
});

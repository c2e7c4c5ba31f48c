// A requirement referred to rated power (issue: sites that generate). Grid codes for generating
// plants commonly state the reactive range a plant must stay within as a share of its rated
// (registered) active power, e.g. Q within ±0.33 × P rated at the point of connection, which holds
// whatever the plant produces; a consumer's tariff refers to the power actually drawn. (Common
// practice, from memory; the 0.3287 used below is tan(acos 0.95).) Hand-worked here:
// - referred to P: the leading limit is tan φ × |P|, so at night (P = 60 kW of auxiliaries) only
//   0.3287 × 60 = 19.7 kvar may be delivered;
// - referred to 42,000 kW rated: 0.3287 × 42,000 = 13,805 kvar may be delivered.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { designCompensation } from '../../../src/core/site/compensation.ts';
import { compensate, withinRequirement } from '../../../src/core/site/compensate.ts';
import type { Requirement, Site } from '../../../src/core/site/model.ts';
import { connectionNeed, kvarNeeded, requirementBand } from '../../../src/core/site/requirement.ts';
import { readSiteFile, writeSiteFile } from '../../../src/core/site/siteFile.ts';
import { validateSite } from '../../../src/core/site/validate.ts';

const TAN = 0.3287;
const band: Requirement = { kind: 'tanphi', lagMax: TAN, leadMax: TAN };
const rated: Requirement = { ...band, refKw: 42_000 };

describe('the need at the point of connection', () => {
  it('referred to the case’s own P: 900 kvar delivered at 60 kW needs 900 − 0.3287 × 60 kvar inductive', () => {
    const n = connectionNeed(60, -900, band);
    expect(n.inductive_kvar).toBeCloseTo(900 - TAN * 60, 9);
    expect(n.capacitive_kvar).toBe(0);
  });

  it('referred to 42,000 kW rated: the same 900 kvar are within ±13,805 kvar', () => {
    expect(connectionNeed(60, -900, rated)).toEqual({ capacitive_kvar: 0, inductive_kvar: 0 });
    // Beyond it, what is missing is counted from the rated power: 15,000 − 0.3287 × 42,000.
    expect(connectionNeed(60, -15_000, rated).inductive_kvar).toBeCloseTo(15_000 - TAN * 42_000, 9);
    expect(connectionNeed(-30_000, 14_000, rated).capacitive_kvar).toBeCloseTo(14_000 - TAN * 42_000, 9);
  });

  it('a bus other than the point of connection keeps its own P', () => {
    expect(kvarNeeded(60, -900, rated).inductive_kvar).toBeCloseTo(900 - TAN * 60, 9);
  });

  it('says what it is referred to', () => {
    expect(requirementBand(rated).text).toMatch(/referred to 42000 kW rated power$/);
    expect(requirementBand(band).text).not.toMatch(/rated/);
  });
});

describe('the solar template at night', () => {
  const SOLAR = join(import.meta.dirname, '../../../templates/solar-collector.json');
  const { site } = readSiteFile(readFileSync(SOLAR, 'utf8'));
  const withRated = (s: Site): Site => ({
    ...s,
    settings: { ...s.settings, requirement: { ...s.settings.requirement, refKw: 42_000 } },
  });

  it('needs a shunt reactor when the band follows P, none when it refers to the rated power', () => {
    expect(designCompensation(site).reactors.length).toBeGreaterThan(0);
    const d = designCompensation(withRated(site));
    expect(d.reactors).toEqual([]);
    expect(d.cases.every((c) => c.met_after)).toBe(true);
    expect(d.requirement).toMatch(/referred to 42000 kW/);
  });

  it('the after-compensation rule and the check agree with the hand figure at night', () => {
    const s = withRated(site);
    for (const c of compensate(s, [])) {
      const root = c.before.root;
      const inBand = Math.abs(root.q_kvar) <= TAN * 42_000 + 0.5;
      expect(withinRequirement(s, root.p_kw, root.q_kvar)).toBe(inBand);
      expect(c.need.inductive_kvar).toBe(0);
    }
  });

  it('is kept in the site file, and a rated power that is no number > 0 is refused', () => {
    const text = writeSiteFile(withRated(site));
    expect(readSiteFile(text).site.settings.requirement.refKw).toBe(42_000);
    const bad = text.replace('"refKw":42000', '"refKw":-5');
    expect(bad).not.toBe(text);
    expect(readSiteFile(bad).problems.map((p) => p.message)).toContainEqual(
      expect.stringMatching(/refKw .* must be a number > 0 \(kW\) or absent; got -5/),
    );
    const zero = withRated(site);
    const req = { ...zero.settings.requirement, refKw: 0 };
    expect(
      validateSite({ ...zero, settings: { ...zero.settings, requirement: req } }).map((p) => p.message),
    ).toContainEqual(expect.stringMatching(/referred to must be > 0 kW or blank; got 0/));
  });
});

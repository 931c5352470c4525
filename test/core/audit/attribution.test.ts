import { describe, expect, it } from 'vitest';
import { attribute, type AttributionInputs } from '../../../src/core/audit/attribution.js';

// The project's own rules (README "Verdicts and attribution"): a cause applies when its one change
// lowers the verdict class; these cases are built by hand from that definition.
const base: AttributionInputs = {
  headlineImf: 'salpeter',
  headlineVerdict: 'over budget',
  imfVerdicts: { salpeter: 'over budget', chabrier: 'over budget', 'top-heavy-flat': 'over budget' },
  redshiftChecks: [],
  verdictCosmicVariance: 'over budget',
  verdictEddington: 'over budget',
  eddingtonShiftDex: 0.1,
};

describe('attribution: a cause applies whenever it lowers the verdict class', () => {
  it('nothing lowers the class → holds under every IMF, and nothing else', () => {
    const a = attribute(base);
    expect(a.attribution).toEqual(['holds under every IMF']);
    expect(a.attribution_detail).toEqual([{ cause: 'holds under every IMF', verdict_after: 'over budget', via: 'salpeter, chabrier, top-heavy-flat' }]);
  });
  it('over budget → strained under a top-heavy IMF counts: IMF-driven, and no longer "holds under every IMF"', () => {
    const a = attribute({ ...base, imfVerdicts: { ...base.imfVerdicts, 'top-heavy-flat': 'strained' } });
    expect(a.attribution).toEqual(['IMF-driven']);
    expect(a.attribution_detail).toEqual([{ cause: 'IMF-driven', verdict_after: 'strained', via: 'top-heavy-flat' }]);
  });
  it('every IMF that lowers the class gets its own detail, with the verdict it gives', () => {
    const a = attribute({ ...base, imfVerdicts: { salpeter: 'over budget', chabrier: 'strained', 'top-heavy-flat': 'within budget' } });
    expect(a.attribution_detail.map((d) => [d.via, d.verdict_after])).toEqual([['chabrier', 'strained'], ['top-heavy-flat', 'within budget']]);
  });
  it('the same class under another IMF does not count (strained stays strained)', () => {
    const a = attribute({ ...base, headlineVerdict: 'strained', imfVerdicts: { salpeter: 'strained', chabrier: 'strained' }, verdictCosmicVariance: 'strained', verdictEddington: 'strained' });
    expect(a.attribution).toEqual(['holds under every IMF']);
  });
  it('redshift-driven names the solution that lowers the class', () => {
    const a = attribute({ ...base, redshiftChecks: [{ kind: 'z_alt', z: 2.1, verdict: 'within budget' }, { kind: 'z_lo', z: 9.4, verdict: 'over budget' }] });
    expect(a.attribution).toContain('redshift-driven');
    expect(a.attribution_detail.filter((d) => d.cause === 'redshift-driven')).toEqual([{ cause: 'redshift-driven', verdict_after: 'within budget', via: 'z_alt = 2.1' }]);
  });
  it('volume-driven when the ceiling widened by cosmic variance lowers the class', () => {
    expect(attribute({ ...base, verdictCosmicVariance: 'strained' }).attribution).toContain('volume-driven');
    expect(attribute(base).attribution).not.toContain('volume-driven');
  });
  it('Eddington-driven when the debiased ε lowers the class, with the shift in its detail', () => {
    const a = attribute({ ...base, verdictEddington: 'strained', eddingtonShiftDex: 0.234 });
    expect(a.attribution).toContain('Eddington-driven');
    expect(a.attribution_detail.find((d) => d.cause === 'Eddington-driven')).toEqual({ cause: 'Eddington-driven', verdict_after: 'strained', via: 'mass lowered by 0.23 dex' });
  });
  it('a galaxy within budget gets no attribution at all', () => {
    const a = attribute({ ...base, headlineVerdict: 'within budget', imfVerdicts: { salpeter: 'within budget' }, verdictCosmicVariance: 'within budget', verdictEddington: 'within budget' });
    expect(a).toEqual({ attribution: [], attribution_detail: [] });
  });
});

import { describe, expect, it } from 'vitest';
import { main } from '../../../src/cli/main.js';
import { CHOICE_SPECS, checkChoices, normalizeChoices, specProblem, validateChoices, validateRecord, type ChoiceSpec } from '../../../src/core/audit/index.js';
import { makeRecord } from '../../../src/ui/app-state.js';
import { DEFAULT_CHOICES } from '../../../src/ui/default-choices.js';

async function run(args: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const code = await main(args, (s) => (out += s + '\n'), (s) => (err += s + '\n'));
  return { code, out, err };
}

/** Just inside and just outside each end of a spec's range. */
function edges(s: ChoiceSpec): { inside: number[]; outside: number[] } {
  const step = s.integer ? 1 : Math.max(Math.abs(s.min), Math.abs(s.max), 1) * 1e-9;
  const inside = [s.minExclusive ? s.min + step : s.min, s.maxExclusive ? s.max - step : s.max];
  const outside = [s.minExclusive ? s.min : s.min - step, s.maxExclusive ? s.max : s.max + step];
  if (s.integer) outside.push(s.min + 0.5);
  return { inside, outside };
}

describe('one table of choices drives the core, the records and the CLI', () => {
  it('every spec is consistent: default inside its range, a flag, a label and a doc', () => {
    for (const s of CHOICE_SPECS) {
      expect(specProblem(s, s.default), s.key).toBeUndefined();
      expect(s.flag).toMatch(/^--[a-z0-9-]+$/);
      expect(s.label.length).toBeGreaterThan(0);
      expect(s.doc.length).toBeGreaterThan(0);
    }
    expect(new Set(CHOICE_SPECS.map((s) => s.flag)).size).toBe(CHOICE_SPECS.length);
  });

  it('the core and the record schema accept exactly the table range, naming the field', () => {
    for (const s of CHOICE_SPECS) {
      const { inside, outside } = edges(s);
      for (const v of inside) {
        expect(validateChoices({ ...DEFAULT_CHOICES, [s.key]: v }), `${s.key}=${v}`).toEqual([]);
        expect(() => validateRecord(makeRecord('id,z,muv\n', { ...DEFAULT_CHOICES, [s.key]: v }))).not.toThrow();
      }
      for (const v of [...outside, Number.NaN, Number.POSITIVE_INFINITY]) {
        const p = validateChoices({ ...DEFAULT_CHOICES, [s.key]: v });
        expect(p, `${s.key}=${v}`).toHaveLength(1);
        expect(p[0]).toMatch(new RegExp(`^${s.key}: must be`));
        expect(() => validateRecord(makeRecord('id,z,muv\n', { ...DEFAULT_CHOICES, [s.key]: v }))).toThrow(new RegExp(`record\\.choices\\.${s.key}:`));
      }
    }
  });

  it('the CLI takes every spec flag, refuses values outside the table with the flag and the field, and records what it took', async () => {
    for (const s of CHOICE_SPECS) {
      const { inside, outside } = edges(s);
      const bad = await run(['assess', '--demo', s.flag, String(outside[0])]);
      expect(bad.code, `${s.flag} ${outside[0]}`).toBe(2);
      expect(bad.err).toMatch(new RegExp(`^error: ${s.flag} \\(${s.key}\\) must be`));
      if (s.key === 'draws') continue; // a million draws is valid but slow; its lower end is checked below
      const v = s.key === 'quantile' ? inside[0] : inside[1];
      const ok = await run(['assess', '--demo', '--draws', '100', '--imf', 'salpeter', `${s.flag}=${v}`]);
      expect(ok.code, `${s.flag} ${v}: ${ok.err}`).toBe(0);
      expect(JSON.parse(ok.out).record.choices[s.key]).toBe(v);
    }
    const dflt = JSON.parse((await run(['assess', '--demo', '--draws', '100', '--imf', 'salpeter'])).out).record.choices;
    for (const s of CHOICE_SPECS) if (s.key !== 'draws') expect(dflt[s.key], s.key).toBe(s.default);
  }, 60000);

  it('headlineImf: defaults to the first IMF, is always compared, and must be a known IMF', async () => {
    expect(normalizeChoices({ ...DEFAULT_CHOICES, imfs: ['kroupa', 'salpeter'] }).headlineImf).toBe('kroupa');
    const n = normalizeChoices({ ...DEFAULT_CHOICES, imfs: ['kroupa'], headlineImf: 'top-heavy-flat' });
    expect(n.imfs).toEqual(['top-heavy-flat', 'kroupa']);
    expect(checkChoices({ ...DEFAULT_CHOICES, headlineImf: 'nope' })[0]).toMatchObject({ field: 'headlineImf' });
    const r = await run(['assess', '--demo', '--draws', '100', '--imf', 'salpeter', '--headline-imf', 'chabrier']);
    expect(r.code).toBe(0);
    const rec = JSON.parse(r.out).record;
    expect(rec.choices.headlineImf).toBe('chabrier');
    expect(rec.choices.imfs).toContain('chabrier');
    const bad = await run(['assess', '--demo', '--headline-imf', 'nope']);
    expect(bad.code).toBe(2);
    expect(bad.err).toMatch(/^error: --headline-imf: unknown IMF "nope"/);
  });
});

import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { runCli } from '../cli/run-cli.js';
import { reproduction, TOOL_VERSION, validateRecord } from '../../src/core/audit/index.js';
import { decodeShare, encodeShare, loadSaved, makeRecord, notExactNote, recordFromJson, save, STORAGE_KEY } from '../../src/ui/app-state.js';
import { DEFAULT_CHOICES } from '../../src/ui/default-choices.js';

const run = runCli;
const tmp = mkdtempSync(join(tmpdir(), 'baryon-record-'));
const REC = makeRecord('id,z,muv\nA,9,-20\n', { ...DEFAULT_CHOICES, draws: 200, imfs: ['salpeter'] });

/** A storage stand-in with the Storage methods app-state uses. */
function memoryStorage(): Storage {
  const m = new Map<string, string>();
  return { getItem: (k) => m.get(k) ?? null, setItem: (k, v) => void m.set(k, v), removeItem: (k) => void m.delete(k), clear: () => m.clear(), key: () => null, length: 0 } as Storage;
}

/** Damaged choices seen in hostile records, each with the field its message must name. */
const DAMAGE: [string, Record<string, unknown>, RegExp][] = [
  ['surveys [null]', { surveys: [null] }, /record\.choices\.surveys\[0\]: must be a survey/],
  ['a table transfer without a table', { transfer: { kind: 'table' } }, /record\.choices\.transfer\.kMpc: a table transfer needs/],
  ['an unknown transfer', { transfer: { kind: 'nope' } }, /record\.choices\.transfer\.kind: must be one of eh98, eh98-nowiggle, bbks, table/],
  ['deltaC 99', { deltaC: { kind: 'constant', value: 99 } }, /record\.choices\.deltaC\.value: must be in \[1, 2\.5\]/],
  ['deltaC −1', { deltaC: { kind: 'constant', value: -1 } }, /record\.choices\.deltaC\.value/],
  ['zBins not pairs', { zBins: [[9]] }, /record\.choices\.zBins\[0\]: must be a pair/],
  ['zBins reversed', { zBins: [[11, 9]] }, /record\.choices\.zBins\[0\]/],
  ['zBins not a list', { zBins: 'x' }, /record\.choices\.zBins: must be a list/],
  ['an unknown IMF', { imfs: ['salpeter', 'nope'] }, /record\.choices\.imfs\[1\]: unknown IMF "nope"/],
  ['an unknown choice', { colour: 'red' }, /record\.choices\.colour: not a choice/],
  ['a survey with z range 0–40', { survey: { name: 'f', areaArcmin2: 40, zMin: 0, zMax: 40 } }, /record\.choices\.survey\.zMax: must be in \(0, 30\]/],
  ['surveys repeating a name', { surveys: [{ name: 'f', areaArcmin2: 4, zMin: 7, zMax: 9 }, { name: 'f', areaArcmin2: 4, zMin: 7, zMax: 9 }] }, /record\.choices\.surveys\[1\]\.name: "f" repeats/],
];

describe('records, share links and saved state: one validated schema', () => {
  for (const [what, patch, re] of DAMAGE) {
    it(`${what}: refused the same way by the record, the link, the saved state and the CLI`, async () => {
      const bad = { ...REC, choices: { ...REC.choices, ...patch } };
      expect(() => validateRecord(bad)).toThrow(re);
      expect(() => decodeShare(encodeShare(bad as never))).toThrow(re);
      expect(() => recordFromJson(JSON.stringify(bad))).toThrow(re);
      const st = memoryStorage();
      expect(save(st, bad as never)).toBe(false);
      expect(st.getItem(STORAGE_KEY)).toBeNull();
      st.setItem(STORAGE_KEY, JSON.stringify(bad));
      expect(loadSaved(st).problem).toMatch(re);
      const f = join(tmp, 'bad.json');
      writeFileSync(f, JSON.stringify(bad));
      const r = await run(['assess', '--record', f]);
      expect(r.code).toBe(2);
      expect(r.err).toMatch(re);
      expect(r.err.trim().split('\n')).toHaveLength(1);
    });
  }

  it('unknown versions and formats are refused with a message', () => {
    expect(() => validateRecord({ ...REC, version: '9.9.9' })).toThrow(/record\.version: this is baryon-audit 0\.2\.0, which reads records of version 0\.2\.0, 0\.1\.0 \(got "9\.9\.9"\)/);
    expect(() => validateRecord({ ...REC, format: 2 })).toThrow(/record\.format/);
  });

  it('a record of 0.1.0 is reproduced with fixed draws; with adaptive draws (the rule changed in 0.2.0) --record refuses it and the page opens it with a note', async () => {
    // 0.2.0 changed only the adaptive draw rule (draw-rule.ts: first look 1000, blocks of 250, the error at its upper limit; 0.1.0: 2000, 1000)
    const fixedOld = { ...REC, version: '0.1.0', choices: { ...REC.choices, fixedDraws: true } };
    const adaptiveOld = { ...REC, version: '0.1.0' };
    expect(reproduction(validateRecord(REC))).toEqual({ exact: true });
    expect(reproduction(validateRecord(fixedOld))).toEqual({ exact: true });
    expect(reproduction(validateRecord(adaptiveOld)).exact).toBe(false);
    // the CLI re-runs the fixed-draw record of 0.1.0 to the numbers of the same record of this version
    const write = (name: string, rec: unknown): string => {
      const f = join(tmp, name);
      writeFileSync(f, JSON.stringify(rec));
      return f;
    };
    const a = await run(['assess', '--record', write('old-fixed.json', fixedOld), '--format', 'json']);
    const b = await run(['assess', '--record', write('new-fixed.json', { ...fixedOld, version: TOOL_VERSION }), '--format', 'json']);
    expect(a.code, a.err).toBe(0);
    expect(JSON.parse(a.out).galaxies).toEqual(JSON.parse(b.out).galaxies);
    // and refuses the adaptive one in one line that names the field and the change
    const c = await run(['assess', '--record', write('old-adaptive.json', adaptiveOld), '--format', 'json']);
    expect(c.code).toBe(2);
    expect(c.err.trim().split('\n')).toHaveLength(1);
    expect(c.err).toMatch(/record\.version: a record of baryon-audit 0\.1\.0 with adaptive draws is not reproduced exactly by 0\.2\.0: its adaptive draw rule looked first at 2000 draws/);
    // the page keeps the sample of a link, a saved state or an imported file, and says its numbers are this version's
    expect(notExactNote(validateRecord(fixedOld))).toBe('');
    expect(notExactNote(validateRecord(adaptiveOld))).toMatch(/made by baryon-audit 0\.1\.0 with adaptive draws: its numbers are now those of 0\.2\.0/);
    const st = memoryStorage();
    st.setItem(STORAGE_KEY, JSON.stringify(adaptiveOld));
    expect(loadSaved(st)).toEqual({ record: adaptiveOld });
    expect(decodeShare(encodeShare(adaptiveOld as never))).toEqual(adaptiveOld);
    expect(recordFromJson(JSON.stringify(adaptiveOld))).toEqual(adaptiveOld);
  });

  it("the tool's own JSON output is a record for --record, the import and the link, as the README says", async () => {
    const out = await run(['assess', '--demo', '--draws', '200', '--imf', 'salpeter', '--format', 'json']);
    expect(out.code).toBe(0);
    const f = join(tmp, 'out.json');
    writeFileSync(f, out.out);
    const again = await run(['assess', '--record', f]);
    expect(again.code, again.err).toBe(0);
    expect(JSON.parse(again.out).galaxies).toEqual(JSON.parse(out.out).galaxies);
    expect(recordFromJson(out.out)).toEqual(JSON.parse(out.out).record);
  });

  it('flags beside --record are refused, never ignored', async () => {
    const f = join(tmp, 'rec.json');
    writeFileSync(f, JSON.stringify(REC));
    for (const extra of [['--seed', '5'], ['--imf', 'kroupa'], ['--demo'], ['sample.csv']]) {
      const r = await run(['assess', '--record', f, ...extra]);
      expect(r.code, extra.join(' ')).toBe(2);
      expect(r.err).toMatch(/^error: --record re-runs the record's own choices/);
    }
    expect((await run(['assess', '--record', f, '--format', 'csv'])).code).toBe(0);
  });

  it('random damage to any choice is either valid or refused naming a record.choices field', () => {
    const keys = Object.keys(REC.choices);
    fc.assert(
      fc.property(fc.constantFrom(...keys), fc.jsonValue(), (k, v) => {
        try {
          validateRecord({ ...REC, choices: { ...REC.choices, [k]: v } });
        } catch (e) {
          expect(e).toBeInstanceOf(RangeError);
          expect((e as Error).message).toMatch(new RegExp(`^record\\.choices\\.${k}`));
        }
      }),
      { numRuns: 300 },
    );
  });
});

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { runAudit, validateRecord } from '../../src/core/audit/index.js';
import { decodeShare, encodeShare, makeRecord, recordFromJson } from '../../src/ui/app-state.js';
import { DEFAULT_CHOICES } from '../../src/ui/default-choices.js';

const csvArb = fc.array(fc.string({ maxLength: 30 }), { maxLength: 6 }).map((l) => ['id,z,muv', ...l].join('\n'));

describe('share links and JSON records, property-based', () => {
  it('encode → decode is the identity for any sample text and seed', () => {
    fc.assert(
      fc.property(csvArb, fc.integer({ min: -1000, max: 1000 }), fc.double({ min: 0.01, max: 1, noNaN: true }), (csv, seed, eps) => {
        const rec = makeRecord(csv, { ...DEFAULT_CHOICES, seed, epsRef: eps });
        expect(decodeShare(encodeShare(rec))).toEqual(rec);
      }),
      { numRuns: 200 },
    );
  });

  it('a truncated link is refused with a message (never another kind of error)', () => {
    const link = encodeShare(makeRecord('id,z,muv\nA,9,-20\n', DEFAULT_CHOICES));
    fc.assert(
      fc.property(fc.integer({ min: 0, max: link.length - 1 }), (cut) => {
        const t = link.slice(0, cut);
        let err: unknown;
        try {
          decodeShare(t);
        } catch (e) {
          err = e;
        }
        expect(err).toBeInstanceOf(RangeError);
        expect((err as Error).message.length).toBeGreaterThan(5);
      }),
      { numRuns: 200 },
    );
  });

  it('a tampered link either still validates or is refused with a RangeError naming what is wrong', () => {
    const link = encodeShare(makeRecord('id,z,muv\nA,9,-20\n', DEFAULT_CHOICES));
    const alphabet = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789-_!%';
    fc.assert(
      fc.property(fc.integer({ min: 7, max: link.length - 1 }), fc.integer({ min: 0, max: alphabet.length - 1 }), (pos, c) => {
        const t = link.slice(0, pos) + alphabet[c] + link.slice(pos + 1);
        try {
          const rec = decodeShare(t);
          expect(rec.tool).toBe('baryon-audit');
        } catch (e) {
          expect(e).toBeInstanceOf(RangeError);
        }
      }),
      { numRuns: 300 },
    );
  });

  it('random JSON is either a valid record or refused with a message that names the record field', () => {
    fc.assert(
      fc.property(fc.jsonValue(), (v) => {
        try {
          validateRecord(v);
          throw new Error('random JSON accepted');
        } catch (e) {
          expect(e).toBeInstanceOf(RangeError);
          expect((e as Error).message).toMatch(/^record/);
        }
      }),
      { numRuns: 300 },
    );
  });

  it('a record of another version or with a damaged choice is refused and says which', () => {
    const rec = makeRecord('id,z,muv\nA,9,-20\n', DEFAULT_CHOICES);
    expect(() => recordFromJson(JSON.stringify({ ...rec, format: 2 }))).toThrow(/record\.format/);
    expect(() => recordFromJson(JSON.stringify({ ...rec, choices: { ...rec.choices, quantile: 1.5 } }))).toThrow(/quantile/);
    expect(() => recordFromJson(JSON.stringify({ ...rec, choices: { ...rec.choices, cosmology: { ...rec.choices.cosmology, omegaB: 0.9 } } }))).toThrow(/record\.choices\.cosmology/);
    expect(() => recordFromJson('{"tool": "baryon-audit", "format": 1')).toThrow(/not valid JSON/);
  });

  it('an accepted record reproduces its numbers exactly', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 10000 }), (seed) => {
        const choices = { ...DEFAULT_CHOICES, seed, draws: 300, imfs: ['salpeter', 'top-heavy-flat'] };
        const first = runAudit('id,z,z_lo,z_hi,muv,mag_err\nA,9.3,9.1,9.6,-21,0.1\n', choices);
        const rec = recordFromJson(JSON.stringify(first));
        const again = runAudit(rec.sample_csv, rec.choices);
        expect(JSON.stringify(again)).toBe(JSON.stringify(first));
      }),
      { numRuns: 5 },
    );
  });
});

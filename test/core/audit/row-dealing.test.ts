import { describe, expect, it } from 'vitest';
import { dealRows, MIN_ROWS_PER_THREAD, POOL_MIN_ROWS, threadsFor } from '../../../src/core/audit/row-dealing.js';
import { auditRow, prepareAudit } from '../../../src/core/audit/index.js';
import { DEFAULT_CHOICES } from '../../../src/ui/default-choices.js';

// The dealing is a partition of the rows (a closed-form property: every index exactly once, balanced to
// within one row); the audit of a dealt part equals the serial audit of the same rows.
describe('row dealing over threads', () => {
  it('deals every row exactly once, round-robin, balanced to within one row', () => {
    for (const [rows, threads] of [[0, 3], [1, 4], [24, 2], [25, 4], [5000, 2], [10007, 3]] as const) {
      const parts = dealRows(rows, threads);
      const all = parts.flat().sort((a, b) => a - b);
      expect(all).toEqual(Array.from({ length: rows }, (_, i) => i));
      const sizes = parts.map((p) => p.length);
      expect(Math.max(...sizes) - Math.min(...sizes)).toBeLessThanOrEqual(1);
      parts.forEach((p, t) => p.forEach((i) => expect(i % parts.length).toBe(t)));
    }
  });

  it('never makes more parts than rows, nor fewer than one', () => {
    expect(dealRows(3, 8).length).toBe(3);
    expect(dealRows(0, 8).length).toBe(1);
    expect(dealRows(10, 0).length).toBe(1);
  });

  it('one thread below the threshold, then one per 12 rows up to the cores', () => {
    expect(POOL_MIN_ROWS).toBe(24);
    expect(threadsFor(POOL_MIN_ROWS - 1, 8)).toBe(1);
    expect(threadsFor(POOL_MIN_ROWS, 8)).toBe(POOL_MIN_ROWS / MIN_ROWS_PER_THREAD);
    expect(threadsFor(37, 8)).toBe(4);
    expect(threadsFor(5000, 2)).toBe(2);
    expect(threadsFor(5000, 1)).toBe(1);
    expect(threadsFor(5000, 4)).toBe(4);
    expect(threadsFor(Number.NaN, 4)).toBe(1);
  });

  it('auditing the dealt parts gives exactly the serial rows', () => {
    const lines = ['id,z,z_lo,z_hi,muv,mag_err'];
    for (let i = 0; i < 26; i++) lines.push(`D-${i},${(7.4 + i * 0.13).toFixed(2)},${(7.2 + i * 0.13).toFixed(2)},${(7.6 + i * 0.13).toFixed(2)},-21.0,0.1`);
    const choices = { ...DEFAULT_CHOICES, draws: 200, imfs: ['salpeter', 'top-heavy-flat'] };
    const prep = prepareAudit(lines.join('\n'), choices);
    const serial = Array.from({ length: prep.parsed.rowCount }, (_, i) => auditRow(prep, i));
    const dealt = new Array(serial.length);
    for (const part of dealRows(serial.length, threadsFor(serial.length, 3))) for (const i of part) dealt[i] = auditRow(prepareAudit(lines.join('\n'), choices), i);
    expect(dealt).toEqual(serial);
  });
});

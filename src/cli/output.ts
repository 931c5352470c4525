import { safeCsvText } from '../core/audit/output-safety.js';
import { CliError } from './cli-error.js';

/** Refuses to print a non-finite number: every value that leaves the tool is checked here. */
export function assertFinite(v: unknown, path: string): void {
  if (typeof v === 'number' && !Number.isFinite(v)) throw new Error(`internal: non-finite value at ${path}`);
  if (Array.isArray(v)) v.forEach((x, i) => assertFinite(x, `${path}[${i}]`));
  else if (v && typeof v === 'object') for (const [k, x] of Object.entries(v)) assertFinite(x, `${path}.${k}`);
}

export function toJson(value: unknown): string {
  assertFinite(value, '$');
  return JSON.stringify(value, null, 2);
}

function csvCell(v: unknown): string {
  if (v === null || v === undefined) return '';
  const s = typeof v === 'number' ? (Number.isFinite(v) ? String(v) : (() => { throw new CliError('internal: non-finite value in CSV'); })()) : safeCsvText(Array.isArray(v) ? v.join(';') : String(v));
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export function toCsv(rows: readonly Record<string, unknown>[], columns?: readonly string[]): string {
  const cols = columns ?? (rows.length ? Object.keys(rows[0]) : []);
  return [cols.join(','), ...rows.map((r) => cols.map((c) => csvCell(r[c])).join(','))].join('\n');
}

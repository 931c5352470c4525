import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { auditCsv, auditMarkdown, csvCell, escapeMarkdown, runAudit, safeCsvText } from '../../../src/core/audit/index.js';
import { DEFAULT_CHOICES } from '../../../src/ui/default-choices.js';

// Formula triggers per the OWASP "CSV Injection" page (common practice, no source).
const TRIGGERS = ['=', '+', '-', '@', '\t', '\r'];

describe('CSV cells are safe to open in a spreadsheet', () => {
  it('text starting with a formula trigger gets a leading quote; strict numbers stay numeric', () => {
    for (const t of TRIGGERS) expect(safeCsvText(`${t}HYPERLINK("x")`)).toBe(`'${t}HYPERLINK("x")`);
    expect(safeCsvText('  =1+1')).toBe("'  =1+1");
    for (const n of ['-20.5', '+3', '1e-3', '-0.1E+2', '9']) expect(safeCsvText(n)).toBe(n);
    expect(safeCsvText('-')).toBe("'-");
    expect(safeCsvText('plain')).toBe('plain');
    expect(csvCell('a,"b"')).toBe('"a,""b"""');
    expect(csvCell(-1.5)).toBe('-1.5');
    expect(() => csvCell(Number.NaN)).toThrow(/non-finite/);
  });

  it('the audit CSV: no text cell starts with a trigger, numbers round-trip, every input echoed', () => {
    const csv = 'id,z,muv,notes\n=cmd|calc,9,-20,@SUM(A1)\n+A2,9.3,-20.5,"\tTAB"\n-B3,9.6,-21,-2+3\n';
    const r = runAudit(csv, { ...DEFAULT_CHOICES, draws: 200, imfs: ['salpeter'] });
    const rows = Papa.parse<string[]>(auditCsv(r), { skipEmptyLines: true }).data;
    const header = rows[0];
    for (const row of rows.slice(1)) for (const c of row) if (c !== '' && !/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(c)) expect(TRIGGERS).not.toContain(c[0]);
    const idCol = header.indexOf('id');
    expect(rows.slice(1).map((x) => x[idCol])).toEqual(["'=cmd|calc", "'+A2", "'-B3"]);
    expect(rows[1][header.indexOf('in_muv')]).toBe('-20');
    expect(rows[1][header.indexOf('in_notes')]).toBe("'@SUM(A1)");
  });
});

describe('Markdown output carries user strings as text', () => {
  it('escapes HTML and Markdown markup and joins lines', () => {
    expect(escapeMarkdown('<script>alert(1)</script>')).toBe('&lt;script&gt;alert\\(1\\)&lt;/script&gt;');
    expect(escapeMarkdown('[x](javascript:alert(1))')).toBe('\\[x\\]\\(javascript:alert\\(1\\)\\)');
    expect(escapeMarkdown('a\n# heading')).toBe('a \\# heading');
    expect(escapeMarkdown("it's *bold* & `code`")).toBe('it&#39;s \\*bold\\* &amp; \\`code\\`');
  });

  it('the audit report has no live tag, link or image from ids, notes, survey names or reasons', () => {
    const csv = 'id,z,muv,notes\n<script>alert(1)</script>,9,-20,<img src=x onerror=alert(1)>\n[x](javascript:alert(1)),9.2,-20,![i](http://x/y.png)\nbad<b>,nine,-20,\n';
    const r = runAudit(csv, { ...DEFAULT_CHOICES, draws: 200, imfs: ['salpeter'], survey: { ...DEFAULT_CHOICES.survey, name: '<i>field</i>' } });
    const md = auditMarkdown(r);
    expect(md).not.toMatch(/<script|<img|<b>|<i>|\]\(javascript|!\[i\]\(/);
    expect(md).toContain('&lt;script&gt;');
  });
});

describe('file-level messages reach every format', () => {
  it('a repeated column and a near-miss name are in the JSON, the CSV and the Markdown', () => {
    const r = runAudit('id,z,muv,Z,M_UV2\nA,9,-20,9,x\n', { ...DEFAULT_CHOICES, draws: 200, imfs: ['salpeter'] });
    expect(r.sample.file_errors[0]).toMatch(/"z" twice/);
    const csvRows = Papa.parse<string[]>(auditCsv(r), { skipEmptyLines: true }).data;
    const st = csvRows[0].indexOf('status');
    const er = csvRows[0].indexOf('errors');
    expect(csvRows.find((x) => x[st] === 'file error')?.[er]).toMatch(/"z" twice/);
    expect(auditMarkdown(r)).toMatch(/\*\*Error:\*\* the header names &quot;z&quot; twice/);
    const w = runAudit('id,z,muv,betta\nA,9,-20,-2\n', { ...DEFAULT_CHOICES, draws: 200, imfs: ['salpeter'] });
    expect(w.sample.file_warnings.join(' ')).toMatch(/did you mean "beta"/);
    expect(auditMarkdown(w)).toMatch(/Warning: column &quot;betta&quot;/);
    expect(Papa.parse<string[]>(auditCsv(w)).data.some((x) => x.includes('file warning'))).toBe(true);
  });
});

import { describe, expect, it } from 'vitest';
import { parseSurveys } from '../../../src/core/audit/index.js';

// The surveys file is read like the sample (the same record reader); these cases are built from the
// file format's definition (README, "Named surveys") and common CSV practice (RFC 4180 quoting), no other source.
describe('the surveys file', () => {
  it('reads a BOM, CRLF line ends, header names in any case and trimmed, quoted names and extra columns', () => {
    const p = parseSurveys('\uFEFF Name ,AREA_arcmin2, z_min ,Z_MAX,comment\r\n"Field A, deep",12.5,8,12,x\r\nwide,100,6,10,\r\n');
    expect(p.errors).toEqual([]);
    expect(p.surveys).toEqual([
      { name: 'Field A, deep', areaArcmin2: 12.5, zMin: 8, zMax: 12 },
      { name: 'wide', areaArcmin2: 100, zMin: 6, zMax: 10 },
    ]);
    expect(p.warnings.join(' ')).toMatch(/column "comment" is not one of name, area_arcmin2, z_min, z_max and is ignored/);
  });

  it('reads CR-only line ends and reports empty lines', () => {
    const p = parseSurveys('name,area_arcmin2,z_min,z_max\rdeep,10,8,12\r\rwide,50,6,10\r');
    expect(p.surveys.map((s) => s.name)).toEqual(['deep', 'wide']);
    expect(p.warnings.join(' ')).toMatch(/line 3 is empty and skipped/);
  });

  it('lists every problem with its line and column, and accepts no survey from a bad row', () => {
    const p = parseSurveys('name,area_arcmin2,z_min,z_max\ndeep,"1,5",8,12\nwide,-3,6,10\n,10,6,10\nok,10,6\nok2,10,abc,10\n');
    expect(p.errors).toHaveLength(5);
    expect(p.errors[0]).toMatch(/^surveys file, line 2, column area_arcmin2: "1,5" uses a comma as decimal mark; write 1\.5/);
    expect(p.errors[1]).toMatch(/^surveys file, line 3, column area_arcmin2: must be in \[/);
    expect(p.errors[2]).toMatch(/^surveys file, line 4, column name: is empty/);
    expect(p.errors[3]).toMatch(/^surveys file, line 5: 3 cells, but the header has 4/);
    expect(p.errors[4]).toMatch(/^surveys file, line 6, column z_min: "abc" is not a number/);
    expect(p.surveys).toEqual([]);
  });

  it('refuses a repeated name, naming both lines', () => {
    const p = parseSurveys('name,area_arcmin2,z_min,z_max\ndeep,10,8,12\nwide,50,6,10\ndeep,20,8,12\n');
    expect(p.errors).toEqual(['surveys file, line 4: the name "deep" repeats line 2']);
  });

  it('refuses a repeated or missing column, with a hint for a near miss', () => {
    expect(parseSurveys('name,area_arcmin2,z_min,z_max,Z_min\nd,10,8,12,9\n').errors[0]).toMatch(/header \(line 1\): "Z_min" is named twice \(columns 3 and 5\)/);
    const p = parseSurveys('name,area_arcmin2,zmin,z_max\nd,10,8,12\n');
    expect(p.errors).toEqual(['surveys file, header (line 1): no "z_min" column (the columns are name, area_arcmin2, z_min, z_max)']);
    expect(p.warnings.join(' ')).toMatch(/"zmin" .*did you mean "z_min"\?/);
  });

  it('an unterminated quote is an error naming the lines it swallowed, not a silent merge', () => {
    const p = parseSurveys('name,area_arcmin2,z_min,z_max\n"deep,10,8,12\nwide,50,6,10\n');
    expect(p.errors).toEqual(['surveys file, lines 2–3: a quoted cell opened here is never closed, so lines 2–3 were read as one row']);
    expect(p.surveys).toEqual([]);
  });

  it('an empty file or a header alone is an error', () => {
    expect(parseSurveys('').errors[0]).toMatch(/it is empty/);
    expect(parseSurveys('name,area_arcmin2,z_min,z_max\n').errors[0]).toMatch(/no survey follows/);
  });
});

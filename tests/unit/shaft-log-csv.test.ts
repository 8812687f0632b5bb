import { describe, expect, it } from 'vitest';
import { SHAFT_LOG_ERRORS_SHOWN, SHAFT_LOG_MAX_BYTES, SHAFT_LOG_MAX_ROWS, type ShaftLogRow } from '../../shared/schemas/shaft-logs';
import {
  describeRowError,
  formatShaftLogCsv,
  parseShaftLogCsv,
  rowErrorsFromFieldErrors,
  rowErrorsToFieldErrors,
  type ShaftLogParse,
} from '../../shared/shaft-log-csv';

const HEADER = 'time_s,engine_rpm,boost_kpa,shaft_rpm,intake_c';

function rowsOf(result: ShaftLogParse): ShaftLogRow[] {
  if (!result.ok) throw new Error(`expected the file to parse: ${result.errors.map(describeRowError).join('; ')}`);
  return result.rows;
}
function errorsOf(result: ShaftLogParse) {
  if (result.ok) throw new Error('expected the file to be refused');
  return result;
}

describe('parseShaftLogCsv: good files', () => {
  it('reads the rows, boost in kPa gauge', () => {
    const rows = rowsOf(parseShaftLogCsv(`${HEADER}\n0.0,2300,-45.0,24800,33.0\n0.1,2310,-44.5,24900,33.1\n`));
    expect(rows).toEqual([
      { t: 0, engineRpm: 2300, boostKpa: -45, shaftRpm: 24800, intakeC: 33 },
      { t: 0.1, engineRpm: 2310, boostKpa: -44.5, shaftRpm: 24900, intakeC: 33.1 },
    ]);
  });

  it('takes columns in any order and case, skips comments and blank lines, ignores extra columns, a BOM and CRLF', () => {
    const text = '\uFEFF# logger 7, firmware 2\r\n\r\nIntake_C,Shaft_RPM,Lambda,Time_s,Engine_RPM,Boost_kPa\r\n35.5,150000,0.82,1.5,5000,100\r\n# a note mid-file\r\n\r\n35.6,151000,0.81,1.6,5050,101,\r\n';
    const result = parseShaftLogCsv(text);
    expect(rowsOf(result)).toEqual([
      { t: 1.5, engineRpm: 5000, boostKpa: 100, shaftRpm: 150000, intakeC: 35.5 },
      { t: 1.6, engineRpm: 5050, boostKpa: 101, shaftRpm: 151000, intakeC: 35.6 },
    ]);
    expect(result.ok && result.ignoredColumns).toEqual(['lambda']);
    expect(result.ok && result.boostUnit).toBe('kpa');
  });

  it('converts boost in psi and bar to kPa (NIST SP 811: 1 psi = 6.894 757 kPa; 1 bar = 100 kPa exactly)', () => {
    const psi = parseShaftLogCsv('time_s,engine_rpm,boost_psi,shaft_rpm,intake_c\n0,6000,14.5,180000,45\n');
    expect(psi.ok && psi.boostUnit).toBe('psi');
    expect(rowsOf(psi)[0]?.boostKpa).toBeCloseTo(14.5 * 6.894757, 4);
    const bar = parseShaftLogCsv('time_s,engine_rpm,boost_bar,shaft_rpm,intake_c\n0,6000,1.2,180000,45\n');
    expect(rowsOf(bar)[0]?.boostKpa).toBeCloseTo(120, 9);
  });

  it('reads quoted cells and exponents, as spreadsheets write them', () => {
    expect(rowsOf(parseShaftLogCsv(`${HEADER}\n"0.5","6000","1.1e2","1.8E5","45"\n`))[0]).toEqual({ t: 0.5, engineRpm: 6000, boostKpa: 110, shaftRpm: 180000, intakeC: 45 });
  });

  it('writes what it reads: formatShaftLogCsv round-trips in every unit', () => {
    const rows: ShaftLogRow[] = [
      { t: 0, engineRpm: 2300, boostKpa: -45, shaftRpm: 24800, intakeC: 33 },
      { t: 0.1, engineRpm: 6500, boostKpa: 111.1, shaftRpm: 181230, intakeC: 47.5 },
    ];
    for (const unit of ['kpa', 'psi', 'bar'] as const) {
      const back = rowsOf(parseShaftLogCsv(formatShaftLogCsv(rows, unit, ['a comment'])));
      back.forEach((row, i) => {
        expect(row.boostKpa).toBeCloseTo(rows[i]?.boostKpa ?? NaN, 0);
        expect({ ...row, boostKpa: 0 }).toEqual({ ...rows[i], boostKpa: 0 });
      });
    }
  });
});

describe('parseShaftLogCsv: each problem named by line and column', () => {
  it('a word where a number belongs, an empty cell, a value out of range', () => {
    const result = errorsOf(parseShaftLogCsv(`${HEADER}\n0.0,2300,-45,24800,33\n0.1,23OO,-45,24800,33\n0.2,2300,,24800,33\n0.3,2300,-45,900000,33\n`));
    expect(result.tooLarge).toBe(false);
    expect(result.errorCount).toBe(3);
    expect(result.errors).toEqual([
      { line: 3, column: 'engine_rpm', message: '“23OO” is not a number' },
      { line: 4, column: 'boost_kpa', message: 'is empty' },
      { line: 5, column: 'shaft_rpm', message: '900,000 rpm is outside the plausible 0 to 400,000 rpm' },
    ]);
  });

  it('gives the plausible range in the file’s own boost unit, rounded inwards', () => {
    const result = errorsOf(parseShaftLogCsv('time_s,engine_rpm,boost_psi,shaft_rpm,intake_c\n0,6000,70,180000,45\n0.1,6000,-20,180000,45\n'));
    // −100 to 450 kPa is −14.50 to 65.27 psi; shown as −14.5 to 65.2 so every value shown as allowed converts inside.
    expect(result.errors.map((e) => e.message)).toEqual([
      '70 psi (gauge) is outside the plausible -14.5 to 65.2 psi (gauge)',
      '-20 psi (gauge) is outside the plausible -14.5 to 65.2 psi (gauge)',
    ]);
  });

  it('checks every cell of a row, not only the first bad one', () => {
    const result = errorsOf(parseShaftLogCsv(`${HEADER}\n0.0,2300,,900000,33\n`));
    expect(result.errors).toEqual([
      { line: 2, column: 'boost_kpa', message: 'is empty' },
      { line: 2, column: 'shaft_rpm', message: '900,000 rpm is outside the plausible 0 to 400,000 rpm' },
    ]);
  });

  it('time must rise from row to row; a row is compared with the last good time before it', () => {
    const result = errorsOf(parseShaftLogCsv(`${HEADER}\n1.0,2300,-45,24800,33\n1.0,2300,-45,24800,33\n0.9,2300,-45,24800,33\nx,2300,-45,24800,33\n1.1,2300,-45,24800,33\n`));
    expect(result.errors).toEqual([
      { line: 3, column: 'time_s', message: '1 s is not after the row before (1 s): times must rise from row to row' },
      { line: 4, column: 'time_s', message: '0.9 s is not after the row before (1 s): times must rise from row to row' },
      { line: 5, column: 'time_s', message: '“x” is not a number' },
    ]);
  });

  it('a row with too few or too many values (decimal commas)', () => {
    const result = errorsOf(parseShaftLogCsv(`${HEADER}\n0,2300,-45,24800\n0.1,2300,-45,5,24800,33,1\n`));
    expect(result.errors).toEqual([
      { line: 2, column: null, message: 'has 4 values but the header names 5 columns' },
      { line: 3, column: null, message: 'has 7 values but the header names 5 columns; write decimals with a point, not a comma' },
    ]);
  });

  it('a header missing columns says which, and what it has instead', () => {
    const result = errorsOf(parseShaftLogCsv('time,rpm,boost,shaft_rpm,intake_c\n0,1,2,3,4\n'));
    expect(result.errors).toEqual([
      { line: 1, column: null, message: 'the header is missing time_s, engine_rpm and boost_kpa (or boost_psi or boost_bar); it has time, rpm, boost, shaft_rpm and intake_c' },
    ]);
  });

  it('boost in two units, a column twice, semicolons, an empty file, a header alone, a binary file', () => {
    expect(errorsOf(parseShaftLogCsv('time_s,engine_rpm,boost_kpa,boost_psi,shaft_rpm,intake_c\n')).errors[0]?.message).toBe(
      'give boost in one unit only; the header has boost_kpa and boost_psi',
    );
    expect(errorsOf(parseShaftLogCsv(`${HEADER},shaft_rpm\n`)).errors[0]).toEqual({ line: 1, column: 'shaft_rpm', message: 'the column shaft_rpm appears twice' });
    expect(errorsOf(parseShaftLogCsv('time_s;engine_rpm;boost_kpa;shaft_rpm;intake_c\n0;1;2;3;4\n')).errors[0]?.message).toBe(
      'columns must be separated by commas; this file uses semicolons or tabs',
    );
    expect(errorsOf(parseShaftLogCsv('\n# only a comment\n')).errors[0]?.message).toBe('the file is empty');
    expect(errorsOf(parseShaftLogCsv(`${HEADER}\n`)).errors[0]?.message).toBe('the file has a header but no rows of data');
    expect(errorsOf(parseShaftLogCsv('PK\u0003\u0004\u0000\u0000')).errors[0]?.message).toMatch(/^the file is not text/);
  });

  it('lists the first problems and counts them all', () => {
    const bad = Array.from({ length: 80 }, (_, i) => `${i},n/a,-45,24800,33`).join('\n');
    const result = errorsOf(parseShaftLogCsv(`${HEADER}\n${bad}\n`));
    expect(result.errorCount).toBe(80);
    expect(result.errors).toHaveLength(SHAFT_LOG_ERRORS_SHOWN);
    expect(result.errors[0]).toEqual({ line: 2, column: 'engine_rpm', message: '“n/a” is not a number' });
  });

  it('refuses a file over the row cap or the byte limit without reading on', () => {
    const rows = Array.from({ length: SHAFT_LOG_MAX_ROWS + 1 }, (_, i) => `${i / 10},2300,-45,24800,33`).join('\n');
    const tooMany = errorsOf(parseShaftLogCsv(`${HEADER}\n${rows}\n`));
    expect(tooMany.tooLarge).toBe(true);
    expect(tooMany.errors[0]?.message).toBe('the file has more than 10,000 rows; split the session into shorter logs');
    const tooBig = errorsOf(parseShaftLogCsv(`${HEADER}\n${'#'.repeat(SHAFT_LOG_MAX_BYTES)}\n`));
    expect(tooBig.tooLarge).toBe(true);
    // Bytes, not characters: 400,000 three-byte characters are 1.2 MB.
    expect(errorsOf(parseShaftLogCsv(`# ${'€'.repeat(400_000)}\n${HEADER}\n0,1,2,3,4\n`)).tooLarge).toBe(true);
  });
});

describe('row errors in the API’s error shape', () => {
  it('travel as field errors keyed by line and column, and come back the same', () => {
    const errors = [
      { line: null, column: null, message: 'the file is empty' },
      { line: 3, column: 'engine_rpm', message: '“23OO” is not a number' },
      { line: 3, column: 'boost_kpa', message: 'is empty' },
      { line: 7, column: null, message: 'has 4 values but the header names 5 columns' },
    ];
    const fieldErrors = rowErrorsToFieldErrors(errors);
    expect(fieldErrors).toEqual({
      file: ['the file is empty'],
      'line.3.engine_rpm': ['“23OO” is not a number'],
      'line.3.boost_kpa': ['is empty'],
      'line.7': ['has 4 values but the header names 5 columns'],
    });
    expect(rowErrorsFromFieldErrors({ ...fieldErrors, frameCode: ['choose a frame'] })).toEqual(errors);
    expect(describeRowError(errors[1]!)).toBe('line 3, engine_rpm: “23OO” is not a number');
  });
});

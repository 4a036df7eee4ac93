import { csvCell, usageCsv } from './usage-csv';

describe('csvCell (RFC 4180 quoting, OWASP CSV-injection guard)', () => {
  it('quotes commas, quotes and line breaks, doubling quotes', () => {
    expect(csvCell('plain')).toBe('plain');
    expect(csvCell('a,b')).toBe('"a,b"');
    expect(csvCell('say "hi"')).toBe('"say ""hi"""');
    expect(csvCell('two\nlines')).toBe('"two\nlines"');
  });

  it('defuses text a spreadsheet would run as a formula', () => {
    expect(csvCell('=HYPERLINK("http://x")')).toBe(`"'=HYPERLINK(""http://x"")"`);
    expect(csvCell('+1')).toBe("'+1");
    expect(csvCell('-2')).toBe("'-2");
    expect(csvCell('@SUM(A1)')).toBe("'@SUM(A1)");
  });

  it('writes numbers as they are and null as an empty cell', () => {
    expect(csvCell(-3)).toBe('-3');
    expect(csvCell(null)).toBe('');
  });
});

describe('usageCsv', () => {
  it('has a header line and CRLF line ends', () => {
    const csv = usageCsv([
      {
        bucket: '2026-03-12T09:00:00.000Z',
        keyId: 'key_a',
        keyName: 'Sweep rig — Stage 3',
        userId: 'usr_1',
        route: 'POST /v1/plans',
        count: 14,
        errorCount: 2,
      },
    ]);
    expect(csv).toBe(
      'bucket,keyId,keyName,userId,route,count,errorCount\r\n' +
        '2026-03-12T09:00:00.000Z,key_a,Sweep rig — Stage 3,usr_1,POST /v1/plans,14,2\r\n',
    );
  });
});

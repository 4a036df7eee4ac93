import { csvCell, toCsv } from './csv';

// Expected cells follow RFC 4180 (quoting) and the OWASP "CSV Injection" page (formula guard).
describe('csvCell', () => {
  it('quotes commas, quotes and line breaks, doubling quotes', () => {
    expect(csvCell('plain')).toBe('plain');
    expect(csvCell('a,b')).toBe('"a,b"');
    expect(csvCell('say "hi"')).toBe('"say ""hi"""');
    expect(csvCell('two\nlines')).toBe('"two\nlines"');
  });

  it.each([
    ['=HYPERLINK("http://x")', `"'=HYPERLINK(""http://x"")"`],
    ['+1', `"'+1"`],
    ['-2', `"'-2"`],
    ['@SUM(A1)', `"'@SUM(A1)"`],
    [' =1+1', `"' =1+1"`],
    ['   @cmd', `"'   @cmd"`],
    ['\u3000=1+1', `"'\u3000=1+1"`],
    ['＝1+1', `"'＝1+1"`],
    ['＋1', `"'＋1"`],
    ['－1', `"'－1"`],
    ['＠A1', `"'＠A1"`],
    ['\t=1', `"'\t=1"`],
    ['\rcmd', `"'\rcmd"`],
  ])('defuses text a spreadsheet would run as a formula: %j', (text, cell) => {
    expect(csvCell(text)).toBe(cell);
  });

  it('leaves text alone whose formula sign is not at the start', () => {
    expect(csvCell('M+030')).toBe('M+030');
    expect(csvCell('a = b')).toBe('a = b');
    expect(csvCell('Sweep rig — Stage 3')).toBe('Sweep rig — Stage 3');
  });

  it('writes numbers as numbers: a trim of -1.6 stays -1.6', () => {
    expect(csvCell(-1.6)).toBe('-1.6');
    expect(csvCell(-3)).toBe('-3');
    expect(csvCell(0.1 + 0.2)).toBe('0.30000000000000004');
    expect(csvCell(Number.NaN)).toBe('');
  });

  it('writes null and undefined as empty cells and booleans as words', () => {
    expect(csvCell(null)).toBe('');
    expect(csvCell(undefined)).toBe('');
    expect(csvCell(true)).toBe('true');
  });
});

describe('toCsv', () => {
  it('writes a header line and CRLF line ends', () => {
    expect(
      toCsv(
        ['channel', 'trimDb'],
        [
          ['M+030', -1.6],
          ['=cmd', 2],
        ],
      ),
    ).toBe(`channel,trimDb\r\nM+030,-1.6\r\n"'=cmd",2\r\n`);
  });
});

import fc from 'fast-check';
import { findJsonSyntaxError, parseJsonText } from './json-text';

// The reference is the JavaScript engine's own JSON.parse (ECMA-262 §25.5.1): the scanner must accept
// exactly what it accepts.
function engineAccepts(text: string): boolean {
  try {
    JSON.parse(text);
    return true;
  } catch {
    return false;
  }
}

describe('findJsonSyntaxError', () => {
  it('accepts every JSON text the engine writes', () => {
    fc.assert(
      fc.property(fc.jsonValue(), fc.boolean(), (value, pretty) => {
        const text = JSON.stringify(value, null, pretty ? 2 : undefined);
        expect(findJsonSyntaxError(text)).toBeNull();
      }),
      { numRuns: 300 },
    );
  });

  it('agrees with JSON.parse on damaged texts', () => {
    const damage = fc.tuple(
      fc.jsonValue(),
      fc.nat(),
      fc.constantFrom('', ',', '}', ']', '"', ':', 'x', '\n', '\\', "'"),
    );
    fc.assert(
      fc.property(damage, ([value, at, insert]) => {
        const text = JSON.stringify(value, null, 1);
        const position = text.length ? at % (text.length + 1) : 0;
        const broken = text.slice(0, position) + insert + text.slice(position + (insert ? 0 : 1));
        expect(findJsonSyntaxError(broken) === null).toBe(engineAccepts(broken));
      }),
      { numRuns: 500 },
    );
  });

  it('points at the line and column of a trailing comma and of a missing comma', () => {
    expect(findJsonSyntaxError('{\n  "a": 1,\n}')).toEqual({
      offset: 12,
      line: 3,
      column: 1,
      message: 'a comma before } is not allowed in JSON',
    });
    expect(findJsonSyntaxError('{\n  "a": 1\n  "b": 2\n}')).toMatchObject({
      line: 3,
      column: 3,
      message: 'a comma or } was expected',
    });
  });

  it('explains single quotes, unfinished texts and trailing text', () => {
    expect(findJsonSyntaxError("{'a': 1}")?.message).toBe('a field name in double quotes was expected');
    expect(findJsonSyntaxError("['a']")?.message).toBe('strings need double quotes');
    expect(findJsonSyntaxError('[1, 2')?.message).toBe('the text ends inside a list; a ] is missing');
    expect(findJsonSyntaxError('{"a": 1} x')).toMatchObject({
      column: 10,
      message: 'there is more text after the JSON value',
    });
  });
});

describe('parseJsonText', () => {
  it('treats blank text as no body and returns parsed values', () => {
    expect(parseJsonText('  \n')).toEqual({ value: undefined });
    expect(parseJsonText('{"sampleRateHz": 48000}')).toEqual({ value: { sampleRateHz: 48000 } });
  });

  it('reports the place of a syntax error in words', () => {
    expect(parseJsonText('{"a": tru}')).toEqual({
      error: 'Line 1, column 7: unexpected "t" where a value was expected.',
    });
  });
});

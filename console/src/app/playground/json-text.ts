/** Where a JSON text first goes wrong, counted the way editors count (lines and columns from 1). */
export interface JsonSyntaxError {
  offset: number;
  line: number;
  column: number;
  message: string;
}

const NUMBER = /-?(?:0|[1-9]\d*)(?:\.\d+)?(?:[eE][+-]?\d+)?/y;
const WHITESPACE = /[ \t\n\r]*/y;

class Scanner {
  offset = 0;
  constructor(private readonly text: string) {}

  fail(message: string): never {
    throw new SyntaxAt(this.offset, message);
  }

  skip(): void {
    WHITESPACE.lastIndex = this.offset;
    WHITESPACE.exec(this.text);
    this.offset = WHITESPACE.lastIndex;
  }

  peek(): string {
    return this.text[this.offset] ?? '';
  }

  value(depth: number): void {
    if (depth > 512) this.fail('nesting is too deep');
    this.skip();
    const c = this.peek();
    if (c === '{') return this.object(depth);
    if (c === '[') return this.array(depth);
    if (c === '"') return this.string();
    if (c === '-' || (c >= '0' && c <= '9')) return this.number();
    for (const literal of ['true', 'false', 'null']) {
      if (this.text.startsWith(literal, this.offset)) {
        this.offset += literal.length;
        return;
      }
    }
    if (c === '') this.fail('the text ends where a value was expected');
    if (c === "'") this.fail('strings need double quotes');
    this.fail(`unexpected ${JSON.stringify(c)} where a value was expected`);
  }

  private object(depth: number): void {
    this.offset++;
    this.skip();
    if (this.peek() === '}') {
      this.offset++;
      return;
    }
    for (;;) {
      this.skip();
      if (this.peek() === '}') this.fail('a comma before } is not allowed in JSON');
      if (this.peek() !== '"') this.fail('a field name in double quotes was expected');
      this.string();
      this.skip();
      if (this.peek() !== ':') this.fail('a colon after the field name was expected');
      this.offset++;
      this.value(depth + 1);
      this.skip();
      const c = this.peek();
      this.offset++;
      if (c === '}') return;
      if (c !== ',') {
        this.offset--;
        this.fail(c === '' ? 'the text ends inside an object; a } is missing' : 'a comma or } was expected');
      }
    }
  }

  private array(depth: number): void {
    this.offset++;
    this.skip();
    if (this.peek() === ']') {
      this.offset++;
      return;
    }
    for (;;) {
      this.skip();
      if (this.peek() === ']') this.fail('a comma before ] is not allowed in JSON');
      this.value(depth + 1);
      this.skip();
      const c = this.peek();
      this.offset++;
      if (c === ']') return;
      if (c !== ',') {
        this.offset--;
        this.fail(c === '' ? 'the text ends inside a list; a ] is missing' : 'a comma or ] was expected');
      }
    }
  }

  private string(): void {
    this.offset++;
    for (;;) {
      const c = this.peek();
      if (c === '') this.fail('the text ends inside a string; a closing " is missing');
      if (c === '"') {
        this.offset++;
        return;
      }
      if (c < ' ') this.fail('a control character (such as a line break) must be escaped inside a string');
      if (c === '\\') {
        const next = this.text[this.offset + 1] ?? '';
        if (next === 'u') {
          if (!/^[0-9a-fA-F]{4}$/.test(this.text.slice(this.offset + 2, this.offset + 6))) {
            this.fail('\\u must be followed by four hex digits');
          }
          this.offset += 6;
          continue;
        }
        if (!'"\\/bfnrt'.includes(next) || next === '') this.fail(`\\${next} is not a JSON escape`);
        this.offset += 2;
        continue;
      }
      this.offset++;
    }
  }

  private number(): void {
    NUMBER.lastIndex = this.offset;
    const match = NUMBER.exec(this.text);
    if (!match) this.fail('a number was expected');
    this.offset = NUMBER.lastIndex;
  }
}

class SyntaxAt extends Error {
  constructor(
    readonly offset: number,
    message: string,
  ) {
    super(message);
  }
}

function locate(text: string, offset: number): { line: number; column: number } {
  const before = text.slice(0, offset).split('\n');
  return { line: before.length, column: before[before.length - 1].length + 1 };
}

/**
 * Finds the first JSON syntax error with its line and column, or null for valid JSON. Browsers word
 * `JSON.parse` errors differently and not all give a position, so the console scans the text itself.
 */
export function findJsonSyntaxError(text: string): JsonSyntaxError | null {
  const scanner = new Scanner(text);
  try {
    scanner.value(0);
    scanner.skip();
    if (scanner.offset < text.length) scanner.fail('there is more text after the JSON value');
    return null;
  } catch (error) {
    if (!(error instanceof SyntaxAt)) throw error;
    return { offset: error.offset, ...locate(text, error.offset), message: error.message };
  }
}

/** Parses the editor's text: empty text is "no body", bad JSON comes back with where and why. */
export function parseJsonText(text: string): { value?: unknown; error?: string } {
  if (!text.trim()) return { value: undefined };
  const problem = findJsonSyntaxError(text);
  if (problem) return { error: `Line ${problem.line}, column ${problem.column}: ${problem.message}.` };
  return { value: JSON.parse(text) };
}

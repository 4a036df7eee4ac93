import { inlineMarkdown } from './inline-markdown';

describe('inlineMarkdown', () => {
  it('splits code spans, emphasis and strong text (CommonMark inline syntax)', () => {
    expect(
      inlineMarkdown('Designs sections from the *Audio EQ Cookbook*; `a0 = 1` is **always** true.'),
    ).toEqual([
      { kind: 'text', text: 'Designs sections from the ' },
      { kind: 'em', text: 'Audio EQ Cookbook' },
      { kind: 'text', text: '; ' },
      { kind: 'code', text: 'a0 = 1' },
      { kind: 'text', text: ' is ' },
      { kind: 'strong', text: 'always' },
      { kind: 'text', text: ' true.' },
    ]);
  });

  it('keeps markup inside code spans literal', () => {
    expect(inlineMarkdown('`H(z) = (b0 + b1·z⁻¹) * x`')).toEqual([
      { kind: 'code', text: 'H(z) = (b0 + b1·z⁻¹) * x' },
    ]);
  });

  it('links only http(s), same-site paths and fragments', () => {
    expect(
      inlineMarkdown('See [the docs](/docs/) or [RFC 9457](https://www.rfc-editor.org/rfc/rfc9457).'),
    ).toEqual([
      { kind: 'text', text: 'See ' },
      { kind: 'link', text: 'the docs', href: '/docs/' },
      { kind: 'text', text: ' or ' },
      { kind: 'link', text: 'RFC 9457', href: 'https://www.rfc-editor.org/rfc/rfc9457' },
      { kind: 'text', text: '.' },
    ]);
    expect(inlineMarkdown('[click](javascript:alert(1)) [x](//evil.example)')).toEqual([
      { kind: 'text', text: 'click) x' },
    ]);
  });

  it('returns plain text untouched and nothing for an empty string', () => {
    expect(inlineMarkdown('2 * 3 = 6')).toEqual([{ kind: 'text', text: '2 * 3 = 6' }]);
    expect(inlineMarkdown('')).toEqual([]);
  });
});

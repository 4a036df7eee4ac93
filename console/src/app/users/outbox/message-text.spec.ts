import { recipients, splitLinks } from './message-text';

describe('splitLinks', () => {
  it('separates links from text and leaves trailing punctuation outside the link', () => {
    expect(
      splitLinks('Set a password at https://console.example/accept-invitation?token=abc. Thanks'),
    ).toEqual([
      { text: 'Set a password at ' },
      {
        text: 'https://console.example/accept-invitation?token=abc',
        href: 'https://console.example/accept-invitation?token=abc',
      },
      { text: '. Thanks' },
    ]);
  });

  it('turns links to the console itself into paths', () => {
    const parts = splitLinks(
      'Open http://localhost:8080/accept-invitation?token=t1',
      'http://localhost:8080',
    );
    expect(parts[1]).toEqual({
      text: 'http://localhost:8080/accept-invitation?token=t1',
      href: '/accept-invitation?token=t1',
    });
  });

  it('never links javascript: or other schemes and keeps plain text whole', () => {
    expect(splitLinks('javascript:alert(1) and mailto:a@b.example')).toEqual([
      { text: 'javascript:alert(1) and mailto:a@b.example' },
    ]);
    expect(splitLinks('')).toEqual([]);
  });
});

describe('recipients', () => {
  it('joins several addresses', () => {
    expect(recipients(['a@kestrel.example', 'b@kestrel.example'])).toBe(
      'a@kestrel.example, b@kestrel.example',
    );
    expect(recipients('a@kestrel.example')).toBe('a@kestrel.example');
  });
});

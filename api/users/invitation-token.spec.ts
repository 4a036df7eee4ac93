import { generateInvitationToken, hashInvitationToken, invitationUrl } from './invitation-token';

describe('invitation tokens', () => {
  it('are 32 random bytes in base64url (43 characters, no padding), different each time', () => {
    const tokens = new Set(Array.from({ length: 50 }, generateInvitationToken));
    expect(tokens.size).toBe(50);
    for (const token of tokens) {
      expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);
      expect(Buffer.from(token, 'base64url')).toHaveLength(32);
    }
  });

  it('are stored as SHA-256 in hex (FIPS 180-2 appendix B.1 test vector for "abc")', () => {
    expect(hashInvitationToken('abc')).toBe(
      'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad',
    );
  });

  it('travel in a link to the console page, under a public URL with or without a path or trailing slash', () => {
    expect(invitationUrl('http://localhost:8080', 'tok-EN_1')).toBe(
      'http://localhost:8080/accept-invitation?token=tok-EN_1',
    );
    expect(invitationUrl('https://studio.example/isochron/', 'abc')).toBe(
      'https://studio.example/isochron/accept-invitation?token=abc',
    );
    expect(invitationUrl('https://studio.example/isochron', 'abc')).toBe(
      'https://studio.example/isochron/accept-invitation?token=abc',
    );
  });
});

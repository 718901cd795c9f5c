import { mailParts } from './mail-text';

describe('mailParts', () => {
  it('makes links, and links to the app\'s own pages relative so they open here', () => {
    const parts = mailParts('Accept the invitation: http://localhost:4300/invite?token=abc_DEF-1.\n\nMore at https://example.org/help');
    expect(parts).toEqual([
      { text: 'Accept the invitation: ' },
      { text: 'http://localhost:4300/invite?token=abc_DEF-1', href: '/invite?token=abc_DEF-1' },
      { text: '.\n\nMore at ' },
      { text: 'https://example.org/help', href: 'https://example.org/help' },
    ]);
  });

  it('leaves text without links alone', () => {
    expect(mailParts('-- Osmolane')).toEqual([{ text: '-- Osmolane' }]);
  });
});

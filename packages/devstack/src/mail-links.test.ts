import { describe, expect, it } from 'vitest';
import { extractLinks } from './mail-links.ts';

describe('extractLinks', () => {
  it('finds links in the text body without the sentence punctuation around them', () => {
    const text = 'Join the team at http://localhost:5173/invitations/abc123. (Or see https://heatfleet.example/help.)';
    expect(extractLinks(text, null)).toEqual([
      'http://localhost:5173/invitations/abc123',
      'https://heatfleet.example/help',
    ]);
  });

  it('reads hrefs from the HTML body, decoding entities, and skips mailto and relative links', () => {
    const html = [
      '<a href="http://localhost:5173/reset-password/t0k?x=1&amp;y=2">Reset</a>',
      "<a href='mailto:office@brackenford.example'>Mail</a>",
      '<a href=/relative>Here</a>',
      '<a HREF = "https://heatfleet.example/a">A</a>',
    ].join('');
    expect(extractLinks('', html)).toEqual([
      'http://localhost:5173/reset-password/t0k?x=1&y=2',
      'https://heatfleet.example/a',
    ]);
  });

  it('lists a link found in both bodies once', () => {
    const link = 'http://localhost:5173/invitations/abc';
    expect(extractLinks(`Open ${link}`, `<a href="${link}">Open</a>`)).toEqual([link]);
  });

  it('keeps brackets that belong to the link', () => {
    expect(extractLinks('see https://heatfleet.example/a_(b) now', null)).toEqual(['https://heatfleet.example/a_(b)']);
  });
});

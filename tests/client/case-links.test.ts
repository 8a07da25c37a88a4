import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { MemoryRouter } from 'react-router-dom';
import { describe, expect, it } from 'vitest';
import { MarkdownView } from '../../src/components/ui/MarkdownView';

const render = (text: string, references: { id: number; title: string }[]) =>
  renderToStaticMarkup(createElement(MemoryRouter, null, createElement(MarkdownView, { references, children: text })));

/** The renderer links only the cases the server listed for this reader; any other #id stays as written. */
describe('#id links in Markdown', () => {
  const text = 'Same as #12 and #40 (a draft of someone else).';

  it('should leave a case the reader may not open as plain text, title and all', () => {
    // an engineer: the server left #40 (another author's draft) out of the list
    const html = render(text, [{ id: 12, title: 'Clock a tenth of its size' }]);
    expect(html).toMatch(/<a title="Clock a tenth of its size"[^>]*href="\/cases\/12"[^>]*>#12<\/a>/);
    expect(html).not.toContain('/cases/40');
    expect(html).toContain('and #40 (a draft');
  });

  it('should link the draft for its author and moderators, whose list holds it', () => {
    const html = render(text, [
      { id: 12, title: 'Clock a tenth of its size' },
      { id: 40, title: 'Unfinished ringing case' },
    ]);
    expect(html).toMatch(/<a title="Unfinished ringing case"[^>]*href="\/cases\/40"[^>]*>#40<\/a>/);
    expect(html).not.toContain('target="_blank"');
  });

  it('should not link inside code, URLs or link targets', () => {
    const refs = [{ id: 12, title: 'Twelve' }];
    const html = render('`#12` and\n\n```\n#12\n```\n\nhttps://example.test/x#12 and [see](https://example.test/#12)', refs);
    expect(html).not.toContain('/cases/12');
  });

  it('should link nothing without references', () => {
    expect(render(text, [])).not.toContain('<a ');
  });
});

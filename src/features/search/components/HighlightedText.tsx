import type { ReactNode } from 'react';

/**
 * Text with the matched ranges marked. The server sends plain text and [start, end) offsets,
 * so the marks are React elements and nothing in a case's text is ever rendered as HTML.
 */
export function HighlightedText({ text, ranges }: { text: string; ranges: [number, number][] }) {
  const parts: ReactNode[] = [];
  let at = 0;
  for (const [start, end] of ranges) {
    if (start < at || end > text.length) continue;
    if (start > at) parts.push(text.slice(at, start));
    parts.push(
      <mark key={start} className="rounded-sm bg-rule/80 px-0.5 font-semibold text-ink">
        {text.slice(start, end)}
      </mark>,
    );
    at = end;
  }
  if (at < text.length) parts.push(text.slice(at));
  return <>{parts}</>;
}

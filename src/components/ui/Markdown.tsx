import { lazy, Suspense } from 'react';
import { MarkdownView, type MarkdownViewProps } from './MarkdownView';

// KaTeX (code, styles, fonts) is a chunk of its own, fetched the first time a formula is shown
const MathMarkdown = lazy(() => import('./MathMarkdown'));

type Props = Omit<MarkdownViewProps, 'remarkPlugins' | 'rehypePlugins'> & {
  /** Typeset `$…$` and `$$…$$` as TeX (Help, explanations); elsewhere a dollar is just a dollar. */
  math?: boolean;
};

/** Markdown as people write it on GitHub (tables, task lists, strikethrough); HTML in the text is dropped. */
export function Markdown({ math = false, ...props }: Props) {
  if (!math || !props.children.includes('$')) return <MarkdownView {...props} />;
  return (
    <Suspense fallback={<MarkdownView {...props} />}>
      <MathMarkdown {...props} />
    </Suspense>
  );
}

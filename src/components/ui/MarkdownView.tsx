import ReactMarkdown, { type Components, type Options } from 'react-markdown';
import { Link } from 'react-router-dom';
import remarkGfm from 'remark-gfm';
import type { CaseReference } from '../../../shared/cases/case-references';
import { remarkCaseLinks } from './case-links';

// Element styles live here because the app has no typography plugin; raw HTML is never rendered.
const components: Components = {
  h1: ({ node: _n, ...p }) => <h3 className="mt-4 mb-2 text-xl" {...p} />,
  h2: ({ node: _n, ...p }) => <h3 className="mt-4 mb-2 text-lg" {...p} />,
  h3: ({ node: _n, ...p }) => <h4 className="mt-3 mb-1 font-serif text-base font-bold" {...p} />,
  h4: ({ node: _n, ...p }) => <h5 className="mt-3 mb-1 font-semibold" {...p} />,
  p: ({ node: _n, ...p }) => <p className="my-2 leading-relaxed" {...p} />,
  ul: ({ node: _n, ...p }) => <ul className="my-2 list-disc pl-6" {...p} />,
  ol: ({ node: _n, ...p }) => <ol className="my-2 list-decimal pl-6" {...p} />,
  li: ({ node: _n, ...p }) => <li className="my-0.5" {...p} />,
  a: ({ node, href, title, children, ...p }) =>
    // a `#123` the server said the reader may open: an in-app link, not a new tab
    node?.properties?.dataCaseRef !== undefined && href ? (
      <Link to={href} title={title} className="text-agree underline underline-offset-2" data-case-ref={String(node.properties.dataCaseRef)}>
        {children}
      </Link>
    ) : (
      <a className="text-agree underline underline-offset-2" rel="noopener noreferrer nofollow" target="_blank" href={href} title={title} {...p}>
        {children}
      </a>
    ),
  blockquote: ({ node: _n, ...p }) => <blockquote className="my-2 border-l-4 border-rule pl-3 text-muted" {...p} />,
  code: ({ node: _n, ...p }) => <code className="rounded bg-paper px-1 font-mono text-[0.9em]" {...p} />,
  pre: ({ node: _n, ...p }) => <pre className="my-2 overflow-x-auto rounded-md border border-rule bg-paper p-3 font-mono text-sm" {...p} />,
  table: ({ node: _n, ...p }) => (
    <div className="my-2 overflow-x-auto">
      <table className="min-w-full border-collapse text-sm" {...p} />
    </div>
  ),
  th: ({ node: _n, ...p }) => <th className="border border-rule px-2 py-1 text-left font-semibold" {...p} />,
  td: ({ node: _n, ...p }) => <td className="border border-rule px-2 py-1" {...p} />,
  hr: () => <hr className="my-4 border-rule" />,
  img: ({ node: _n, alt, ...p }) => <img className="my-2 max-w-full rounded border border-rule" alt={alt ?? ''} {...p} />,
};

export interface MarkdownViewProps {
  children: string;
  className?: string;
  /** The `#123` cases the reader may open (from the server); other numbers stay plain text. */
  references?: CaseReference[];
  /** Extra plugins (math typesetting, loaded only where used). */
  remarkPlugins?: NonNullable<Options['remarkPlugins']>;
  rehypePlugins?: NonNullable<Options['rehypePlugins']>;
}

/** Markdown as people write it on GitHub (tables, task lists, strikethrough); HTML in the text is dropped. */
export function MarkdownView({ children, className = '', references, remarkPlugins = [], rehypePlugins = [] }: MarkdownViewProps) {
  return (
    <div className={`break-words ${className}`}>
      <ReactMarkdown remarkPlugins={[remarkGfm, ...remarkPlugins, [remarkCaseLinks, { references }]]} rehypePlugins={rehypePlugins} skipHtml components={components}>
        {children}
      </ReactMarkdown>
    </div>
  );
}

import 'katex/dist/katex.min.css';
import rehypeKatex from 'rehype-katex';
import remarkMath from 'remark-math';
import { MarkdownView, type MarkdownViewProps } from './MarkdownView';

type Props = Omit<MarkdownViewProps, 'remarkPlugins' | 'rehypePlugins'>;

/** Markdown with TeX typeset by KaTeX; a formula KaTeX cannot read shows its source in red rather than failing the page. */
export default function MathMarkdown(props: Props) {
  return <MarkdownView {...props} remarkPlugins={[remarkMath]} rehypePlugins={[[rehypeKatex, { throwOnError: false, strict: 'ignore' }]]} />;
}

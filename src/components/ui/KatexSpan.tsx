import 'katex/dist/katex.min.css';
import katex from 'katex';

/** One TeX formula typeset by KaTeX (HTML for the eye, MathML for screen readers); our own TeX, never a user's. */
export default function KatexSpan({ tex, display = false }: { tex: string; display?: boolean }) {
  const html = katex.renderToString(tex, { displayMode: display, throwOnError: false, strict: 'ignore', output: 'htmlAndMathml' });
  return <span className="ft-tex" data-tex={tex} dangerouslySetInnerHTML={{ __html: html }} />;
}

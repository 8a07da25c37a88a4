import { lazy, Suspense } from 'react';

// KaTeX is a chunk of its own, fetched the first time a formula is shown
const KatexSpan = lazy(() => import('./KatexSpan'));

/** A TeX formula, typeset; its readable source stands in while KaTeX loads. */
export function Tex({ tex, display = false }: { tex: string; display?: boolean }) {
  return (
    <Suspense fallback={<code className="font-mono">{tex}</code>}>
      <KatexSpan tex={tex} display={display} />
    </Suspense>
  );
}

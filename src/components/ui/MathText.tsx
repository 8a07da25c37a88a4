import { Tex } from './Tex';

/**
 * Plain text (an engine explanation) whose `$…$` parts are TeX: those are typeset, the rest is
 * shown as it is. Without a `$` nothing is loaded.
 */
export function MathText({ text }: { text: string }) {
  if (!text.includes('$')) return <>{text}</>;
  return (
    <>
      {text.split(/(\$[^$\n]+\$)/).map((part, i) => (part.length > 2 && part.startsWith('$') && part.endsWith('$') ? <Tex key={i} tex={part.slice(1, -1)} /> : part))}
    </>
  );
}

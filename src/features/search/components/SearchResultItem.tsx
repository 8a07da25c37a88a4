import { Link } from 'react-router-dom';
import type { SearchResult } from '../../../../shared/schemas/search';
import { CauseChip } from '../../../components/ui/CauseChip';
import { HighlightedText } from './HighlightedText';

const FIELD_LABELS = { title: 'Title', summary: 'Summary', narrative: 'Narrative', fix: 'Fix', lesson: 'Lesson' } as const;

/** One search result: the title (marked where it matched), the cause, and where else it matched. */
export function SearchResultItem({ result, rowProps }: { result: SearchResult; rowProps?: Record<string, unknown> }) {
  const title = result.highlights.find((h) => h.field === 'title');
  const summary = result.highlights.find((h) => h.field === 'summary');
  const snippets = result.highlights.filter((h) => h.field !== 'title' && h.field !== 'summary');
  return (
    <li className="-mx-2 flex flex-col gap-1 px-2 py-3" data-testid="search-result" {...rowProps}>
      <Link to={`/cases/${result.id}`} className="font-serif text-lg font-bold hover:underline">
        {title ? <HighlightedText text={title.text} ranges={title.ranges} /> : result.title}
      </Link>
      <p className="text-sm">{summary ? <HighlightedText text={summary.text} ranges={summary.ranges} /> : result.summary}</p>
      {snippets.map((h) => (
        <p key={h.field} className="text-sm text-muted">
          <span className="mr-1 text-xs font-semibold uppercase tracking-wide">{FIELD_LABELS[h.field]}</span>
          <HighlightedText text={h.text} ranges={h.ranges} />
        </p>
      ))}
      <span className="flex items-center gap-2 text-xs text-muted">
        <span data-testid="result-cause">
          <CauseChip cause={result.cause} />
        </span>
        <span className="font-mono" title="Relevance: words matched, and how well the case fits the symptom">
          {result.score.toFixed(2)}
        </span>
      </span>
    </li>
  );
}

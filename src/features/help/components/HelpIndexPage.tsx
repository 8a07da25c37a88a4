import { Link } from 'react-router-dom';
import { PageHeader } from '../../../components/ui/Panel';
import { Tex } from '../../../components/ui/Tex';
import { HELP_TOPICS } from '../topics/help-topics';
import type { HelpTopic } from '../topics/types';
import { HelpTopicNav } from './HelpTopicNav';

function TopicCard({ topic }: { topic: HelpTopic }) {
  const safety = topic.slug === 'safety';
  return (
    <Link
      to={`/help/${topic.slug}`}
      className={`flex flex-col gap-2 rounded-lg border bg-sheet p-4 transition hover:border-ink ${safety ? 'border-2 border-hazard' : 'border-rule'}`}
    >
      <span className={`font-serif text-lg font-bold ${safety ? 'text-hazard' : ''}`}>{topic.title}</span>
      <span className="text-sm text-muted">{topic.lead}</span>
      {topic.formulas[0] && (
        <span className="mt-auto text-sm">
          <Tex tex={topic.formulas[0].tex} />
        </span>
      )}
    </Link>
  );
}

/** `/help`: every cause the engine knows, the safety page, and how the engine decides. */
export function HelpIndexPage() {
  const causes = HELP_TOPICS.filter((t) => t.cause);
  const others = HELP_TOPICS.filter((t) => !t.cause);
  return (
    <>
      <PageHeader
        title="Help"
        lead="How each kind of lying measurement looks on the screen, the physics behind it, and how to set up the Diagnose screen to check your own."
      />
      <div className="grid gap-8 lg:grid-cols-[14rem_minmax(0,1fr)]">
        <aside className="hidden lg:block">
          <HelpTopicNav />
        </aside>
        <div className="flex flex-col gap-8">
          <section aria-labelledby="help-causes">
            <h2 id="help-causes" className="mb-3 text-xl">
              The twelve causes
            </h2>
            <div className="grid gap-4 sm:grid-cols-2 xl:grid-cols-3">
              {causes.map((t) => (
                <TopicCard key={t.slug} topic={t} />
              ))}
            </div>
          </section>
          <section aria-labelledby="help-more">
            <h2 id="help-more" className="mb-3 text-xl">
              Before you probe, and after
            </h2>
            <div className="grid gap-4 sm:grid-cols-2">
              {others.map((t) => (
                <TopicCard key={t.slug} topic={t} />
              ))}
            </div>
          </section>
        </div>
      </div>
    </>
  );
}

import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { Markdown } from '../../../components/ui/Markdown';
import { PageHeader, Panel } from '../../../components/ui/Panel';
import { helpTopic } from '../topics/help-topics';
import { diagnoseHref } from '../topics/types';
import { FormulaList } from './FormulaList';
import { HelpTopicNav } from './HelpTopicNav';

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section aria-label={title} className="flex flex-col gap-2">
      <h2 className="text-xl">{title}</h2>
      {children}
    </section>
  );
}

/** `/help/:topic`: one cause (or the safety page) from the screen to the formula and its sources. */
export function HelpTopicPage({ slug }: { slug: string | undefined }) {
  const topic = helpTopic(slug);
  if (!topic) {
    return (
      <>
        <PageHeader title="No such help page" />
        <Panel>
          <p className="text-muted">
            There is no help topic “{slug}”. <Link to="/help" className="text-agree underline">See all topics</Link>.
          </p>
        </Panel>
      </>
    );
  }
  const safety = topic.slug === 'safety';
  return (
    <>
      <PageHeader title={topic.title} lead={topic.lead} />
      <div className="grid gap-8 lg:grid-cols-[14rem_minmax(0,1fr)]">
        <aside className="order-last lg:order-first">
          <HelpTopicNav />
        </aside>
        <article className="flex min-w-0 max-w-3xl flex-col gap-7">
          {safety && (
            <p role="alert" className="rounded-md border-2 border-hazard bg-hazard-soft px-4 py-3 font-semibold text-hazard">
              Mains and hazardous voltages can kill. This page is a reminder, not training.
            </p>
          )}
          <Section title={safety ? 'When Falsetrace warns' : 'What it looks like on the screen'}>
            <Markdown math>{topic.onScreen}</Markdown>
          </Section>
          <Section title={safety ? 'Why the ground clip is dangerous' : 'Why it happens'}>
            <Markdown math>{topic.physics}</Markdown>
          </Section>
          <Section title="Formulas">
            <FormulaList formulas={topic.formulas} />
          </Section>
          {topic.example && (
            <Section title="Worked example">
              <Markdown math>{topic.example}</Markdown>
            </Section>
          )}
          <Section title={safety ? 'What to do' : 'How to fix it'}>
            <Markdown math>{topic.fix}</Markdown>
          </Section>
          {(topic.diagnose || topic.cause) && (
            <Section title="Try it">
              <div className="flex flex-wrap gap-3">
                {topic.diagnose && (
                  <Link to={diagnoseHref(topic.diagnose)} className="rounded-md border border-ink bg-ink px-4 py-2 text-sm font-semibold text-paper hover:opacity-90">
                    Open this example in Diagnose
                  </Link>
                )}
                {topic.cause && (
                  <Link to={`/cases?cause=${topic.cause}`} className="rounded-md border border-rule bg-sheet px-4 py-2 text-sm font-semibold hover:border-ink">
                    Cases with this cause
                  </Link>
                )}
              </div>
            </Section>
          )}
          <Section title="Sources">
            <ul className="list-disc space-y-1 pl-5 text-sm">
              {topic.sources.map((s) => (
                <li key={s.label}>
                  {s.label}
                  {s.note && <span className="text-muted"> — {s.note}</span>}
                </li>
              ))}
            </ul>
          </Section>
        </article>
      </div>
    </>
  );
}

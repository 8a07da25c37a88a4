import { NotBuiltPanel, PageHeader } from '../../components/ui/Panel';

/** Screens whose issues have not landed: an honest panel, reachable so the navigation is real. */
export function NotBuiltRoute({ title, what }: { title: string; what: string }) {
  return (
    <>
      <PageHeader title={title} />
      <NotBuiltPanel screen={title} what={what} />
    </>
  );
}

export function NotFoundRoute() {
  return (
    <>
      <PageHeader title="No such page" />
      <NotBuiltPanel screen="This address" what="There is no Falsetrace page here. Check the link, or start from the Bench." />
    </>
  );
}

import { MissingNotice } from '../../components/ui/page-heading';

/** What an unknown address shows; inside the shell or on its own. */
export function NotFound() {
  return (
    <>
      <title>Not found · Shedwright</title>
      <MissingNotice title="Page not found" back={{ to: '/drafts', label: 'Go to Drafts' }}>
        There is nothing at this address.
      </MissingNotice>
    </>
  );
}

export function NotFoundRoute() {
  return (
    <main className="mx-auto px-4 py-16">
      <NotFound />
    </main>
  );
}

import { isRouteErrorResponse, useRouteError } from 'react-router-dom';
import { Button } from '../components/ui/button';
import { NotFoundRoute } from './routes/not-found';

/** The last stop for anything a page threw, including a page's code failing to download. */
export function RouteError() {
  const error = useRouteError();
  if (isRouteErrorResponse(error) && error.status === 404) return <NotFoundRoute />;
  // After a new release the old page's chunks are gone; reloading fetches the new ones.
  const chunkFailed = error instanceof TypeError && /dynamically imported module|Importing a module script/i.test(error.message);
  return (
    <main role="alert" className="mx-auto flex max-w-xl flex-col gap-3 px-4 py-16">
      <title>Problem · Shedwright</title>
      <h1 className="text-2xl font-semibold">{chunkFailed ? 'Shedwright has been updated' : 'Something went wrong'}</h1>
      <p>{chunkFailed ? 'Reload the page to get the new version.' : 'This page hit a problem. Reloading usually helps; your saved work is safe on the server.'}</p>
      <div>
        <Button variant="primary" onClick={() => window.location.reload()}>
          Reload
        </Button>
      </div>
    </main>
  );
}

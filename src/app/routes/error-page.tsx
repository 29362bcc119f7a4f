import { isRouteErrorResponse, useRouteError } from 'react-router-dom';
import { BackHome, NotFoundPage } from './not-found';

/** Router error boundary: a plain message, never a stack trace. */
export function ErrorPage() {
  const error = useRouteError();
  if (isRouteErrorResponse(error) && error.status === 404) return <NotFoundPage />;
  return (
    <div className="flex min-h-screen items-center justify-center p-8">
      <div className="max-w-md" role="alert">
        <h1 className="text-2xl font-bold">Something went wrong</h1>
        <p className="mt-2 text-sm text-asphalt-muted">
          This screen hit an error. Your data is safe; reload the page, and if it keeps happening tell your
          administrator what you were doing.
        </p>
        <BackHome />
      </div>
    </div>
  );
}

import { Link } from 'react-router-dom';

export function NotFoundPage({ inline = false }: { inline?: boolean }) {
  return (
    <div className={inline ? 'py-10' : 'flex min-h-screen items-center justify-center p-8'}>
      <div className="max-w-md">
        <div className="text-sm font-bold uppercase tracking-wide text-asphalt-muted">404</div>
        <h1 className="mt-1 text-2xl font-bold">Nothing here</h1>
        <p className="mt-2 text-sm text-asphalt-muted">
          This page does not exist, or it belongs to an agency you are not a member of.
        </p>
        <BackHome />
      </div>
    </div>
  );
}

/** The way out of a page that cannot be shown. */
export function BackHome() {
  return (
    <Link to="/" className="mt-4 inline-block text-sm font-semibold text-accent hover:underline">
      Back to your network
    </Link>
  );
}

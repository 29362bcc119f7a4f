import { Card, PageHeader } from './ui/page';

/** Honest placeholder for an area that a later piece of work will fill. */
export function NotBuiltYet({ title, what }: { title: string; what: string }) {
  return (
    <div>
      <PageHeader title={title} />
      <Card>
        <p className="text-sm">
          <strong>Not built yet.</strong> {what}
        </p>
      </Card>
    </div>
  );
}

import { NotBuiltYet } from '@/components/not-built-yet';

const AREAS: Record<string, { title: string; what: string }> = {
  activity: { title: 'Activity', what: 'Changes are already recorded in the audit trail; the screen to read and export it comes with the audit work.' },
};

export function PlaceholderPage({ area }: { area: keyof typeof AREAS }) {
  const a = AREAS[area];
  return <NotBuiltYet title={a.title} what={a.what} />;
}

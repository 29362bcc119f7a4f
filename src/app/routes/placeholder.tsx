import { NotBuiltYet } from '@/components/not-built-yet';

const AREAS: Record<string, { title: string; what: string }> = {
  forecast: { title: 'Forecast', what: "Deterioration curves fitted to the agency's own surveys come with the budget-plan work." },
  plans: { title: 'Plans', what: 'Multi-year budget scenarios, their results and the council brief come with the budget-plan work.' },
  activity: { title: 'Activity', what: 'Changes are already recorded in the audit trail; the screen to read and export it comes with the audit work.' },
};

export function PlaceholderPage({ area }: { area: keyof typeof AREAS }) {
  const a = AREAS[area];
  return <NotBuiltYet title={a.title} what={a.what} />;
}

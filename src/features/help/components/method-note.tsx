import type { PlanSettingsInput } from '@shared/schemas/plans';

type Method = PlanSettingsInput['method'];

/** One line on what each plan method does, in plain words, for beside its name. */
export const PLAN_METHOD_NOTES: Record<Method, { name: string; note: string }> = {
  exact: {
    name: 'Exact',
    note: 'Solves the whole choice as one integer program (HiGHS): the best result the budgets allow, proved; up to 20,000 candidate treatments.',
  },
  fast: {
    name: 'Fast',
    note: 'Prices each year’s budget, picks the best work at those prices and repairs what overspends; near-best in seconds, with its gap to a proved bound shown.',
  },
  ranking: {
    name: 'Worst-first',
    note: 'Treats roads in order of condition, worst first, while money lasts: the common practice, shown as a yardstick.',
  },
};

export function MethodNote({ method, className = '' }: { method: Method; className?: string }) {
  return (
    <span className={`text-xs text-asphalt-muted ${className}`} data-testid={`method-note-${method}`}>
      {PLAN_METHOD_NOTES[method].note}
    </span>
  );
}

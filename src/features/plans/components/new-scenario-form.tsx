import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { toast } from 'sonner';
import { Button } from '@/components/ui/button';
import { TextInput } from '@/components/ui/field';
import { Card } from '@/components/ui/page';
import { useCreatePlan } from '@/features/plans/api/create-plan';
import { BudgetInput } from './budget-input';
import { money } from './money';

export function NewScenarioForm({ agencyId }: { agencyId: string }) {
  const create = useCreatePlan(agencyId);
  const navigate = useNavigate();
  const [name, setName] = useState('');
  const [budget, setBudget] = useState<number | null>(2_400_000);
  const year = new Date().getFullYear() + 1;
  return (
    <Card title="New scenario">
      <form
        className="flex flex-wrap items-end gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          if (budget === null) {
            toast.error('Annual budget must be a dollar amount, like $250,000, 250k or 1.85M');
            return;
          }
          create.mutate(
            {
              name: name || `${money(budget)} a year`,
              settings: {
                startYear: year,
                horizonYears: 10,
                budgetMode: 'flat',
                annualBudget: budget,
                escalationPct: 0,
                minNetworkPci: null,
                method: 'fast',
                weighting: 'lane-miles',
                treatmentIds: [],
                needsWorkBelow: 71,
              },
            },
            { onSuccess: (p) => navigate(p.id), onError: (err) => toast.error(err.message) },
          );
        }}
      >
        <label className="text-sm">
          <span className="block text-xs text-asphalt-muted">Name</span>
          <TextInput
            aria-label="Scenario name"
            className="w-64"
            placeholder="e.g. Council ask, $2.4M"
            value={name}
            onChange={(e) => setName(e.target.value)}
          />
        </label>
        <label className="text-sm">
          <span className="block text-xs text-asphalt-muted">Annual budget ($250,000, 1.85M …)</span>
          <BudgetInput label="Annual budget" className="w-40" value={budget ?? undefined} onChange={setBudget} />
        </label>
        <Button type="submit" disabled={create.isPending}>
          Create scenario
        </Button>
        <span className="text-xs text-asphalt-muted">
          {year}–{year + 9}, flat budget, fast method; change anything on the next screen.
        </span>
      </form>
    </Card>
  );
}

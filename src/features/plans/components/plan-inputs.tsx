import { budgetsOf } from '@shared/schemas/plans';
import { Select, TextInput } from '@/components/ui/field';
import { Card } from '@/components/ui/page';
import { useCatalog } from '@/features/catalog/api/get-catalog';
import { MethodNote, PLAN_METHOD_NOTES } from '@/features/help/components/method-note';
import type { PlanSettings } from '@/features/plans/api/keys';
import { BudgetInput } from './budget-input';
import { money } from './money';
import { PlanGoals } from './plan-goals';

export type PlanDraft = { name: string; settings: PlanSettings };

const KIND_WORDS = { thin_overlay: 'thin overlays', mill_and_overlay: 'mill-and-overlays' } as const;

/** The plan's inputs, edited in place; the page keeps the draft so "Run the plan" can send it. */
export function PlanInputs({
  agencyId,
  value,
  onChange,
  disabled = false,
}: {
  agencyId: string;
  value: PlanDraft;
  onChange: (v: PlanDraft) => void;
  disabled?: boolean;
}) {
  const catalog = useCatalog(agencyId);
  const s = value.settings;
  const budgets = budgetsOf(s);
  const set = (patch: Partial<PlanSettings>) => onChange({ ...value, settings: { ...s, ...patch } });
  const mixes = catalog.data?.mixes ?? [];
  const policy = s.mixPolicy ?? null;
  return (
    <Card title="Inputs">
      <fieldset disabled={disabled} className="space-y-3">
        <div className="grid grid-cols-2 gap-3 text-sm md:grid-cols-4">
          <label className="col-span-2">
            <span className="block text-xs text-asphalt-muted">Scenario name</span>
            <TextInput
              aria-label="Plan name"
              value={value.name}
              onChange={(e) => onChange({ ...value, name: e.target.value })}
            />
          </label>
          <label>
            <span className="block text-xs text-asphalt-muted">Start year</span>
            <TextInput
              aria-label="Start year"
              type="number"
              value={s.startYear}
              onChange={(e) => set({ startYear: Number(e.target.value) })}
            />
          </label>
          <label>
            <span className="block text-xs text-asphalt-muted">Horizon (1–20 yr)</span>
            <TextInput
              aria-label="Horizon"
              type="number"
              min={1}
              max={20}
              value={s.horizonYears}
              onChange={(e) =>
                set({
                  horizonYears: Number(e.target.value),
                  budgets:
                    s.budgetMode === 'custom'
                      ? Array.from({ length: Number(e.target.value) }, (_, i) => s.budgets?.[i] ?? s.budgets?.[0] ?? 0)
                      : s.budgets,
                })
              }
            />
          </label>
          <label>
            <span className="block text-xs text-asphalt-muted">Budget</span>
            <Select
              aria-label="Budget mode"
              value={s.budgetMode}
              onChange={(e) =>
                set({
                  budgetMode: e.target.value as PlanSettings['budgetMode'],
                  budgets: e.target.value === 'custom' ? budgets : s.budgets,
                  annualBudget: s.annualBudget ?? budgets[0],
                })
              }
            >
              <option value="flat">flat</option>
              <option value="escalating">escalating</option>
              <option value="custom">typed per year</option>
            </Select>
          </label>
          {s.budgetMode !== 'custom' && (
            <label>
              <span className="block text-xs text-asphalt-muted">Annual budget ($250,000, 1.85M …)</span>
              <BudgetInput
                label="Annual budget"
                value={s.annualBudget}
                onChange={(v) => v !== null && set({ annualBudget: v })}
              />
            </label>
          )}
          {s.budgetMode === 'escalating' && (
            <label>
              <span className="block text-xs text-asphalt-muted">Escalation (% a year)</span>
              <TextInput
                aria-label="Escalation"
                type="number"
                step={0.5}
                value={s.escalationPct}
                onChange={(e) => set({ escalationPct: Number(e.target.value) })}
              />
            </label>
          )}
          <label>
            <span className="block text-xs text-asphalt-muted">Benefit weighting</span>
            <Select
              aria-label="Weighting"
              value={s.weighting}
              onChange={(e) => set({ weighting: e.target.value as PlanSettings['weighting'] })}
            >
              <option value="lane-miles">lane-miles</option>
              <option value="lane-miles-traffic">lane-miles × log traffic</option>
            </Select>
          </label>
          <label>
            <span className="block text-xs text-asphalt-muted">Minimum network PCI</span>
            <TextInput
              aria-label="Minimum network PCI"
              type="number"
              min={0}
              max={100}
              value={s.minNetworkPci ?? ''}
              onChange={(e) => set({ minNetworkPci: e.target.value === '' ? null : Number(e.target.value) })}
            />
          </label>
        </div>
        <fieldset className="text-sm" data-testid="method-choice">
          <legend className="text-xs text-asphalt-muted">Method</legend>
          <div className="grid gap-1 md:grid-cols-3">
            {(['fast', 'exact', 'ranking'] as const).map((m) => (
              <label key={m} className="flex items-start gap-2 rounded border border-asphalt-line/60 p-2">
                <input
                  type="radio"
                  name="plan-method"
                  className="mt-1"
                  checked={s.method === m}
                  onChange={() => set({ method: m })}
                />
                <span>
                  <span className="block font-semibold">{PLAN_METHOD_NOTES[m].name}</span>
                  <MethodNote method={m} className="block" />
                </span>
              </label>
            ))}
          </div>
        </fieldset>
        <div className="overflow-x-auto">
          <table className="num text-sm" data-testid="budget-row">
            <tbody>
              <tr>
                {budgets.map((_, i) => (
                  <th key={i} className="px-1 text-xs font-normal text-asphalt-muted">
                    {s.startYear + i}
                  </th>
                ))}
              </tr>
              <tr>
                {budgets.map((b, i) => (
                  <td key={i} className="px-1">
                    {s.budgetMode === 'custom' ? (
                      <BudgetInput
                        label={`Budget ${s.startYear + i}`}
                        className="w-28"
                        value={b}
                        onChange={(v) => v !== null && set({ budgets: budgets.map((x, k) => (k === i ? v : x)) })}
                      />
                    ) : (
                      <span className="block w-24 text-right text-xs">{money(b)}</span>
                    )}
                  </td>
                ))}
              </tr>
            </tbody>
          </table>
        </div>
        <PlanGoals s={s} set={set} />
        <fieldset className="text-sm" data-testid="mix-policy">
          <legend className="text-xs text-asphalt-muted">Mix policy</legend>
          <label className="flex items-center gap-2">
            <input
              type="checkbox"
              aria-label="Use one mix and lift"
              checked={!!policy}
              onChange={(e) =>
                set({
                  mixPolicy: e.target.checked
                    ? {
                        kinds: ['thin_overlay'],
                        mixId: (mixes.find((m) => /rubber/i.test(m.name)) ?? mixes[0])?.id ?? '',
                        thicknessIn: 1.5,
                      }
                    : null,
                })
              }
            />
            Overlays in this scenario use one catalog mix at one lift (otherwise each treatment’s own mix)
          </label>
          {policy && (
            <div className="mt-2 flex flex-wrap items-end gap-3">
              {(['thin_overlay', 'mill_and_overlay'] as const).map((k) => (
                <label key={k} className="flex items-center gap-1">
                  <input
                    type="checkbox"
                    checked={policy.kinds.includes(k)}
                    onChange={(e) =>
                      set({
                        mixPolicy: {
                          ...policy,
                          kinds: e.target.checked ? [...policy.kinds, k] : policy.kinds.filter((x) => x !== k),
                        },
                      })
                    }
                  />
                  {KIND_WORDS[k]}
                </label>
              ))}
              <label>
                <span className="block text-xs text-asphalt-muted">Mix</span>
                <Select
                  aria-label="Policy mix"
                  value={policy.mixId}
                  onChange={(e) => set({ mixPolicy: { ...policy, mixId: e.target.value } })}
                >
                  {mixes.map((m) => (
                    <option key={m.id} value={m.id}>
                      {m.name}
                    </option>
                  ))}
                </Select>
              </label>
              <label>
                <span className="block text-xs text-asphalt-muted">Lift (in)</span>
                <TextInput
                  aria-label="Policy lift"
                  type="number"
                  step={0.25}
                  min={0.5}
                  max={6}
                  className="w-24"
                  value={policy.thicknessIn}
                  onChange={(e) => set({ mixPolicy: { ...policy, thicknessIn: Number(e.target.value) } })}
                />
              </label>
            </div>
          )}
        </fieldset>
        <fieldset className="text-sm">
          <legend className="text-xs text-asphalt-muted">Treatments the plan may use (none ticked = all)</legend>
          <div className="flex flex-wrap gap-3">
            {catalog.data?.treatments.map((t) => (
              <label key={t.id} className="flex items-center gap-1">
                <input
                  type="checkbox"
                  checked={s.treatmentIds.includes(t.id)}
                  onChange={(e) =>
                    set({
                      treatmentIds: e.target.checked
                        ? [...s.treatmentIds, t.id]
                        : s.treatmentIds.filter((x) => x !== t.id),
                    })
                  }
                />
                {t.name}
              </label>
            ))}
          </div>
        </fieldset>
      </fieldset>
    </Card>
  );
}

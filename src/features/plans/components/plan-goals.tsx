import { FUNCTIONAL_CLASSES, type FunctionalClass } from '@shared/schemas/segments';
import { Select, TextInput } from '@/components/ui/field';
import type { PlanSettings } from '@/features/plans/api/keys';
import { CLASS_LABELS } from '@/lib/format';

type Targets = NonNullable<PlanSettings['targets']>;
const NO_TARGETS: Targets = { minNetworkPci: null, classFloors: [], goodOrBetterPct: null };
const numOrNull = (v: string) => (v.trim() === '' ? null : Number(v));

/**
 * What the plan aims at: the objective, the condition targets beyond the network minimum, and how
 * strategies are built. Every field here reaches the run (tests/api/plan-settings.test.ts).
 */
export function PlanGoals({ s, set }: { s: PlanSettings; set: (patch: Partial<PlanSettings>) => void }) {
  const targets = s.targets ?? NO_TARGETS;
  const setTargets = (patch: Partial<Targets>) => set({ targets: { ...targets, ...patch } });
  const floors = targets.classFloors;
  const unused = FUNCTIONAL_CLASSES.filter((c) => !floors.some((f) => f.functionalClass === c));
  return (
    <fieldset className="space-y-2 text-sm" data-testid="plan-goals">
      <legend className="text-xs text-asphalt-muted">What the plan aims at</legend>
      <div className="flex flex-wrap gap-4">
        <label className="flex items-center gap-2">
          <input
            type="radio"
            name="plan-objective"
            checked={(s.objective ?? 'benefit') === 'benefit'}
            onChange={() => set({ objective: 'benefit' })}
          />
          Most condition for the money (within each year’s budget)
        </label>
        <label className="flex items-center gap-2">
          <input
            type="radio"
            name="plan-objective"
            checked={s.objective === 'cost'}
            onChange={() => set({ objective: 'cost' })}
          />
          Least life-cycle cost that meets the targets
        </label>
      </div>
      <div className="grid grid-cols-2 gap-3 md:grid-cols-4">
        <label>
          <span className="block text-xs text-asphalt-muted">Lane-miles in good or better (% each year)</span>
          <TextInput
            aria-label="Share in good or better"
            type="number"
            min={0}
            max={100}
            value={targets.goodOrBetterPct ?? ''}
            onChange={(e) => setTargets({ goodOrBetterPct: numOrNull(e.target.value) })}
          />
        </label>
        <label>
          <span className="block text-xs text-asphalt-muted">Strategies per road (1–200)</span>
          <TextInput
            aria-label="Strategies per road"
            type="number"
            min={1}
            max={200}
            value={s.maxStrategiesPerSegment ?? 24}
            onChange={(e) => set({ maxStrategiesPerSegment: Number(e.target.value) })}
          />
        </label>
        <label>
          <span className="block text-xs text-asphalt-muted">Benefit counted past the horizon (years)</span>
          <TextInput
            aria-label="Benefit tail"
            type="number"
            min={0}
            max={30}
            value={s.benefitTailYears ?? 10}
            onChange={(e) => set({ benefitTailYears: Number(e.target.value) })}
          />
        </label>
        <label className="flex items-end gap-2">
          <input
            type="checkbox"
            aria-label="Allow thin lifts on a weak base"
            checked={s.allowThinOnWeakBase ?? false}
            onChange={(e) => set({ allowThinOnWeakBase: e.target.checked })}
          />
          <span>Allow thin lifts where the structural check flags the base (each such item says so)</span>
        </label>
      </div>
      <div>
        <span className="block text-xs text-asphalt-muted">No road of a class below a PCI, in any year</span>
        <ul className="space-y-1">
          {floors.map((f, i) => (
            <li key={f.functionalClass} className="flex items-center gap-2">
              <span className="w-40">{CLASS_LABELS[f.functionalClass]}</span>
              <TextInput
                aria-label={`Lowest PCI for ${CLASS_LABELS[f.functionalClass]}`}
                type="number"
                min={0}
                max={100}
                className="w-24"
                value={f.minPci}
                onChange={(e) =>
                  setTargets({
                    classFloors: floors.map((x, k) => (k === i ? { ...x, minPci: Number(e.target.value) } : x)),
                  })
                }
              />
              <button
                type="button"
                className="text-xs underline"
                onClick={() => setTargets({ classFloors: floors.filter((_, k) => k !== i) })}
              >
                remove
              </button>
            </li>
          ))}
        </ul>
        {unused.length > 0 && (
          <Select
            aria-label="Add a class floor"
            className="mt-1 w-56"
            value=""
            onChange={(e) =>
              e.target.value &&
              setTargets({
                classFloors: [...floors, { functionalClass: e.target.value as FunctionalClass, minPci: 40 }],
              })
            }
          >
            <option value="">Add a floor for a class…</option>
            {unused.map((c) => (
              <option key={c} value={c}>
                {CLASS_LABELS[c]}
              </option>
            ))}
          </Select>
        )}
      </div>
      <p className="text-xs text-asphalt-muted">
        Floors and shares are planning targets: where the budget cannot meet them the exact method says so and the fast
        and worst-first methods name the targets they miss.
      </p>
    </fieldset>
  );
}

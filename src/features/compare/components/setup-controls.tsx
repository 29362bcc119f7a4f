import type { Catalog } from '@shared/schemas/catalog';
import { Button } from '@/components/ui/button';
import { Select, TextInput } from '@/components/ui/field';
import type { ComparePage } from '../hooks/use-compare-page';
import { AlternativeCard } from './alternative-card';

/** The alternatives, the baseline and the number of Monte Carlo draws. */
export function SetupControls({ page, catalog }: { page: ComparePage; catalog: Catalog }) {
  const alts = page.alts ?? [];
  const setAlt = (i: number, s: (typeof alts)[number]) => page.setAlts(alts.map((a, k) => (k === i ? s : a)));
  return (
    <>
      {alts.map((a, i) => (
        <AlternativeCard
          key={i}
          index={i}
          spec={a}
          catalog={catalog}
          onChange={(s) => setAlt(i, s)}
          onRemove={alts.length > 2 ? () => page.setAlts(alts.filter((_, k) => k !== i)) : undefined}
        />
      ))}
      <div className="flex flex-wrap items-center gap-2 text-sm">
        {alts.length < 6 && (
          <Button
            variant="secondary"
            onClick={() =>
              page.setAlts([...alts, { ...alts[alts.length - 1], name: `Alternative ${alts.length + 1}` }])
            }
          >
            Add alternative
          </Button>
        )}
        <label className="flex items-center gap-1">
          Baseline
          <Select
            aria-label="Baseline"
            className="w-44"
            value={page.baseline}
            onChange={(e) => page.setBaseline(Number(e.target.value))}
          >
            {alts.map((a, i) => (
              <option key={i} value={i}>
                {a.name}
              </option>
            ))}
          </Select>
        </label>
        <label className="flex items-center gap-1">
          Monte Carlo draws
          <TextInput
            aria-label="Iterations"
            type="number"
            min={100}
            max={20000}
            step={500}
            className="w-24"
            value={page.iterations}
            onChange={(e) => page.setIterations(Number(e.target.value))}
          />
        </label>
      </div>
    </>
  );
}

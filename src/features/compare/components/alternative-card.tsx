import type { Catalog } from '@shared/schemas/catalog';
import { OVERLAY_KINDS } from '@shared/schemas/catalog';
import { millDepthFor } from '@shared/engine/lcca/costing';
import type { AlternativeSpec, Step } from '@shared/schemas/comparisons';
import { Select, TextInput } from '@/components/ui/field';
import { autoName } from '../lib/default-alternatives';
import { ALT_COLORS } from './charts';

type Props = {
  index: number;
  spec: AlternativeSpec;
  catalog: Catalog;
  onChange: (s: AlternativeSpec) => void;
  onRemove?: () => void;
};

const isOverlay = (catalog: Catalog, treatmentId: string) => {
  const t = catalog.treatments.find((x) => x.id === treatmentId);
  return !!t && (OVERLAY_KINDS as readonly string[]).includes(t.kind);
};

function StepEditor({
  step,
  catalog,
  onChange,
  label,
  testId,
}: {
  step: Step;
  catalog: Catalog;
  onChange: (s: Step) => void;
  label: string;
  testId: string;
}) {
  const t = catalog.treatments.find((x) => x.id === step.treatmentId);
  const overlay = isOverlay(catalog, step.treatmentId);
  const mixId = step.mixId ?? t?.mixId ?? '';
  const mix = catalog.mixes.find((m) => m.id === mixId);
  return (
    <div className="grid grid-cols-[1fr_1fr] gap-2 text-sm" data-testid={testId}>
      <label className="col-span-2">
        <span className="text-xs text-asphalt-muted">{label}</span>
        <Select
          aria-label={`${label} treatment`}
          value={step.treatmentId}
          onChange={(e) => onChange({ treatmentId: e.target.value })}
        >
          {catalog.treatments.map((x) => (
            <option key={x.id} value={x.id}>
              {x.name}
            </option>
          ))}
        </Select>
      </label>
      {overlay && (
        <>
          <label>
            <span className="text-xs text-asphalt-muted">Mix</span>
            <Select
              aria-label={`${label} mix`}
              value={mixId}
              onChange={(e) =>
                onChange({
                  ...step,
                  mixId: e.target.value,
                  thicknessIn: catalog.mixes.find((m) => m.id === e.target.value)?.refLiftIn ?? null,
                })
              }
            >
              {catalog.mixes.map((m) => (
                <option key={m.id} value={m.id}>
                  {m.name}
                </option>
              ))}
            </Select>
          </label>
          <label>
            <span className="text-xs text-asphalt-muted">
              Lift (in){mix ? ` ${mix.minLiftIn}–${mix.maxLiftIn}` : ''}
            </span>
            <TextInput
              aria-label={`${label} thickness`}
              type="number"
              step="0.25"
              min={mix?.minLiftIn}
              max={mix?.maxLiftIn}
              value={step.thicknessIn ?? t?.defaultThicknessIn ?? ''}
              onChange={(e) =>
                onChange({ ...step, mixId, thicknessIn: e.target.value === '' ? null : Number(e.target.value) })
              }
            />
            {t && t.millDepthIn > 0 && (
              <span className="mt-0.5 block text-xs text-asphalt-muted" data-testid={`${testId}-mill`}>
                mills {Number(millDepthFor(t, step.thicknessIn ?? t.defaultThicknessIn ?? 0).toFixed(2))} in first
                (follows the lift)
              </span>
            )}
          </label>
        </>
      )}
      <label className="col-span-2">
        <span className="text-xs text-asphalt-muted">
          Service life (yr) — blank uses the catalog{t?.lifeYears === null && mix ? ' (by mix and lift)' : ''}
        </span>
        <TextInput
          aria-label={`${label} life`}
          type="number"
          step="1"
          min={1}
          value={step.serviceLifeYears ?? ''}
          placeholder={t?.lifeYears ? String(t.lifeYears) : mix ? `≈ ${mix.refLifeYears} at ${mix.refLiftIn} in` : ''}
          onChange={(e) =>
            onChange({ ...step, serviceLifeYears: e.target.value === '' ? null : Number(e.target.value) })
          }
        />
      </label>
    </div>
  );
}

export function AlternativeCard({ index, spec, catalog, onChange, onRemove }: Props) {
  const crackSeal = catalog.treatments.find((t) => t.kind === 'crack_seal');
  return (
    <section
      className="rounded border border-asphalt-line bg-white p-3"
      data-testid={`alternative-${index}`}
      style={{ borderLeft: `4px solid ${ALT_COLORS[index % ALT_COLORS.length]}` }}
    >
      <div className="mb-2 flex items-center gap-2">
        <TextInput
          aria-label={`Alternative ${index + 1} name`}
          className="font-semibold"
          value={spec.name}
          onChange={(e) => onChange({ ...spec, name: e.target.value })}
        />
        {onRemove && (
          <button
            type="button"
            className="text-xs text-asphalt-muted hover:text-band-failed"
            onClick={onRemove}
            aria-label={`Remove alternative ${index + 1}`}
          >
            Remove
          </button>
        )}
      </div>
      <StepEditor
        label="Initial treatment (year 0)"
        testId={`alt-${index}-initial`}
        step={spec.initial}
        catalog={catalog}
        onChange={(initial) =>
          onChange({
            ...spec,
            initial,
            name: spec.name === autoName(catalog, spec.initial) ? autoName(catalog, initial) : spec.name,
          })
        }
      />
      <div className="mt-2 space-y-1 text-sm">
        <label className="flex items-center gap-2">
          <input
            type="checkbox"
            checked={spec.repeatAtEndOfLife}
            onChange={(e) => onChange({ ...spec, repeatAtEndOfLife: e.target.checked })}
          />
          Repeat at the end of each life
        </label>
        {spec.repeatAtEndOfLife && (
          <div className="pl-6">
            {spec.rehabilitation.length === 0 ? (
              <button
                type="button"
                className="text-xs text-accent hover:underline"
                onClick={() => onChange({ ...spec, rehabilitation: [{ ...spec.initial }] })}
              >
                Use a different treatment after the first life
              </button>
            ) : (
              <>
                <StepEditor
                  label="Then, at each end of life"
                  testId={`alt-${index}-rehab`}
                  step={spec.rehabilitation[0]}
                  catalog={catalog}
                  onChange={(s) => onChange({ ...spec, rehabilitation: [s] })}
                />
                <button
                  type="button"
                  className="text-xs text-asphalt-muted hover:underline"
                  onClick={() => onChange({ ...spec, rehabilitation: [] })}
                >
                  Repeat the initial treatment instead
                </button>
              </>
            )}
          </div>
        )}
        {spec.maintenance.map((m, j) => (
          <div key={j} className="flex items-center gap-2">
            <Select
              aria-label={`Maintenance ${j + 1}`}
              className="w-40"
              value={m.treatmentId}
              onChange={(e) =>
                onChange({
                  ...spec,
                  maintenance: spec.maintenance.map((x, k) => (k === j ? { ...x, treatmentId: e.target.value } : x)),
                })
              }
            >
              {catalog.treatments
                .filter((t) => t.category === 'preservation')
                .map((t) => (
                  <option key={t.id} value={t.id}>
                    {t.name}
                  </option>
                ))}
            </Select>
            every
            <TextInput
              aria-label={`Maintenance ${j + 1} interval`}
              type="number"
              min={1}
              className="w-16"
              value={m.everyYears}
              onChange={(e) =>
                onChange({
                  ...spec,
                  maintenance: spec.maintenance.map((x, k) =>
                    k === j ? { ...x, everyYears: Number(e.target.value) || 1 } : x,
                  ),
                })
              }
            />
            yr
            <button
              type="button"
              className="text-xs text-asphalt-muted hover:text-band-failed"
              onClick={() => onChange({ ...spec, maintenance: spec.maintenance.filter((_, k) => k !== j) })}
            >
              ×
            </button>
          </div>
        ))}
        {crackSeal && spec.maintenance.length < 2 && (
          <button
            type="button"
            className="text-xs text-accent hover:underline"
            onClick={() =>
              onChange({ ...spec, maintenance: [...spec.maintenance, { treatmentId: crackSeal.id, everyYears: 4 }] })
            }
          >
            + maintenance cycle
          </button>
        )}
      </div>
    </section>
  );
}

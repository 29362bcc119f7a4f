import { useId } from 'react';
import {
  COST_BASIS_LABELS,
  type CostItem,
  type Mix,
  type Treatment,
  TREATMENT_KIND_LABELS,
  TreatmentInputSchema,
} from '@shared/schemas/catalog';
import { numberFrom } from '@/components/ui/form-errors';
import { useUpdateTreatment } from '../api/update-treatment';
import { appliesText, classesText, costItemText, effectText, lifeText, surfacesText } from '../lib/labels';
import { today } from '../lib/today';
import { useRowEdit } from '../lib/use-row-edit';
import { DemoTag } from './demo-tag';
import { EditPanel, effectiveDateField, PriceCells } from './edit-panel';

type Draft = { amounts: string[]; date: string };

// Percent add-ons are typed in percent and stored as fractions.
const shown = (c: CostItem) => String(c.basis === 'percent' ? +(c.amount * 100).toFixed(6) : c.amount);
const stored = (c: CostItem, raw: string) => (c.basis === 'percent' ? numberFrom(raw) / 100 : numberFrom(raw));
const unit = (c: CostItem) => (c.basis === 'percent' ? '%' : `$ ${COST_BASIS_LABELS[c.basis]}`);

export function TreatmentRow({
  t,
  mixes,
  columns,
  canEdit,
  agencyId,
}: {
  t: Treatment;
  mixes: Mix[];
  columns: number;
  canEdit: boolean;
  agencyId: string;
}) {
  const id = useId();
  const save = useUpdateTreatment(agencyId);
  const mix = mixes.find((m) => m.id === t.mixId);
  const { id: treatmentId, isDemo: _demo, ...current } = t;
  const edit = useRowEdit({
    schema: TreatmentInputSchema,
    start: (): Draft => ({ amounts: t.costItems.map(shown), date: today() }),
    toValue: (d) => ({
      ...current,
      costItems: t.costItems.map((c, i) => ({ ...c, amount: stored(c, d.amounts[i]) })),
      priceEffectiveDate: d.date,
    }),
    mutate: (input, cb) => save.mutate({ id: treatmentId, input }, cb),
    savedMessage: (input) => `${t.name} saved; its prices take effect on ${input.priceEffectiveDate}`,
  });
  const { draft, open, change } = edit;
  return (
    <>
      <tr className="border-t border-asphalt-line/60 align-top">
        <td className="py-1.5 font-semibold">
          {t.name}
          <DemoTag show={t.isDemo} />
        </td>
        <td>
          {TREATMENT_KIND_LABELS[t.kind]}
          <div className="text-xs text-asphalt-muted">{t.category}</div>
        </td>
        <td>
          {mix && (
            <div>
              {mix.name}, {t.defaultThicknessIn} in{t.millDepthIn ? `, milled ${t.millDepthIn} in` : ''}
            </div>
          )}
          {t.costItems.map((c, i) => (
            <div key={`${c.label}-${i}`} className="text-xs">
              {costItemText(c)}
            </div>
          ))}
        </td>
        <td className="text-right">{lifeText(t.lifeYears)}</td>
        <td>{effectText(t.effect)}</td>
        <td className="text-xs">
          {appliesText(t.applicability)}
          <div className="text-asphalt-muted">
            {surfacesText(t.applicability)}; {classesText(t.applicability)}
          </div>
        </td>
        <PriceCells item={t} canEdit={canEdit} editing={!!draft} label="Change prices" onOpen={open} />
      </tr>
      {draft && (
        <EditPanel
          id={id}
          colSpan={columns}
          itemName={t.name}
          fields={[
            ...t.costItems.map((c, i) => ({
              key: `costItems.${i}.amount`,
              label: `${c.label} (${unit(c)})`,
              value: draft.amounts[i],
              onChange: (v: string) =>
                change(`costItems.${i}.amount`, (d) => ({ ...d, amounts: d.amounts.map((x, k) => (k === i ? v : x)) })),
            })),
            effectiveDateField('priceEffectiveDate', draft.date, (v) =>
              change('priceEffectiveDate', (d) => ({ ...d, date: v })),
            ),
          ]}
          edit={edit}
          saving={save.isPending}
        />
      )}
    </>
  );
}

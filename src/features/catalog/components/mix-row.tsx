import { useId } from 'react';
import { type Mix, MixInputSchema, MODIFIER_LABELS } from '@shared/schemas/catalog';
import { numberFrom } from '@/components/ui/form-errors';
import { fmt2, fmtMoney } from '@/lib/format';
import { useUpdateMix } from '../api/update-mix';
import { today } from '../lib/today';
import { useRowEdit } from '../lib/use-row-edit';
import { DemoTag } from './demo-tag';
import { EditPanel, effectiveDateField, PriceCells } from './edit-panel';

type Draft = { pricePerTon: string; refLifeYears: string; priceEffectiveDate: string };

export function MixRow({
  m,
  columns,
  canEdit,
  agencyId,
}: {
  m: Mix;
  columns: number;
  canEdit: boolean;
  agencyId: string;
}) {
  const id = useId();
  const save = useUpdateMix(agencyId);
  const { id: mixId, isDemo: _demo, ...current } = m;
  const edit = useRowEdit({
    schema: MixInputSchema,
    start: (): Draft => ({
      pricePerTon: String(m.pricePerTon),
      refLifeYears: String(m.refLifeYears),
      priceEffectiveDate: today(),
    }),
    toValue: (d) => ({
      ...current,
      pricePerTon: numberFrom(d.pricePerTon),
      refLifeYears: numberFrom(d.refLifeYears),
      priceEffectiveDate: d.priceEffectiveDate,
    }),
    mutate: (input, cb) => save.mutate({ id: mixId, input }, cb),
    savedMessage: (input) => `${m.name} saved; its price takes effect on ${input.priceEffectiveDate}`,
  });
  const { draft, open } = edit;
  const field = (key: keyof Draft) => (v: string) => edit.change(key, (d) => ({ ...d, [key]: v }));
  return (
    <>
      <tr className="border-t border-asphalt-line/60 align-top">
        <td className="py-1.5 font-semibold">
          {m.name}
          <DemoTag show={m.isDemo} />
        </td>
        <td className="whitespace-nowrap">{m.binderGrade}</td>
        <td>{MODIFIER_LABELS[m.modifier]}</td>
        <td className="text-right">{fmtMoney(m.pricePerTon)}</td>
        <td className="text-right">{m.spreadRateLbPerSyIn}</td>
        <td className="text-right whitespace-nowrap">
          {fmt2(m.minLiftIn)}–{fmt2(m.maxLiftIn)}
        </td>
        <td className="text-right whitespace-nowrap">{`${m.refLifeYears} yr at ${m.refLiftIn} in`}</td>
        <PriceCells item={m} canEdit={canEdit} editing={!!draft} label="Change price" onOpen={open} />
      </tr>
      {draft && (
        <EditPanel
          id={id}
          colSpan={columns}
          itemName={m.name}
          fields={[
            { key: 'pricePerTon', label: 'Price ($/ton)', value: draft.pricePerTon, onChange: field('pricePerTon') },
            {
              key: 'refLifeYears',
              label: `Life at ${m.refLiftIn} in (yr)`,
              value: draft.refLifeYears,
              onChange: field('refLifeYears'),
            },
            effectiveDateField('priceEffectiveDate', draft.priceEffectiveDate, field('priceEffectiveDate')),
          ]}
          edit={edit}
          saving={save.isPending}
        />
      )}
    </>
  );
}

import { Button } from '@/components/ui/button';
import { CheckedInput } from '@/components/ui/field-message';
import type { RowEdit } from '../lib/use-row-edit';

export type EditField = {
  key: string;
  label: string;
  value: string;
  onChange: (v: string) => void;
  type?: 'text' | 'date';
  className?: string;
};

/** The date a row's new prices take effect. */
export const effectiveDateField = (key: string, value: string, onChange: (v: string) => void): EditField => ({
  key,
  label: 'Takes effect',
  type: 'date',
  className: 'w-40',
  value,
  onChange,
});

/**
 * The form under a catalog row: its fields in a line, each with its message,
 * then Save and Cancel, and beside them what no field shows.
 */
export function EditPanel({
  id,
  colSpan,
  itemName,
  fields,
  edit,
  saving,
}: {
  id: string;
  colSpan: number;
  itemName: string;
  fields: EditField[];
  edit: Pick<RowEdit, 'form' | 'submit' | 'cancel'>;
  saving: boolean;
}) {
  const { form, submit, cancel } = edit;
  const others = form.othersExcept(fields.map((f) => f.key));
  return (
    <tr className="bg-paper">
      <td colSpan={colSpan} className="py-2">
        <fieldset
          className="m-0 flex min-w-0 flex-wrap items-start gap-3 border-0 p-0"
          aria-label={`Change ${itemName}`}
        >
          {fields.map((f) => (
            <CheckedInput
              key={f.key}
              id={`${id}-${f.key}`}
              label={f.label}
              name={`${f.label} — ${itemName}`}
              labelClassName="text-xs"
              type={f.type ?? 'text'}
              inputMode={f.type === 'date' ? undefined : 'decimal'}
              className={f.className ?? 'w-28 text-right'}
              value={f.value}
              onChange={f.onChange}
              error={form.error(f.key)}
            />
          ))}
          <span className="flex gap-1 pt-4">
            <Button onClick={submit} disabled={saving}>
              {saving ? 'Saving…' : 'Save'}
            </Button>
            <Button variant="ghost" onClick={cancel}>
              Cancel
            </Button>
          </span>
        </fieldset>
        {others.map((m) => (
          <p key={m} role="alert" className="mt-1 text-xs text-band-failed">
            {m}
          </p>
        ))}
      </td>
    </tr>
  );
}

/** The button that opens a row's form (admins only). */
export function OpenEdit({ label, itemName, onOpen }: { label: string; itemName: string; onOpen: () => void }) {
  return (
    <Button variant="ghost" className="whitespace-nowrap" aria-label={`${label} of ${itemName}`} onClick={onOpen}>
      {label}
    </Button>
  );
}

/** A catalog row's last two cells: the date its prices took effect, and the way to change them. */
export function PriceCells({
  item,
  canEdit,
  editing,
  label,
  onOpen,
}: {
  item: { name: string; priceEffectiveDate: string };
  canEdit: boolean;
  editing: boolean;
  label: string;
  onOpen: () => void;
}) {
  return (
    <>
      <td className="text-right whitespace-nowrap">{item.priceEffectiveDate}</td>
      <td className="text-right">
        {canEdit && !editing && <OpenEdit label={label} itemName={item.name} onOpen={onOpen} />}
      </td>
    </>
  );
}

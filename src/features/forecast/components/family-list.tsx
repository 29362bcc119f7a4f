import type { Family } from '@shared/schemas/forecast';
import { Card } from '@/components/ui/page';
import { familyFacts, familyTitle } from '../lib/labels';

export function FamilyList({
  families,
  selected,
  onSelect,
}: {
  families: Family[];
  selected: string;
  onSelect: (key: string) => void;
}) {
  return (
    <Card title="Pavement families">
      <ul className="space-y-1 text-sm" data-testid="families">
        {families.map((x) => (
          <li key={x.key}>
            <button
              type="button"
              aria-pressed={x.key === selected}
              onClick={() => onSelect(x.key)}
              className={`w-full rounded px-2 py-1 text-left ${x.key === selected ? 'bg-accent-light' : 'hover:bg-paper'}`}
            >
              <div className="font-semibold">{familyTitle(x)}</div>
              <div className="num text-xs text-asphalt-muted">{familyFacts(x)}</div>
            </button>
          </li>
        ))}
      </ul>
    </Card>
  );
}

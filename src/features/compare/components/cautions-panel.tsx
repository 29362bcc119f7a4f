import type { ComparisonResult } from '@shared/engine/lcca/comparison';
import { Card } from '@/components/ui/page';
import { groupCautions } from '../lib/cautions';
import { Swatch } from './ranked-table';

/** Cautions by kind, each once, beside the alternatives (and mixes or treatments) they concern. */
export function CautionsPanel({ r }: { r: ComparisonResult }) {
  const names = r.alternatives.map((a) => a.name);
  const groups = groupCautions(r.cautions, names);
  if (groups.length === 0) return null;
  return (
    <Card title="Cautions">
      <div className="space-y-3" data-testid="cautions">
        {groups.map((g) => (
          <section key={g.kind} id={`cautions-${g.kind}`} data-testid={`cautions-${g.kind}`}>
            <h3 className={`text-sm font-bold ${g.kind === 'service' ? 'text-band-failed' : 'text-caution'}`}>
              {g.title}
            </h3>
            <ul className="mt-1 space-y-1.5">
              {g.items.map((item) => (
                <li key={item.message} className="rounded bg-caution-bg/60 px-3 py-1.5 text-sm">
                  <div className="flex flex-wrap gap-x-3 gap-y-0.5 text-xs font-semibold">
                    {item.alternatives.map((i) => (
                      <span key={i} className="flex items-baseline">
                        <Swatch i={i} />
                        {names[i]}
                      </span>
                    ))}
                    {item.subjects.length > 0 && g.kind === 'cold-weather' && (
                      <span className="font-normal text-asphalt-muted">mixes: {item.subjects.join(', ')}</span>
                    )}
                  </div>
                  <p className="mt-0.5 text-asphalt">{item.message}</p>
                </li>
              ))}
            </ul>
          </section>
        ))}
      </div>
    </Card>
  );
}

import { useState } from 'react';
import { PRICE_FIELD_LABELS } from '@shared/schemas/catalog';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/page';
import { fmtDate } from '@/lib/format';
import { usePriceHistory } from '../api/get-price-history';
import { priceValueText } from '../lib/labels';
import { CatalogTable, type Column } from './catalog-table';

const COLUMNS: Column[] = ['Item', 'What changed', 'Before', 'After', 'Takes effect', 'Saved on', 'By'].map(
  (label) => ({
    label,
  }),
);

/** Every change of a price or a life, newest first, with the date it takes effect. */
export function PriceHistoryCard({ agencyId }: { agencyId: string }) {
  const [shown, setShown] = useState(false);
  const history = usePriceHistory(agencyId, shown);
  const items = history.data?.items ?? [];
  return (
    <Card title="Price history">
      {!shown ? (
        <Button variant="secondary" onClick={() => setShown(true)}>
          Show price history
        </Button>
      ) : history.isLoading ? (
        <p className="text-sm text-asphalt-muted">Loading the price history…</p>
      ) : history.isError ? (
        <p className="text-sm text-band-failed">The price history could not be read: {history.error.message}</p>
      ) : items.length ? (
        <CatalogTable testId="price-history" columns={COLUMNS}>
          {items.map((h, i) => (
            <tr key={i} className="border-t border-asphalt-line/60 align-top">
              <td className="py-1">{h.name}</td>
              <td>{PRICE_FIELD_LABELS[h.field]}</td>
              <td className="max-w-xs">{h.before === null ? 'new item' : priceValueText(h.field, h.before)}</td>
              <td className="max-w-xs">{priceValueText(h.field, h.after)}</td>
              <td>{h.effectiveDate}</td>
              <td>{fmtDate(h.at)}</td>
              <td>{h.userName ?? '—'}</td>
            </tr>
          ))}
        </CatalogTable>
      ) : (
        <p className="text-sm text-asphalt-muted">No price changes yet.</p>
      )}
    </Card>
  );
}

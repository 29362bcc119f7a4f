import type { ReactNode } from 'react';

export type Column = { label: string; right?: boolean };

/** A catalog table: headers in plain words with their units, bottom-aligned, scrolling sideways only if it must. */
export function CatalogTable({
  testId,
  columns,
  children,
}: {
  testId: string;
  columns: Column[];
  children: ReactNode;
}) {
  return (
    <div className="overflow-x-auto">
      <table className="num w-full text-sm [&_td]:px-2 [&_th]:px-2 [&_th]:align-bottom" data-testid={testId}>
        <thead className="text-left text-xs uppercase text-asphalt-muted">
          <tr>
            {columns.map((c, i) => (
              <th key={c.label || i} className={`${i === 0 ? 'py-1' : ''} ${c.right ? 'text-right' : ''}`}>
                {c.label}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>{children}</tbody>
      </table>
    </div>
  );
}

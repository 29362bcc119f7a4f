import type { ImportReport } from '@shared/schemas/imports';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/page';
import { fmtInt } from '@/lib/format';

export function WrittenStep({
  agencyId,
  report,
  status,
  onAgain,
}: {
  agencyId: string;
  report: ImportReport;
  status: number;
  onAgain: () => void;
}) {
  return (
    <Card title="Written">
      <p className="text-sm" role="status" data-testid="import-result">
        {status === 200
          ? `Added ${fmtInt(report.added)}, updated ${fmtInt(report.updated)}, unchanged ${fmtInt(report.unchanged)}, rejected ${fmtInt(report.rejected)}.`
          : 'The file was refused; nothing was written.'}
      </p>
      {report.importId && report.rejected > 0 && (
        <a
          className="mt-2 inline-block text-sm font-semibold text-accent hover:underline"
          href={`/api/agencies/${agencyId}/imports/${report.importId}/rejected.csv`}
        >
          Download the rejected rows (CSV with reasons)
        </a>
      )}
      <div className="mt-4">
        <Button onClick={onAgain}>Import another file</Button>
      </div>
    </Card>
  );
}

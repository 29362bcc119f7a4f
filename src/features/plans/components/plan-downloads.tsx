import { Link } from 'react-router-dom';

const linkClass = 'rounded border border-asphalt-line bg-white px-3 py-1.5 text-sm font-semibold';

/** The brief (print page and PDF) and the work list; viewers get the published version's. */
export function PlanDownloads({ agencyId, planId }: { agencyId: string; planId: string }) {
  const api = `/api/agencies/${agencyId}/plans/${planId}`;
  return (
    <>
      <Link className={linkClass} to="brief">
        Brief
      </Link>
      <a className={linkClass} href={`${api}/brief.pdf`} target="_blank" rel="noreferrer">
        Council brief (PDF)
      </a>
      <a className={linkClass} href={`${api}/work-list?format=csv`}>
        Work list CSV
      </a>
      <a className={linkClass} href={`${api}/work-list?format=xlsx`}>
        XLSX
      </a>
    </>
  );
}

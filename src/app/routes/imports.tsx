import { useState } from 'react';
import type { ImportMode, ImportReport, ValueMap } from '@shared/schemas/imports';
import { PageHeader } from '@/components/ui/page';
import { type ImportRequest, useRunImport } from '@/features/imports/api/run-import';
import { CheckStep } from '@/features/imports/components/check-step';
import { ChooseFileStep } from '@/features/imports/components/choose-file-step';
import { ImportHistoryTable } from '@/features/imports/components/import-history-table';
import { ImportSteps } from '@/features/imports/components/import-steps';
import { MatchColumnsStep, type ReadChoices } from '@/features/imports/components/match-columns-step';
import { WrittenStep } from '@/features/imports/components/written-step';
import { useAgency } from '../use-agency';

const FRESH: ReadChoices = { mapping: {}, units: { length: 'mi', width: 'ft' }, crs: '', dateFormat: 'auto' };

/** Choose → match columns → check (a dry run) → write. Every step after the first asks the server again. */
export function ImportsPage() {
  const { agencyId } = useAgency();
  const run = useRunImport(agencyId);
  const [step, setStep] = useState(0);
  const [kind, setKind] = useState<'segments' | 'surveys'>('segments');
  const [file, setFile] = useState<File | null>(null);
  const [choices, setChoices] = useState<ReadChoices>(FRESH);
  const [values, setValues] = useState<ValueMap>({});
  const [mode, setMode] = useState<ImportMode>('all-or-nothing');
  const [report, setReport] = useState<ImportReport | null>(null);
  const [status, setStatus] = useState(0);
  const [error, setError] = useState<string | null>(null);

  const request = (dryRun: boolean): ImportRequest => ({
    file: file!,
    kind,
    mapping: Object.fromEntries(Object.entries(choices.mapping).filter(([, v]) => v)),
    crs: choices.crs || undefined,
    mode,
    dryRun,
    lengthUnit: choices.units.length,
    widthUnit: choices.units.width,
    dateFormat: choices.dateFormat,
    values,
  });
  const go = (req: ImportRequest, next: number) => {
    setError(null);
    run.mutate(req, {
      onSuccess: ({ status: s, report: r }) => {
        setReport(r);
        setStatus(s);
        if (next === 1) {
          setChoices({ mapping: r.mapping, units: r.units, crs: r.crs ?? '', dateFormat: 'auto' });
          setValues(r.valueMap);
        }
        setStep(next);
      },
      onError: (e) => setError(e.message),
    });
  };
  const reset = () => {
    setStep(0);
    setFile(null);
    setReport(null);
    setError(null);
    setChoices(FRESH);
    setValues({});
  };

  return (
    <div className="space-y-5">
      <PageHeader
        title="Imports"
        caption="Bring in segments or condition surveys from a spreadsheet (CSV, XLSX) or a GIS export (GeoJSON, zipped shapefile). Nothing is written until the last step, and then all at once."
      />
      <ImportSteps step={step} />
      {error && (
        <div role="alert" className="rounded border border-band-failed/40 bg-white p-3 text-sm text-band-failed">
          {error}
        </div>
      )}
      {step === 0 && (
        <ChooseFileStep
          kind={kind}
          onKind={setKind}
          file={file}
          onFile={setFile}
          busy={run.isPending}
          onRead={() => go({ file: file!, kind, mode, dryRun: true }, 1)}
        />
      )}
      {step === 1 && report && (
        <MatchColumnsStep
          kind={kind}
          fileName={file?.name ?? ''}
          report={report}
          choices={choices}
          onChange={setChoices}
          busy={run.isPending}
          onBack={reset}
          onCheck={() => go(request(true), 2)}
        />
      )}
      {step === 2 && report && (
        <CheckStep
          report={report}
          mode={mode}
          onMode={setMode}
          values={values}
          onValues={setValues}
          busy={run.isPending}
          onCheckAgain={() => go(request(true), 2)}
          onBack={() => setStep(1)}
          onWrite={() => go(request(false), 3)}
        />
      )}
      {step === 3 && report && <WrittenStep agencyId={agencyId} report={report} status={status} onAgain={reset} />}
      <ImportHistoryTable agencyId={agencyId} />
    </div>
  );
}

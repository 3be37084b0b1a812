// Upload measured data (CSV) for a study: the header is read in the browser and each
// column is mapped to an input or output name before the file is sent. A dimensional
// column carries its unit in square brackets (`fluid_temperature [degC]`); the server
// converts it to SI with the study files' units library and refuses a missing unit.
import { useId, useState, type FormEvent } from 'react';
import { useUploadMeasurement } from '../api/measurements.js';
import { csvHeader, guessMapping, headerUnit, mappingProblem, unitProblem } from '../lib/csv-header.js';
import { labelWithUnit } from '../lib/units.js';
import { useQuantities } from '../lib/use-quantities.js';
import { ErrorNote, Notice } from './States.js';

export function MeasurementUploadForm({ studyId, names }: { studyId: number; names: { inputs: string[]; outputs: string[] } }) {
  const upload = useUploadMeasurement(studyId);
  const quantities = useQuantities(undefined);
  const id = useId();
  const [file, setFile] = useState<File | null>(null);
  const [columns, setColumns] = useState<string[]>([]);
  const [mapping, setMapping] = useState<Record<string, string>>({});

  const choose = async (f: File | null) => {
    upload.reset();
    setFile(f);
    const header = f ? csvHeader(await f.text()) : [];
    setColumns(header);
    setMapping(guessMapping(header, [...names.inputs, ...names.outputs]));
  };

  const unitProblems = Object.entries(mapping)
    .filter(([, name]) => name)
    .map(([column, name]) => unitProblem(column, name, quantities))
    .filter((p): p is string => p !== null);
  const problem = file ? (columns.length ? (mappingProblem(mapping) ?? unitProblems[0] ?? null) : 'the file has no header row') : null;
  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (!file || problem) return;
    const chosen = Object.fromEntries(Object.entries(mapping).filter(([, v]) => v));
    upload.mutate({ file, mapping: chosen }, { onSuccess: () => { setFile(null); setColumns([]); setMapping({}); } });
  };

  return (
    <form onSubmit={submit} className="space-y-3" aria-label="Upload measurements">
      <div>
        <label htmlFor={`${id}-file`} className="field-label">Measured data (.csv with a header row, up to 2 MiB; units in square brackets: “h [W/(m^2 K)]”)</label>
        <input id={`${id}-file`} type="file" accept=".csv,text/csv" className="input" onChange={(e) => void choose(e.target.files?.[0] ?? null)} />
      </div>
      {columns.length > 0 && (
        <fieldset className="rounded-md border border-ink-100 p-3">
          <legend className="px-1 text-xs font-semibold text-ink-600">Column mapping (at least one column to Nu or h)</legend>
          <div className="grid grid-cols-1 gap-2 md:grid-cols-2 2xl:grid-cols-3">
            {columns.map((c, i) => {
              const name = mapping[c];
              const unit = headerUnit(c);
              const trouble = name ? unitProblem(c, name, quantities) : null;
              return (
                <div key={c} className="space-y-0.5" data-testid="column-mapping">
                  <div className="flex items-center gap-2">
                    <label htmlFor={`${id}-col-${i}`} className="w-40 font-mono text-xs break-words">{c}</label>
                    <select id={`${id}-col-${i}`} className="input" value={name ?? ''} onChange={(e) => setMapping({ ...mapping, [c]: e.target.value })}>
                      <option value="">(ignore)</option>
                      <optgroup label="outputs">{names.outputs.map((n) => <option key={n} value={n}>{labelWithUnit(quantities(n))}</option>)}</optgroup>
                      <optgroup label="inputs">{names.inputs.map((n) => <option key={n} value={n}>{labelWithUnit(quantities(n))}</option>)}</optgroup>
                    </select>
                  </div>
                  {name && (
                    <p className={`text-xs ${trouble ? 'text-brick-700' : 'text-ink-600'}`}>
                      {trouble ?? (unit && quantities(name).si !== '1' ? `read in ${unit}, stored in SI (${quantities(name).si})` : 'dimensionless')}
                    </p>
                  )}
                </div>
              );
            })}
          </div>
        </fieldset>
      )}
      {problem && <p className="text-sm text-copper-700">{problem}</p>}
      {upload.isError && <ErrorNote error={upload.error} title="The measurements were not stored" />}
      {upload.isSuccess && <Notice>Measurements stored.</Notice>}
      <button type="submit" className="btn btn-primary" disabled={!file || problem !== null || upload.isPending}>Upload measurements</button>
    </form>
  );
}

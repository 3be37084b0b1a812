// Upload a study file (a new study or a new version of one). An invalid file comes
// back with diagnostics, shown with their line and column and the offending line.
import { useId, useRef, useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router-dom';
import { ApiError } from '../api/client.js';
import { useUploadStudy } from '../api/studies.js';
import { diagnosticsOf, sourceLine } from '../lib/diagnostics.js';
import { ErrorNote } from './States.js';

export function StudyUploadForm({ label = 'Upload a study file' }: { label?: string }) {
  const upload = useUploadStudy();
  const navigate = useNavigate();
  const inputId = useId();
  const fileRef = useRef<HTMLInputElement>(null);
  const [file, setFile] = useState<File | null>(null);
  const [text, setText] = useState('');

  const choose = async (f: File | null) => {
    setFile(f);
    upload.reset();
    setText(f ? await f.text() : '');
  };

  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (file) upload.mutate(file, { onSuccess: (data) => navigate(`/runs/${data.run.id}`) });
  };

  const diagnostics = upload.error instanceof ApiError ? diagnosticsOf(upload.error.details) : [];

  return (
    <form onSubmit={submit} className="space-y-3" aria-label={label} data-testid="study-upload">
      <div>
        <label htmlFor={inputId} className="field-label">{label} (.yaml, up to 256 KiB); it is validated, then run on the server</label>
        <div className="flex items-center gap-2">
          <input
            id={inputId}
            ref={fileRef}
            type="file"
            name="file"
            accept=".yaml,.yml,text/yaml"
            className="input file:mr-2 file:rounded file:border-0 file:bg-ink-50 file:px-2 file:py-0.5 file:text-ink-700"
            onChange={(e) => void choose(e.target.files?.[0] ?? null)}
            aria-describedby={diagnostics.length ? `${inputId}-diagnostics` : undefined}
            aria-invalid={diagnostics.length > 0 || undefined}
          />
          <button type="submit" className="btn btn-primary shrink-0" disabled={!file || upload.isPending}>
            {upload.isPending ? 'Uploading…' : 'Upload and run'}
          </button>
        </div>
      </div>
      {upload.isError && diagnostics.length === 0 && <ErrorNote error={upload.error} title="Upload refused" />}
      {diagnostics.length > 0 && (
        <div id={`${inputId}-diagnostics`} role="alert" className="rounded-md border border-brick-700/30 bg-brick-100 p-3 text-sm" data-testid="diagnostics">
          <p className="mb-2 font-semibold text-brick-700">
            {file?.name ?? 'The file'} is not a valid study file ({diagnostics.length} problem{diagnostics.length === 1 ? '' : 's'}); nothing was stored or run.
          </p>
          <ol className="space-y-1.5">
            {diagnostics.map((d, i) => {
              const src = sourceLine(text, d.line);
              return (
                <li key={i} className="font-mono text-xs">
                  <span className="font-semibold text-brick-700">line {d.line}, column {d.column}</span>: {d.message}
                  {src !== undefined && (
                    <pre className="mt-0.5 overflow-x-auto rounded bg-white/70 px-2 py-0.5 text-ink-800">
                      <span className="select-none text-ink-400">{String(d.line).padStart(4)} │ </span>
                      {src}
                    </pre>
                  )}
                </li>
              );
            })}
          </ol>
        </div>
      )}
    </form>
  );
}

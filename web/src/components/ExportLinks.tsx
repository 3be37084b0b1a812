// Download links for a run's tables (the server's exporters write them).
import { EXPORT_FORMATS, exportUrl } from '../api/runs.js';

export function ExportLinks({ runId, prefix = '' }: { runId: number; prefix?: string }) {
  return (
    <div className="flex flex-wrap items-center gap-1.5" aria-label={`exports of run ${runId}`}>
      {EXPORT_FORMATS.map((f) => (
        <a key={f.format} className="btn btn-small" href={exportUrl(runId, f.format)} download={`run-${runId}.${f.format}`} data-testid={`export-${f.format}-${runId}`}>
          {prefix}{f.label}
        </a>
      ))}
    </div>
  );
}

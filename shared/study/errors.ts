// Errors in a study file, each with the place it was found, so the CLI can print
// `file:line:column: message` lines that editors and CI logs link to.

export interface Diagnostic {
  file: string;
  /** 1-based line and column of the offending key or value. */
  line: number;
  column: number;
  message: string;
}

/** Every problem found in a study file, reported together rather than one per attempt. */
export class StudyError extends Error {
  readonly diagnostics: Diagnostic[];

  constructor(diagnostics: Diagnostic[]) {
    const sorted = [...diagnostics].sort((a, b) => a.line - b.line || a.column - b.column);
    super(formatDiagnostics(sorted));
    this.name = 'StudyError';
    this.diagnostics = sorted;
  }

  format(): string {
    return formatDiagnostics(this.diagnostics);
  }
}

function formatDiagnostics(diagnostics: readonly Diagnostic[]): string {
  return diagnostics.map((d) => `${d.file}:${d.line}:${d.column}: ${d.message}`).join('\n');
}

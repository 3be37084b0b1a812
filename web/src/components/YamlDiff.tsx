// The line diff of two study files (jsdiff's diffLines): lines only in run a's file, only
// in run b's, and the unchanged ones around them; long unchanged stretches fold.
import { useMemo } from 'react';
import { diffLines } from 'diff';

const CONTEXT = 3;

interface Line {
  kind: 'same' | 'del' | 'add';
  text: string;
  /** Line numbers in a's and b's file. */
  na?: number;
  nb?: number;
}

type Shown = Line | { kind: 'fold'; count: number };

export function diffStudyLines(a: string, b: string): Line[] {
  const lines: Line[] = [];
  let na = 0;
  let nb = 0;
  for (const part of diffLines(a, b)) {
    const texts = part.value.replace(/\n$/, '').split('\n');
    for (const text of texts) {
      if (part.added) lines.push({ kind: 'add', text, nb: ++nb });
      else if (part.removed) lines.push({ kind: 'del', text, na: ++na });
      else lines.push({ kind: 'same', text, na: ++na, nb: ++nb });
    }
  }
  return lines;
}

/** Unchanged lines further than CONTEXT from a change fold into one marker. */
function fold(lines: Line[]): Shown[] {
  const near = lines.map(() => false);
  lines.forEach((l, i) => {
    if (l.kind === 'same') return;
    for (let k = Math.max(0, i - CONTEXT); k <= Math.min(lines.length - 1, i + CONTEXT); k++) near[k] = true;
  });
  const shown: Shown[] = [];
  let folded = 0;
  lines.forEach((l, i) => {
    if (l.kind === 'same' && !near[i]) {
      folded++;
      return;
    }
    if (folded) shown.push({ kind: 'fold', count: folded });
    folded = 0;
    shown.push(l);
  });
  if (folded) shown.push({ kind: 'fold', count: folded });
  return shown;
}

const tone = {
  same: 'text-ink-900',
  del: 'bg-brick-100 text-brick-700',
  add: 'bg-moss-100 text-moss-700',
} as const;
const mark = { same: ' ', del: '−', add: '+' } as const;

export function YamlDiff({ a, b }: { a: string; b: string }) {
  const shown = useMemo(() => fold(diffStudyLines(a, b)), [a, b]);
  const changes = shown.filter((l) => l.kind === 'add' || l.kind === 'del').length;
  return (
    <div className="space-y-2">
      <p className="text-sm text-ink-600" data-testid="yaml-diff-summary">
        {changes === 0 ? 'Both runs ran the same study file.' : `${changes} line${changes === 1 ? '' : 's'} differ: − only in run a’s file, + only in run b’s.`}
      </p>
      {changes > 0 && (
        <pre className="max-h-[420px] overflow-auto rounded-[3px] border border-line bg-white py-2 font-mono text-xs leading-relaxed" data-testid="yaml-diff" aria-label="Study file differences">
          {shown.map((l, i) =>
            l.kind === 'fold' ? (
              <div key={i} className="px-3 text-ink-400">⋯ {l.count} unchanged line{l.count === 1 ? '' : 's'}</div>
            ) : (
              <div key={i} className={`flex px-3 ${tone[l.kind]}`} data-kind={l.kind}>
                <span className="w-8 shrink-0 select-none text-right text-ink-400">{l.na ?? ''}</span>
                <span className="w-8 shrink-0 select-none text-right text-ink-400">{l.nb ?? ''}</span>
                <span className="w-5 shrink-0 select-none text-center" aria-hidden>{mark[l.kind]}</span>
                <span className="whitespace-pre">{l.text}</span>
              </div>
            ),
          )}
        </pre>
      )}
    </div>
  );
}

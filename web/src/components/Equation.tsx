// A method's equation, typeset by KaTeX from the catalogue's LaTeX (bundled, offline;
// KaTeX and its styles load with the pages that show equations).
import { useMemo } from 'react';
import katex from 'katex';
import 'katex/dist/katex.min.css';

export function Equation({ latex }: { latex: string }) {
  const html = useMemo(() => katex.renderToString(latex, { displayMode: true, throwOnError: false, strict: 'ignore', output: 'htmlAndMathml' }), [latex]);
  // KaTeX escapes the input and emits only its own markup.
  return <div className="overflow-x-auto py-1 text-ink-900" data-testid="equation" dangerouslySetInnerHTML={{ __html: html }} />;
}

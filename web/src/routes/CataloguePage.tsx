// The catalogue: every method with its equation, inputs, validity ranges, stated
// uncertainty and source, grouped by configuration.
import { useState } from 'react';
import { useCatalogue } from '../api/methods.js';
import type { MethodInfo, ValidityRange } from '../api/types.js';
import { Equation } from '../components/Equation.js';
import { Empty, ErrorNote, Loading } from '../components/States.js';
import { formatNumber, formatValue } from '../lib/format.js';

function rangeText(r: ValidityRange) {
  const strict = r.inclusive === false;
  const lo = r.min !== undefined ? `${formatNumber(r.min)} ${strict ? '<' : '≤'} ` : '';
  const hi = r.max !== undefined ? ` ${strict ? '<' : '≤'} ${formatNumber(r.max)}` : '';
  return `${lo}${r.input}${hi}`;
}

function MethodCard({ m }: { m: MethodInfo }) {
  return (
    <article className="card min-w-0 space-y-2" aria-labelledby={`m-${m.configuration}-${m.id}`} data-testid="method-card">
      <header className="flex flex-wrap items-baseline gap-2">
        <h3 id={`m-${m.configuration}-${m.id}`} className="text-base font-semibold">{m.title}</h3>
        <span className="font-mono text-xs text-ink-600">{m.id}</span>
        <span className={`rounded px-1.5 text-xs ${m.kind === 'similarity' ? 'bg-ink-50 text-ink-700' : 'bg-copper-100 text-copper-700'}`}>{m.kind}</span>
        <span className="text-xs text-ink-400">v{m.version}</span>
      </header>
      <p className="text-sm text-ink-700">{m.description}</p>
      <Equation latex={m.equation} />
      <div className="grid grid-cols-1 gap-3 text-sm lg:grid-cols-2">
        <div>
          <h4 className="field-label">Inputs</h4>
          <ul className="space-y-0.5">
            {m.inputs.map((i) => (
              <li key={i.name}>
                <span className="font-mono text-xs">{i.name}</span>{i.unit !== '1' && <span className="text-ink-600"> [{i.unit}]</span>} — {i.description}
                {!i.required && <span className="text-ink-600"> (default {formatValue(i.default)})</span>}
                {i.choices && <span className="text-ink-600"> ({i.choices.join(' | ')})</span>}
              </li>
            ))}
          </ul>
        </div>
        <div className="space-y-2">
          <div>
            <h4 className="field-label">Validity ranges</h4>
            {m.ranges.length ? (
              <ul className="space-y-0.5">
                {m.ranges.map((r, k) => <li key={k} className="font-mono text-xs">{rangeText(r)}{r.note && <span className="font-sans text-ink-600"> — {r.note}</span>}</li>)}
              </ul>
            ) : (
              <p className="text-ink-600">no stated limits</p>
            )}
          </div>
          <div>
            <h4 className="field-label">Outputs</h4>
            <p className="font-mono text-xs">{m.outputs.map((o) => o.name).join(', ')}</p>
          </div>
          <div>
            <h4 className="field-label">Uncertainty</h4>
            <p>±{formatNumber(m.uncertainty.fraction * 100, 3)} % — <span className="text-ink-600">{m.uncertainty.note}</span></p>
          </div>
        </div>
      </div>
      <p className="border-t border-ink-50 pt-2 text-xs text-ink-600"><span className="font-semibold">Source:</span> {m.source}</p>
    </article>
  );
}

export function CataloguePage() {
  const catalogue = useCatalogue();
  const [configuration, setConfiguration] = useState('');
  const [text, setText] = useState('');
  if (catalogue.isPending) return <Loading what="Loading the catalogue" />;
  if (catalogue.isError) return <ErrorNote error={catalogue.error} title="The catalogue could not be loaded" />;
  const needle = text.trim().toLowerCase();
  const shown = catalogue.data.configurations.filter((c) => !configuration || c.id === configuration);
  const matches = (m: MethodInfo) => !needle || `${m.id} ${m.title} ${m.description} ${m.source}`.toLowerCase().includes(needle);

  return (
    <div className="space-y-5">
      <div className="flex flex-wrap items-end gap-4">
        <h1 className="text-2xl font-semibold">Catalogue</h1>
        <div>
          <label htmlFor="cat-configuration" className="field-label">Configuration</label>
          <select id="cat-configuration" className="input w-72" value={configuration} onChange={(e) => setConfiguration(e.target.value)}>
            <option value="">all configurations</option>
            {catalogue.data.configurations.map((c) => <option key={c.id} value={c.id}>{c.title}</option>)}
          </select>
        </div>
        <div className="w-72">
          <label htmlFor="cat-search" className="field-label">Search methods</label>
          <input id="cat-search" type="search" className="input" value={text} onChange={(e) => setText(e.target.value)} placeholder="e.g. Gnielinski, Churchill" />
        </div>
        <p className="text-sm text-ink-600">{catalogue.data.methods.length} methods in {catalogue.data.configurations.length} configurations</p>
      </div>
      {shown.map((c) => {
        const list = catalogue.data.methods.filter((m) => m.configuration === c.id && matches(m));
        if (!list.length && needle) return null;
        return (
          <section key={c.id} aria-labelledby={`conf-${c.id}`} className="space-y-3">
            <div>
              <h2 id={`conf-${c.id}`} className="text-lg font-semibold">{c.title} <span className="font-mono text-sm font-normal text-ink-600">{c.id}</span></h2>
              <p className="text-sm text-ink-600">{c.description} Characteristic length: {c.lengthNote}. Properties at the {c.propertyRule} temperature.</p>
              {c.conventions ? <p className="text-sm text-ink-600" data-testid="configuration-conventions">{c.conventions}</p> : null}
              <p className="text-xs text-ink-600">
                <span className="font-semibold">Dimensional inputs:</span> <span className="font-mono">{[...c.dimensionalInputs, ...(c.engineInputs ?? [])].join(', ')}</span>
                {' · '}
                <span className="font-semibold">Engine outputs:</span> <span className="font-mono">{(c.engineOutputs ?? []).join(', ')}</span>
              </p>
            </div>
            {list.length ? <div className="grid grid-cols-1 gap-4 2xl:grid-cols-2">{list.map((m) => <MethodCard key={m.id} m={m} />)}</div> : <Empty>No method.</Empty>}
          </section>
        );
      })}
    </div>
  );
}

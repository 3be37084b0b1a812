// The filter bar of a run: methods, flagged or not, and min/max on any input or
// output. Edits are a draft until applied, so typing does not fire a query per key.
// Bounds are typed in the units shown (°C when the user shows °C); the applied filter
// is SI, as the API wants.
import { useEffect, useId, useState, type FormEvent } from 'react';
import { convertBound, isBound, type FlaggedFilter, type RangeFilter } from '../lib/result-query.js';
import { labelWithUnit, type Quantities } from '../lib/units.js';

export interface FilterState {
  methods: string[];
  flagged: FlaggedFilter;
  filters: RangeFilter[];
}

interface Props {
  value: FilterState;
  onApply: (f: FilterState) => void;
  methods: string[];
  columns: { inputs: string[]; outputs: string[] };
  quantities: Quantities;
}

export function ResultFilters({ value, onApply, methods, columns, quantities }: Props) {
  const id = useId();
  const shown = (f: FilterState): FilterState => ({
    ...f,
    filters: f.filters.map((r) => ({ ...r, min: convertBound(r.min, quantities(r.name).toDisplay), max: convertBound(r.max, quantities(r.name).toDisplay) })),
  });
  const [draft, setDraft] = useState(() => shown(value));
  useEffect(() => setDraft(shown(value)), [value, quantities]);
  const names = [...columns.inputs, ...columns.outputs];
  const setRange = (i: number, patch: Partial<RangeFilter>) =>
    setDraft({ ...draft, filters: draft.filters.map((f, j) => (j === i ? { ...f, ...patch } : f)) });
  const invalid = draft.filters.some((f) => !isBound(f.min) || !isBound(f.max));

  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (!invalid) {
      onApply({
        ...draft,
        filters: draft.filters.map((r) => ({ ...r, min: convertBound(r.min, quantities(r.name).fromDisplay), max: convertBound(r.max, quantities(r.name).fromDisplay) })),
      });
    }
  };

  return (
    <form onSubmit={submit} className="space-y-3" aria-label="Result filters">
      <div className="flex flex-wrap items-start gap-6">
        <fieldset>
          <legend className="field-label">Methods (none ticked: all)</legend>
          <div className="flex flex-wrap gap-x-3 gap-y-1">
            {methods.map((m) => (
              <label key={m} className="flex items-center gap-1 text-sm">
                <input
                  type="checkbox"
                  checked={draft.methods.includes(m)}
                  onChange={(e) => setDraft({ ...draft, methods: e.target.checked ? [...draft.methods, m] : draft.methods.filter((x) => x !== m) })}
                />
                <span className="font-mono text-xs">{m}</span>
              </label>
            ))}
          </div>
        </fieldset>
        <div>
          <label htmlFor={`${id}-flagged`} className="field-label">Flagged</label>
          <select id={`${id}-flagged`} className="input w-auto" value={draft.flagged} onChange={(e) => setDraft({ ...draft, flagged: e.target.value as FlaggedFilter })}>
            <option value="any">all results</option>
            <option value="yes">only flagged</option>
            <option value="no">only unflagged</option>
          </select>
        </div>
      </div>
      <fieldset className="space-y-2">
        <legend className="field-label">Ranges (leave a bound empty to keep it open)</legend>
        {draft.filters.map((f, i) => (
          <div key={i} className="flex flex-wrap items-center gap-2" data-testid="range-filter">
            <label className="sr-only" htmlFor={`${id}-name-${i}`}>quantity</label>
            <select id={`${id}-name-${i}`} className="input w-44" value={f.name} onChange={(e) => setRange(i, { name: e.target.value })}>
              <optgroup label="inputs">{columns.inputs.map((n) => <option key={n} value={n}>{labelWithUnit(quantities(n))}</option>)}</optgroup>
              <optgroup label="outputs">{columns.outputs.map((n) => <option key={n} value={n}>{labelWithUnit(quantities(n))}</option>)}</optgroup>
            </select>
            <label className="text-xs text-ink-600" htmlFor={`${id}-min-${i}`}>from</label>
            <input id={`${id}-min-${i}`} className="input w-32 font-mono" inputMode="decimal" value={f.min} aria-invalid={!isBound(f.min) || undefined} onChange={(e) => setRange(i, { min: e.target.value })} placeholder="min" />
            <label className="text-xs text-ink-600" htmlFor={`${id}-max-${i}`}>to</label>
            <input id={`${id}-max-${i}`} className="input w-32 font-mono" inputMode="decimal" value={f.max} aria-invalid={!isBound(f.max) || undefined} onChange={(e) => setRange(i, { max: e.target.value })} placeholder="max" />
            <span className="text-xs text-ink-600" data-testid="range-unit">{quantities(f.name).unit === '-' ? '(dimensionless)' : quantities(f.name).unit}</span>
            <button type="button" className="btn btn-small" onClick={() => setDraft({ ...draft, filters: draft.filters.filter((_, j) => j !== i) })}>Remove</button>
          </div>
        ))}
        <button type="button" className="btn btn-small" disabled={names.length === 0} onClick={() => setDraft({ ...draft, filters: [...draft.filters, { name: names[0], min: '', max: '' }] })}>
          Add a range
        </button>
      </fieldset>
      {invalid && <p className="text-sm text-brick-700">A bound is not a number (write 1e5, 0.7, −3 as -3).</p>}
      <div className="flex gap-2">
        <button type="submit" className="btn btn-primary" disabled={invalid}>Apply filters</button>
        <button type="button" className="btn" onClick={() => onApply({ methods: [], flagged: 'any', filters: [] })}>Clear</button>
      </div>
    </form>
  );
}

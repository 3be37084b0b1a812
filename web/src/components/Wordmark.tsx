// Filmsweep's mark: a heated wall (ember) under the profile of the film that flows over
// it (coolant), the shape of a boundary layer, beside the name.
export function FilmMark({ size = 22 }: { size?: number }) {
  return (
    <svg width={size} height={size} viewBox="0 0 24 24" aria-hidden focusable="false" className="shrink-0">
      <rect x="2" y="19.5" width="20" height="2.5" rx="0.5" className="fill-ember-500" />
      <path d="M3 19 C 4.5 11, 8 7.5, 21 6.5" className="stroke-ink-700" strokeWidth="2.2" fill="none" strokeLinecap="round" />
      <path d="M3 19 C 5 15, 9 13, 21 12.5" className="stroke-ink-200" strokeWidth="1.6" fill="none" strokeLinecap="round" />
    </svg>
  );
}

export function Wordmark({ tagline = false }: { tagline?: boolean }) {
  return (
    <span className="flex items-center gap-2">
      <FilmMark />
      <span className="text-lg font-bold tracking-tight text-ink-900">Filmsweep</span>
      {tagline && <span className="hidden text-xs text-ink-600 xl:inline">convection sweeps</span>}
    </span>
  );
}

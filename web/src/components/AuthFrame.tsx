// The frame of the pages used before signing in: a centred card and the caution.
import type { ReactNode } from 'react';
import { CAUTION } from '../../../shared/export/caution.js';

export function AuthFrame({ title, children }: { title: string; children: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col items-center justify-center bg-ink-900 px-4">
      <div className="w-full max-w-sm">
        <div className="mb-5 text-center text-white">
          <div className="text-2xl font-semibold tracking-tight">Filmsweep</div>
          <div className="text-sm text-ink-200">convection heat-transfer sweeps for the team</div>
        </div>
        <div className="card space-y-4 p-6">
          <h1 className="text-lg font-semibold">{title}</h1>
          {children}
        </div>
        <p className="mt-5 text-center text-[11px] leading-snug text-ink-200">{CAUTION}</p>
      </div>
    </div>
  );
}

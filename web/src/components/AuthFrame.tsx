// The frame of the pages used before signing in: the mark, one sheet under the film
// stripe, and the caution.
import type { ReactNode } from 'react';
import { CAUTION } from '../../../shared/export/caution.js';
import { Wordmark } from './Wordmark.js';

export function AuthFrame({ title, children }: { title: string; children: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col items-center justify-center px-4 py-8">
      <div className="w-full max-w-sm">
        <div className="mb-4 flex flex-col items-center gap-1">
          <Wordmark />
          <div className="text-sm text-ink-600">convection heat-transfer sweeps for the team</div>
        </div>
        <div className="overflow-hidden rounded-[3px] border border-line bg-sheet">
          <div className="film h-[3px]" aria-hidden />
          <div className="space-y-4 p-6">
            <h1 className="text-lg font-semibold">{title}</h1>
            {children}
          </div>
        </div>
        <p className="mt-5 text-center text-[11px] leading-snug text-ink-600">{CAUTION}</p>
      </div>
    </div>
  );
}

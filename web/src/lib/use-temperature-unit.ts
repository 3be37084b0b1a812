// The hook behind the °C/K choice: reads and remembers it in localStorage under the
// signed-in user (display-units.ts), and re-renders every user of it on a change.
import { useCallback, useSyncExternalStore } from 'react';
import { useSession } from '../api/session.js';
import { readTemperatureUnit, storageKey } from './display-units.js';
import type { TemperatureUnit } from './units.js';

const listeners = new Set<() => void>();
function subscribe(fn: () => void) {
  listeners.add(fn);
  const onStorage = (e: StorageEvent) => e.key?.startsWith('filmsweep:display-units:') && fn();
  window.addEventListener('storage', onStorage);
  return () => {
    listeners.delete(fn);
    window.removeEventListener('storage', onStorage);
  };
}

/** [the user's temperature unit, a setter that remembers it]. */
export function useTemperatureUnit(): [TemperatureUnit, (unit: TemperatureUnit) => void] {
  const user = useSession().data?.user.email;
  const unit = useSyncExternalStore(subscribe, () => readTemperatureUnit(safeStorage(), user));
  const set = useCallback(
    (next: TemperatureUnit) => {
      if (!user) return;
      try {
        safeStorage()?.setItem(storageKey(user), JSON.stringify({ temperature: next }));
      } catch {
        // storage full or blocked: the choice cannot be kept, the default stays
      }
      for (const fn of listeners) fn();
    },
    [user],
  );
  return [unit, set];
}

function safeStorage(): Storage | undefined {
  try {
    return window.localStorage;
  } catch {
    return undefined;
  }
}

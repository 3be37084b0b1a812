// The signed-in user's display units, remembered in this browser's localStorage under
// their e-mail address (the session's identity), so two people sharing a browser keep
// their own choice. Default: °C. Only the display changes; the API and store stay SI.
import { TEMPERATURE_UNITS, type TemperatureUnit } from './units.js';

export const DEFAULT_TEMPERATURE_UNIT: TemperatureUnit = 'degC';

export function storageKey(user: string): string {
  return `filmsweep:display-units:${user.toLowerCase()}`;
}

export function readTemperatureUnit(storage: { getItem(key: string): string | null } | undefined, user: string | undefined): TemperatureUnit {
  if (!storage || !user) return DEFAULT_TEMPERATURE_UNIT;
  try {
    const saved = JSON.parse(storage.getItem(storageKey(user)) ?? 'null') as { temperature?: unknown } | null;
    const t = saved?.temperature;
    return TEMPERATURE_UNITS.includes(t as TemperatureUnit) ? (t as TemperatureUnit) : DEFAULT_TEMPERATURE_UNIT;
  } catch {
    return DEFAULT_TEMPERATURE_UNIT; // unreadable or blocked storage: the default
  }
}


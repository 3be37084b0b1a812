// The user's choice of °C or K for temperatures on screen and in exported figures
// (remembered per user in this browser; the store and API stay SI).
import { useId } from 'react';
import { useTemperatureUnit } from '../lib/use-temperature-unit.js';
import { TEMPERATURE_UNITS } from '../lib/units.js';

export function TemperatureUnitChoice() {
  const id = useId();
  const [unit, setUnit] = useTemperatureUnit();
  return (
    <fieldset className="flex items-center gap-2 text-sm" data-testid="temperature-unit">
      <legend className="sr-only">Temperatures in</legend>
      <span className="text-xs text-ink-600" aria-hidden>Temperatures in</span>
      {TEMPERATURE_UNITS.map((u) => (
        <label key={u} className="flex items-center gap-1">
          <input type="radio" name={`${id}-temperature`} checked={unit === u} onChange={() => setUnit(u)} />
          {u === 'degC' ? '°C' : 'K'}
        </label>
      ))}
    </fieldset>
  );
}

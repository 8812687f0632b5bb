import { useCallback, useState } from 'react';
import type { UnitSystem } from './units';

const STORAGE_KEY = 'spoolyard.fitment.units';

function stored(): UnitSystem {
  try {
    const value = window.localStorage.getItem(STORAGE_KEY);
    return value === 'metric' || value === 'imperial' ? value : 'imperial';
  } catch {
    return 'imperial';
  }
}

/** The buyer's unit system, remembered on this device. Imperial first: the trade rates turbos in hp and lb/min. */
export function useUnitSystem(): [UnitSystem, (system: UnitSystem) => void] {
  const [system, setSystem] = useState<UnitSystem>(stored);
  const set = useCallback((next: UnitSystem) => {
    setSystem(next);
    try {
      window.localStorage.setItem(STORAGE_KEY, next);
    } catch {
      // Private windows may refuse storage; the choice then lasts for this page only.
    }
  }, []);
  return [system, set];
}

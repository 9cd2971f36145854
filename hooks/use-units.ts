import {
  createContext,
  createElement,
  useCallback,
  useContext,
  useEffect,
  useMemo,
  useState,
  type ReactNode,
} from 'react';
import {
  formatArea,
  formatForce,
  formatWingLoading,
  formatLength,
  formatMass,
  lengthNumber,
  rulerNumber,
  stationNumber,
  unitLabel,
  type Quantity,
  type UnitSystem,
} from '@/constants/units';
import { readJson, storageKeys, writeJson } from '@/lib/storage';

export type Units = {
  system: UnitSystem;
  setSystem: (s: UnitSystem) => void;
  length: (inches: number) => string;
  lengthNumber: (inches: number) => string;
  station: (inches: number) => string;
  ruler: (inches: number) => string;
  force: (lbf: number) => string;
  mass: (lb: number) => string;
  area: (sqft: number) => string;
  wingLoading: (psf: number) => string;
  label: (q: Quantity) => string;
};

const UnitsContext = createContext<Units | null>(null);

function make(system: UnitSystem, setSystem: (s: UnitSystem) => void): Units {
  return {
    system,
    setSystem,
    length: (v) => formatLength(v, system),
    lengthNumber: (v) => lengthNumber(v, system),
    station: (v) => stationNumber(v, system),
    ruler: (v) => rulerNumber(v, system),
    force: (v) => formatForce(v, system),
    mass: (v) => formatMass(v, system),
    area: (v) => formatArea(v, system),
    wingLoading: (v) => formatWingLoading(v, system),
    label: (q) => unitLabel(q, system),
  };
}

export function UnitsProvider({ children, initial = 'imperial' }: { children: ReactNode; initial?: UnitSystem }) {
  const [system, setState] = useState<UnitSystem>(initial);
  useEffect(() => {
    readJson<UnitSystem>(storageKeys.units).then((s) => {
      if (s === 'imperial' || s === 'metric') setState(s);
    });
  }, []);
  const setSystem = useCallback((s: UnitSystem) => {
    setState(s);
    void writeJson(storageKeys.units, s);
  }, []);
  const value = useMemo(() => make(system, setSystem), [system, setSystem]);
  return createElement(UnitsContext.Provider, { value }, children);
}

/** Inches and pounds unless the person switched; works without a provider (tests, dev pages). */
export function useUnits(): Units {
  const u = useContext(UnitsContext);
  return u ?? make('imperial', () => {});
}

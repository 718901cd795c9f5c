import type { MikroORM } from '@mikro-orm/postgresql';
import type { BufferValues, LibraryKind, WallValues } from '../../shared/api';
import { run } from '../db/sql';

export interface BuiltInEntry {
  /** Stable key: the entry is updated in place when these values change. */
  key: string;
  kind: LibraryKind;
  name: string;
  values: BufferValues | WallValues;
  source: string;
}

const MEASURE = 'Typical, measure your own chip: wall charge depends on pH, buffer, cleaning, curing and age.';

/**
 * Built-in buffers and wall materials, with sources from ../shared/reference-values.md (sections 1, 3 and 7).
 * SI units: Pa s, kg/m^3, S/m, mol/m^3, K, V, m^2/(V s).
 */
export const BUILT_IN_LIBRARY: readonly BuiltInEntry[] = [
  {
    key: 'water-20c',
    kind: 'buffer',
    name: 'Water, 20 °C',
    values: { temperature: 293.15, viscosity: 1.0016e-3, density: 998.207, relativePermittivity: 80.1 },
    source:
      'Viscosity: IAPWS R12-08 (2008), Huber et al., J. Phys. Chem. Ref. Data 38, 101 (2009), at 0.1 MPa. ' +
      'Density: IAPWS-95, Wagner & Pruss, J. Phys. Chem. Ref. Data 31, 387 (2002) (20 °C value from memory). ' +
      'Permittivity: Malmberg & Maryott, J. Res. NBS 56, 1 (1956), fit at 20 °C. Pure water: no conductivity given.',
  },
  {
    key: 'water-25c',
    kind: 'buffer',
    name: 'Water, 25 °C',
    values: { temperature: 298.15, viscosity: 8.9002e-4, density: 997.047, relativePermittivity: 78.3 },
    source:
      'Viscosity: IAPWS R12-08 (2008), Huber et al., J. Phys. Chem. Ref. Data 38, 101 (2009), at 0.1 MPa. ' +
      'Density: IAPWS-95, Wagner & Pruss, J. Phys. Chem. Ref. Data 31, 387 (2002). ' +
      'Permittivity: Malmberg & Maryott, J. Res. NBS 56, 1 (1956). Pure water: no conductivity given.',
  },
  {
    key: 'kcl-10mm-25c',
    kind: 'buffer',
    name: 'KCl 10 mM, 25 °C',
    values: {
      temperature: 298.15,
      conductivity: 0.1413,
      ionicStrength: 10,
      viscosity: 8.9002e-4,
      density: 997.047,
      relativePermittivity: 78.3,
    },
    source:
      'Conductivity 1413 µS/cm at 25 °C: the 0.01 mol/L KCl instrument calibration standard, consistent with ' +
      'Wu, Koch & Pratt, J. Res. NIST 96, 191 (1991). Solvent properties of water at 25 °C (IAPWS 2008; ' +
      'Malmberg & Maryott 1956), the dilute salt neglected.',
  },
  {
    key: 'wall-glass',
    kind: 'wall',
    name: 'Glass / fused silica',
    values: { zetaMin: -0.09, zetaMax: -0.05, mobilityMin: 4e-8, mobilityMax: 7e-8, note: `pH 7-9, about 1-10 mM. ${MEASURE}` },
    source:
      'Sze, Erickson, Ren & Li, J. Colloid Interface Sci. 261, 402 (2003) (glass zeta -66 to -88 mV); ' +
      'Kirby & Hasselbrink, Electrophoresis 25, 187 (2004). Range, not a single value.',
  },
  {
    key: 'wall-pdms',
    kind: 'wall',
    name: 'PDMS',
    values: { zetaMin: -0.11, zetaMax: -0.068, mobilityMin: 2e-8, mobilityMax: 8e-8, note: `pH 7-9, mM buffers; varies strongly with cure, plasma treatment and age. ${MEASURE}` },
    source:
      'Sze, Erickson, Ren & Li, J. Colloid Interface Sci. 261, 402 (2003) (PDMS zeta -68 to -110 mV); ' +
      'Kirby & Hasselbrink, Electrophoresis 25, 203 (2004). The low end of the mobility range (aged or native PDMS) is from memory.',
  },
  {
    key: 'wall-su8',
    kind: 'wall',
    name: 'SU-8',
    values: { mobility: 5.8e-8, zeta: -0.074, note: `pH 7 or above, 10 mM; zeta from Helmholtz-Smoluchowski with water at 25 °C. ${MEASURE}` },
    source:
      'Lab Chip (2005), "Characterization of SU-8 for electrokinetic microfluidic applications" (authors from memory: ' +
      'Sikanen et al.): 5.8e-4 cm^2/(V s), equal to glass. Zeta = -mobility x viscosity / permittivity, computed here.',
  },
];

/** Writes the built-in entries by key (inserted, or updated when the values here changed). */
export async function ensureBuiltInLibrary(orm: MikroORM): Promise<void> {
  await orm.em.fork().transactional(async (em) => {
    for (const e of BUILT_IN_LIBRARY) {
      await run(
        em,
        `insert into library_items (workspace_id, built_in_key, kind, name, values, source, created_at, updated_at)
         values (null, ?, ?, ?, ?::jsonb, ?, now(), now())
         on conflict (built_in_key) do update set kind = excluded.kind, name = excluded.name, values = excluded.values,
           source = excluded.source, updated_at = now()
         where (library_items.kind, library_items.name, library_items.values, library_items.source)
           is distinct from (excluded.kind, excluded.name, excluded.values, excluded.source)`,
        [e.key, e.kind, e.name, JSON.stringify(e.values), e.source],
      );
    }
  });
}

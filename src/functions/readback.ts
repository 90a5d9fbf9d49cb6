import { levelText } from '../catalogue';
import { buildContents, ionLabel, parseReagentSpec, parseUnit } from '../engine';
import { TEMPERATURE_RULE, VOLUME_RULE, mixtureRows, optionalNumber } from './args';
import type { Cell } from './args';
import type { CellScalar } from './impl';

// READBACK: what each batch-record row was read as, so a reviewer can redo the arithmetic: the reagent it resolved
// to, its formula and molar mass (CIAAW 2021 sum of the form written), the assay or density or stock used, the moles
// it adds, its concentration in the final volume, and what it releases.

export const READBACK_HEADER = ['as typed', 'reagent', 'formula', 'molar mass (g/mol)', 'assay, density or stock', 'moles', 'final concentration (mol/L)', 'releases', 'row'];

export function readback(reagents: Cell, amounts: Cell, units: Cell, volume?: Cell, temperature?: Cell): CellScalar[][] {
  const rows = mixtureRows(reagents, amounts, units);
  const volumeL = optionalNumber(volume, 'volume', undefined, VOLUME_RULE);
  const temperatureC = optionalNumber(temperature, 'temperature', 25, TEMPERATURE_RULE);
  const contents = buildContents(rows, volumeL);
  const table: CellScalar[][] = [READBACK_HEADER];
  rows.forEach((row, i) => {
    const audit = contents.rows[i];
    const spec = parseReagentSpec(row.reagent, 'reagents', row.row);
    const r = spec.resolved.reagent;
    const water = spec.resolved.hydrateWater;
    const formula = water > 0 ? `${r.formula}·${water}H2O` : r.formula;
    const unit = parseUnit(row.unit, 'units', row.row);
    const basis = spec.stockM !== undefined
      ? `stock ${Number(spec.stockM.toPrecision(6))} mol/L`
      : r.liquid && (unit.kind === 'volume' || unit.kind === 'mass')
        ? `density ${r.liquid.densityGPerML} g/mL, assay ${r.liquid.massFraction} (${r.liquid.source}; ${levelText(r.liquid.level)})`
        : '';
    const concentrationM = audit.moles / contents.volumeL;
    const releases = [
      ...r.systems.map((s) => `${s.systemId} ${Number((s.count * concentrationM).toPrecision(6))} mol/L`),
      ...r.ions.map((ion) => `${ionLabel(ion.ionId)} ${Number((ion.count * concentrationM).toPrecision(6))} mol/L`),
    ].join('; ');
    table.push([`${row.amount} ${row.unit} ${row.reagent}`, r.name, formula, spec.resolved.molarMassGPerMol, basis, audit.moles, concentrationM, releases || 'nothing', row.row]);
  });
  table.push(['final volume (L)', contents.volumeL, volumeL === undefined ? 'from the rows (stock volumes added, or 1 L for concentrations)' : 'as given', '', '', '', '', '', '']);
  table.push(['temperature (°C)', temperatureC, '', '', '', '', '', '', '']);
  return table;
}

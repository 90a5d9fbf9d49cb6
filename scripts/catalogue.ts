// npm run catalogue [-- reagents | sit]: the catalogue as CSV with the source of every value, for a reviewer
// to check constants against the literature or file with a validation record.
import { ACID_SYSTEMS, CATALOGUE_VERSION, REAGENTS, SIT_EPSILON, SIT_ESTIMATE_SOURCE, levelLabel } from '../src/catalogue';
import { dpKaPerK, molarMassOfReagent } from '../src/engine';
import { csvField } from './lib/csv';

const line = (cells: (string | number | undefined)[]): string => cells.map((c) => csvField(c === undefined ? '' : String(c))).join(',');

/** One row per protonation step: the constants the engine uses, with their source and range. */
export function systemsCsv(): string {
  const rows = [line(['catalogue', 'system', 'step', 'acid form', 'base form', 'pKa (25 °C, I = 0)', 'ΔrH° (kJ/mol)', 'ΔrCp° (J/(K·mol))', 'dpKa/dT at 25 °C (/K)', 'range (°C)', 'source', 'model limits of the system (warnings)',
    'pKa provenance', 'ΔrH° provenance', 'ΔrCp° provenance', 'measured range (°C)', 'alternative pKa', 'alternative source and rule'])];
  for (const s of ACID_SYSTEMS) {
    const limits = [
      s.concentrationLimit && `total above ${s.concentrationLimit.maxTotalM} mol/L (${s.concentrationLimit.source})`,
      s.formSolubility && `${s.forms[s.formSolubility.formIndex]} above ${s.formSolubility.maxM} mol/L at ${s.formSolubility.temperatureC} °C (${s.formSolubility.source})`,
      s.bindsIons && `with ${s.bindsIons.ionIds.join(', ')} (${s.bindsIons.source})`,
    ].filter(Boolean).join('; ');
    s.steps.forEach((st, k) => rows.push(line([CATALOGUE_VERSION, s.name, k + 1, s.forms[k], s.forms[k + 1], st.pKa, st.dHkJPerMol, st.dCpJPerKMol,
      Number(dpKaPerK(st, 25).toFixed(4)), `${s.temperatureRangeC[0]}–${s.temperatureRangeC[1]}`, st.source, limits,
      levelLabel(st.provenance.pKa), levelLabel(st.provenance.dH), levelLabel(st.provenance.dCp),
      s.measuredRangeC ? `${s.measuredRangeC[0]}–${s.measuredRangeC[1]}` : `${s.temperatureRangeC[0]}–${s.temperatureRangeC[1]}`,
      st.alternative?.pKa, st.alternative && `${st.alternative.provenance.source} (${levelLabel(st.alternative.provenance)}); ${st.alternative.rule}`])));
  }
  return rows.join('\n') + '\n';
}

/** One row per reagent: what it is, what it releases, its molar mass from the formula and the handbook value. */
export function reagentsCsv(): string {
  const rows = [line(['catalogue', 'reagent', 'aliases', 'formula', 'hydrate water', 'releases', 'molar mass (g/mol, CIAAW 2021)', 'handbook (g/mol)', 'handbook source', 'liquid: density (g/mL), assay', 'liquid source', 'handbook level', 'liquid level'])];
  for (const r of REAGENTS) {
    const releases = [...r.systems.map((s) => `${s.count} ${s.systemId}`), ...r.ions.map((i) => `${i.count} ${i.ionId}`)].join('; ');
    rows.push(line([CATALOGUE_VERSION, r.name, r.aliases.join('; '), r.formula, r.hydrateWater, releases, Number(molarMassOfReagent(r).toFixed(3)),
      r.handbookMolarMass?.gPerMol, r.handbookMolarMass?.source, r.liquid ? `${r.liquid.densityGPerML}, ${r.liquid.massFraction}` : undefined, r.liquid?.source,
      r.handbookMolarMass && levelLabel({ level: r.handbookMolarMass.level, source: r.handbookMolarMass.source }), r.liquid && levelLabel({ level: r.liquid.level, source: r.liquid.source })]));
  }
  return rows.join('\n') + '\n';
}

/** The sit model's ε table: one row per published pair with its uncertainty and source, then the estimate rule. */
export function sitEpsilonCsv(): string {
  const rows = [line(['catalogue', 'cation', 'anion', 'ε at 25 °C (kg/mol)', '± (kg/mol)', 'source'])];
  for (const r of SIT_EPSILON) rows.push(line([CATALOGUE_VERSION, r.cation, r.anion, r.epsilon, r.uncertainty, r.source]));
  rows.push(line([CATALOGUE_VERSION, 'any other pair', '', '', '', SIT_ESTIMATE_SOURCE]));
  return rows.join('\n') + '\n';
}

if (require.main === module) {
  const which = process.argv[2];
  process.stdout.write(which === 'reagents' ? reagentsCsv() : which === 'sit' ? sitEpsilonCsv() : systemsCsv());
}

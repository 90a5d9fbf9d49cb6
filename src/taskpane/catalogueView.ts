import { strongIonById } from '../catalogue';
import type { AcidSystem } from '../catalogue';
import {
  allReagents, allSystems, apparentPKas, compositionMassGPerMol, dpKaPerK, ionLabel, molarMassOfReagent, normaliseName, parseFormula,
  pKaAt, systemFor, withoutHydrogens,
} from '../engine';

// What the pane shows of the catalogue, as plain data (no DOM), so it can be tested in Node.

export interface SearchHit {
  kind: 'system' | 'reagent';
  systemId: string;
  label: string;
  detail: string;
}

function matches(query: string, ...texts: string[]): boolean {
  const q = normaliseName(query).replace(/[·.*]/g, '');
  if (q === '') return true;
  return texts.some((t) => normaliseName(t).replace(/[·.*]/g, '').includes(q));
}

/** Systems and reagents whose name, alias or formula contains the query; optionally only systems with a pKa within ±1 of a pH. */
export function searchCatalogue(query: string, nearPH?: number, temperatureC = 25): SearchHit[] {
  const near = (system: AcidSystem): boolean =>
    nearPH === undefined || system.steps.some((s) => Math.abs(pKaAt(s, temperatureC) - nearPH) <= 1);
  const hits: SearchHit[] = [];
  for (const s of allSystems()) {
    if (!near(s)) continue;
    if (matches(query, s.name, s.id, ...s.aliases)) {
      hits.push({ kind: 'system', systemId: s.id, label: s.name, detail: `pKa ${s.steps.map((st) => pKaAt(st, temperatureC).toFixed(2)).join(', ')}` });
    }
  }
  for (const r of allReagents()) {
    const systemId = r.systems[0]?.systemId;
    if (!systemId || !near(systemFor(systemId))) continue;
    const formula = r.hydrateWater > 0 ? `${r.formula}·${r.hydrateWater}H2O` : r.formula;
    if (matches(query, r.name, formula, ...r.aliases)) {
      hits.push({ kind: 'reagent', systemId, label: r.name, detail: `${formula}, ${molarMassOfReagent(r).toFixed(2)} g/mol` });
    }
  }
  return hits.slice(0, 60);
}

export interface StepView { step: number; pKa: number; apparentPKa: number; dpKaPerK: number; source: string }
export interface FormView { label: string; charge: number; molarMassGPerMol?: number }
export interface ReagentView { name: string; formula: string; molarMassGPerMol: number }
export interface SystemView {
  id: string;
  name: string;
  steps: StepView[];
  forms: FormView[];
  reagents: ReagentView[];
  rangeC: [number, number];
  notes: string;
}

/** Protons a single-system reagent's system part has lost, from its counter-ions (Na2HPO4 → 2). */
function protonsLost(reagentIndex: number, systemId: string): number | undefined {
  const r = allReagents()[reagentIndex];
  if (r.systems.length !== 1 || r.systems[0].systemId !== systemId) return undefined;
  const z0 = systemFor(systemId).chargeMostProtonated;
  const ionCharge = r.ions.reduce((sum, ion) => sum + ion.count * (strongIonById(ion.ionId)?.charge ?? 0), 0);
  return z0 + ionCharge / r.systems[0].count;
}

/** The strong ions a reagent brings along, as a key: 'Na+' for NaH2PO4, '' for a free acid or base. */
function counterIonKey(reagentIndex: number): string {
  return allReagents()[reagentIndex].ions.map((ion) => ion.ionId).sort().join(',');
}

/**
 * The acid and base forms to suggest for a target pH: the two states either side of the nearest pKa,
 * preferring a pair with the same counter-ion (or none on one side), so a buffer is not made of mixed salts.
 */
export function suggestedForms(systemId: string, targetPH: number, temperatureC: number): { acid?: string; base?: string } {
  const s = systemFor(systemId);
  let nearest = 0;
  s.steps.forEach((st, k) => { if (Math.abs(pKaAt(st, temperatureC) - targetPH) < Math.abs(pKaAt(s.steps[nearest], temperatureC) - targetPH)) nearest = k; });
  const all = allReagents();
  const inState = (state: number): number[] =>
    all.map((_, i) => i).filter((i) => !all[i].liquid && protonsLost(i, systemId) === state);
  const acids = inState(nearest);
  const bases = inState(nearest + 1);
  const compatible = (a: number, b: number): boolean => {
    const ka = counterIonKey(a);
    const kb = counterIonKey(b);
    return ka === kb || ka === '' || kb === '';
  };
  for (const a of acids) {
    const b = bases.find((candidate) => compatible(a, candidate));
    if (b !== undefined) return { acid: all[a].name, base: all[b].name };
  }
  return { acid: acids.length > 0 ? all[acids[0]].name : undefined, base: bases.length > 0 ? all[bases[0]].name : undefined };
}

export function systemView(systemId: string, temperatureC: number, ionicStrengthM: number): SystemView {
  const s = systemFor(systemId);
  const apparent = apparentPKas(s, temperatureC, ionicStrengthM);
  const steps = s.steps.map((st, i) => ({
    step: i + 1, pKa: pKaAt(st, temperatureC), apparentPKa: apparent[i], dpKaPerK: dpKaPerK(st, temperatureC), source: st.source,
  }));
  const top = s.formulaMostProtonated ? parseFormula(s.formulaMostProtonated).composition : undefined;
  const forms = s.forms.map((label, j) => ({
    label, charge: s.chargeMostProtonated - j,
    molarMassGPerMol: top ? compositionMassGPerMol(withoutHydrogens(top, j)) : undefined,
  }));
  const reagents = allReagents().filter((r) => r.systems.some((x) => x.systemId === s.id)).map((r) => ({
    name: r.name, formula: r.hydrateWater > 0 ? `${r.formula}·${r.hydrateWater}H2O` : r.formula, molarMassGPerMol: molarMassOfReagent(r),
  }));
  // What the model leaves out, as the cells' warnings will say it
  const limits = [
    ...(s.concentrationLimit ? [`Above ${s.concentrationLimit.maxTotalM} mol/L: ${s.concentrationLimit.reason}.`] : []),
    ...(s.formSolubility ? [`${s.forms[s.formSolubility.formIndex]} above about ${s.formSolubility.maxM} mol/L (${s.formSolubility.temperatureC} °C): ${s.formSolubility.consequence}.`] : []),
    ...(s.bindsIons ? [`With ${s.bindsIons.ionIds.map(ionLabel).join(' or ')}: ${s.bindsIons.reason}.`] : []),
  ];
  return { id: s.id, name: s.name, steps, forms, reagents, rangeC: s.temperatureRangeC, notes: [s.notes ?? '', ...limits].filter((n) => n !== '').join(' ') };
}

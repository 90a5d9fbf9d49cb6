import type { AcidSystem, Provenance, Reagent, StrongIon } from '../catalogue';
import { strongIonById } from '../catalogue';
import { ProticError, describeFailure, fail, quote } from './failure';
import { parseFormula, splitHydrate } from './formula';
import { catalogueLookalikeKeys, lookalikeKey, normaliseName } from './nameIndex';
import { clearCustomStore, setCustomDefinitions } from './customStore';
import { plainText, screenText } from './textScreen';

// Typed by the user: provenance level `user` for every constant a custom system defines.
const USER: Provenance = { level: 'user', source: 'user-defined in this workbook' };

// User-defined acid systems, carried in the workbook (document settings) or a --systems file.
// Our own JSON shape:
// { "systems": [ { "name": "...", "pKa": [7.1], "charge": 0, "dH": [20], "dCp": [-50],
//     "forms": [ { "name": "...", "formula": "...", "protonsLost": 0 } ] } ] }

export interface CustomFormDefinition { name: string; formula: string; protonsLost: number }
export interface CustomSystemDefinition { name: string; pKa: number[]; charge: number; dH?: number[]; dCp?: number[]; forms?: CustomFormDefinition[] }

/** Names: letters, digits, spaces and a little punctuation; never markup. */
const SAFE_NAME = /^[\p{L}\p{N} ()+,.'-]{1,60}$/u;
/** Elements in a form's formula taken as its counter-ions, and the strong ion each releases. */
const COUNTER_IONS: Record<string, string> = { Na: 'Na+', K: 'K+', Li: 'Li+', Cl: 'Cl-', Br: 'Br-' };

function checkName(value: unknown, argument: string): string {
  if (typeof value === 'string') screenText(value, argument); // a look-alike or invisible character is named and located
  if (typeof value !== 'string' || !SAFE_NAME.test(value.trim())) {
    fail({ code: 'bad_argument', argument, received: quote(value), expected: 'a name of 1 to 60 letters, digits, spaces or ( ) + , . \' -' });
  }
  return plainText(value).trim();
}

/**
 * A custom name must not be, or look like, a catalogue name: compared after NFKC, look-alike folding, case,
 * spaces and punctuation, so "Тris base" (Cyrillic Т) or "TRIS-base" is taken.
 */
function claimName(name: string, argument: string, taken: Map<string, string>): void {
  const key = lookalikeKey(name);
  const owner = taken.get(key);
  if (owner !== undefined) {
    fail({ code: 'bad_argument', argument, received: quote(name), expected: `a name not already used: it reads as ${quote(owner)}, a catalogue or custom name` });
  }
  taken.set(key, name);
}

function checkNumberList(value: unknown, argument: string, length: number | undefined, lo: number, hi: number, unit: string): number[] {
  if (!Array.isArray(value) || value.length === 0 || value.length > 6 || (length !== undefined && value.length !== length)) {
    fail({ code: 'bad_argument', argument, received: quote(Array.isArray(value) ? `${value.length} values` : value), expected: `a list of ${length ?? '1 to 6'} numbers` });
  }
  return value.map((v, i) => {
    if (typeof v !== 'number' || !Number.isFinite(v) || v < lo || v > hi) {
      fail({ code: 'out_of_range', argument: `${argument} ${i + 1}`, received: quote(v), expected: `a number from ${lo} to ${hi} ${unit}` });
    }
    return v;
  });
}

function buildSystem(def: Record<string, unknown>, index: number, taken: Map<string, string>): { system: AcidSystem; reagents: Reagent[] } {
  const where = `custom system ${index + 1}`;
  const name = checkName(def.name, `${where} name`);
  const key = normaliseName(name);
  claimName(name, `${where} name`, taken);
  const pKa = checkNumberList(def.pKa, `${where} pKa`, undefined, -2, 16, '');
  for (let i = 1; i < pKa.length; i++) {
    if (!(pKa[i] > pKa[i - 1])) fail({ code: 'bad_argument', argument: `${where} pKa`, received: pKa.join(', '), expected: 'pKa values in increasing order, first proton lost first' });
  }
  const charge = def.charge;
  if (typeof charge !== 'number' || !Number.isInteger(charge) || charge < -6 || charge > 6) {
    fail({ code: 'bad_argument', argument: `${where} charge`, received: quote(charge), expected: 'the whole-number charge of the most protonated form, −6 to 6' });
  }
  const dH = def.dH === undefined ? undefined : checkNumberList(def.dH, `${where} dH`, pKa.length, -200, 200, 'kJ/mol');
  const dCp = def.dCp === undefined ? undefined : checkNumberList(def.dCp, `${where} dCp`, pKa.length, -1000, 1000, 'J/(K·mol)');
  if (dCp && !dH) fail({ code: 'bad_argument', argument: `${where} dCp`, received: 'ΔrCp° without ΔrH°', expected: 'dH as well: ΔrCp° only bends a slope that ΔrH° sets' });
  const id = `custom:${key}`;
  const formsIn = def.forms === undefined ? [] : def.forms;
  if (!Array.isArray(formsIn) || formsIn.length > pKa.length + 1) fail({ code: 'bad_argument', argument: `${where} forms`, received: quote(Array.isArray(formsIn) ? `${formsIn.length} forms` : formsIn), expected: `at most ${pKa.length + 1} forms` });
  const reagents: Reagent[] = (formsIn as Record<string, unknown>[]).map((form, j) => {
    const formWhere = `${where} form ${j + 1}`;
    const formName = checkName(form?.name, `${formWhere} name`);
    claimName(formName, `${formWhere} name`, taken);
    if (typeof form.formula !== 'string' || form.formula.length > 100) fail({ code: 'bad_formula', argument: `${formWhere} formula`, received: quote(form.formula), expected: 'a formula such as C6H12NNaO4S', position: 1 });
    screenText(form.formula, `${formWhere} formula`);
    const formulaText = plainText(form.formula).trim();
    const parsed = parseFormula(formulaText, `${formWhere} formula`);
    const lost = form.protonsLost;
    if (typeof lost !== 'number' || !Number.isInteger(lost) || lost < 0 || lost > pKa.length) {
      fail({ code: 'bad_argument', argument: `${formWhere} protonsLost`, received: quote(lost), expected: `a whole number from 0 to ${pKa.length}` });
    }
    const ions = Object.entries(COUNTER_IONS).filter(([el]) => (parsed.anhydrous[el] ?? 0) > 0).map(([el, ionId]) => ({ ionId, count: parsed.anhydrous[el] }));
    const balance = charge - lost + ions.reduce((sum, ion) => sum + ion.count * (strongIonById(ion.ionId) as StrongIon).charge, 0);
    if (balance !== 0) {
      fail({ code: 'bad_argument', argument: `${formWhere} formula`, received: `${form.formula}, net charge ${balance}`, expected: 'a neutral salt: counter-ions (Na, K, Li, Cl, Br) that balance the form\'s charge' });
    }
    // the one hydrate grammar splits off the water, so it is counted once, whichever dot or count was written
    const anhydrousText = splitHydrate(formulaText)?.base ?? formulaText;
    return { id: `${id}:${j}`, name: formName, aliases: [], formula: anhydrousText, hydrateWater: parsed.hydrateWater, systems: [{ systemId: id, count: 1 }], ions };
  });
  const system: AcidSystem = {
    id, name, aliases: [], custom: true,
    chargeMostProtonated: charge,
    formulaMostProtonated: '',
    forms: pKa.concat([0]).map((_, j) => `${name} (${charge - j > 0 ? '+' : ''}${charge - j})`),
    steps: pKa.map((v, i) => ({
      pKa: v, dHkJPerMol: dH?.[i], dCpJPerKMol: dCp?.[i], source: 'user-defined in this workbook',
      provenance: { pKa: USER, dH: dH?.[i] === undefined ? null : USER, dCp: dCp?.[i] === undefined ? null : USER },
    })),
    temperatureRangeC: [0, 60],
    notes: 'User-defined; not part of the reviewed catalogue.',
  };
  return { system, reagents };
}

/** Validates custom definitions; returns the problems, one message each, or registers them. */
export function applyCustomDefinitions(json: unknown): string[] {
  const problems: string[] = [];
  const systems: AcidSystem[] = [];
  const reagents: Reagent[] = [];
  const list = (json as { systems?: unknown } | null)?.systems;
  if (!Array.isArray(list) || list.length > 100) return ['custom systems: expected an object with a "systems" list of at most 100 entries'];
  const taken = catalogueLookalikeKeys();
  list.forEach((def, i) => {
    try {
      if (typeof def !== 'object' || def === null) fail({ code: 'bad_argument', argument: `custom system ${i + 1}`, received: quote(def), expected: 'an object with name, pKa and charge' });
      const built = buildSystem(def as Record<string, unknown>, i, taken);
      systems.push(built.system);
      reagents.push(...built.reagents);
    } catch (error) {
      if (!(error instanceof ProticError)) throw error;
      problems.push(describeFailure(error.failure));
    }
  });
  if (problems.length === 0) setCustomDefinitions(systems, reagents);
  return problems;
}

export function clearCustomDefinitions(): void {
  clearCustomStore();
}

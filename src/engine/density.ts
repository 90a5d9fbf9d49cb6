import { DENSITY_ESTIMATE, DENSITY_FITS } from '../catalogue';
import type { AcidSystem, DensityFit } from '../catalogue';
import { fail } from './failure';
import { parseFormula, compositionMassGPerMol } from './formula';
import { ionLabel } from './ionLabel';
import { KeyTrie } from './keyTrie';
import { WATER_SOURCES, waterDensityKgPerL } from './water';

// The density of a solution from its composition, and from it the kilograms of water per litre of solution, which
// turns mol/L into mol/kg: m = c / w with w = ρsolution − Σ c·M (kg/L). Each solute's apparent specific volume comes
// from its fit (catalogue/densities.ts) at the total solute mass fraction and temperature, and the volumes add
// (Laliberté & Cooper 2004, J. Chem. Eng. Data 49, 1141, eqs. 2 and 12: 1/ρ = w_w/ρw + Σ w_i/ρapp,i).

/** One part of the solution as the density model sees it: an ion, a form of an acid system, or a neutral solute. */
export interface DensityPartAmount {
  /** catalogue part key (see DensityPart): `Na+`, `phosphate#1`, `excipient:sucrose` */
  part: string;
  /** as printed in messages: `Na⁺`, `H2PO4⁻`, `sucrose` */
  label: string;
  charge: number;
  concentrationM: number;
  molarMassGPerMol: number;
  /** contains carbon (for the estimate of a solute without a fit) */
  organic: boolean;
}

/** One solute the density was summed over: a salt paired from the ions, or a neutral solute. */
export interface DensitySolute {
  /** the fit's formula, or the parts' labels for an estimate */
  label: string;
  /** formula units per litre of solution */
  concentrationM: number;
  massGPerL: number;
  /** apparent specific volume at the solution, L per kg of solute */
  volumeLPerKg: number;
  basis: 'fit' | 'estimate';
  /** the fit's source, or the estimate's */
  source: string;
  /** for a fit used outside the temperatures or mass fraction of its data: what range it holds for */
  outsideFit?: string;
}

export interface SolutionDensity {
  temperatureC: number;
  /** density of the solution, kg/L */
  densityKgPerL: number;
  /** kilograms of water per litre of solution, ρsolution − Σ c·M: the mol/L → mol/kg factor */
  waterKgPerL: number;
  /** pure water at the temperature (Kell 1975), kg/L: what waterKgPerL becomes when dilute */
  pureWaterKgPerL: number;
  /** what the density was summed over: built when first read (SPECIES, CONSTANTS), not for every forward solve */
  readonly solutes: DensitySolute[];
  /** sentences for WARNINGS: estimated solutes or fits out of range, when they are a large part of the solution */
  readonly warnings: readonly string[];
  /** one line naming the sources, for CONSTANTS and SPECIES */
  readonly source: string;
  /** the parts it was computed from (to recompute it at another temperature) */
  parts: readonly DensityPartAmount[];
}

/**
 * Solutes are "a large part of the solution" from 25 g per litre (about 2.5 % of its mass): below it no density
 * warning, since the stated estimate's ±0.2 L/kg then moves the kg of water per litre by less than ±0.5 %.
 */
export const LARGE_SOLUTE_G_PER_L = 25;

const MIXING_RULE = 'Laliberté & Cooper 2004 mixing rule';

// fits by their parts: 'Na+|Cl-' for a salt (cation first), 'acetate#0' for a neutral solute
const FIT_BY_PARTS = new Map<string, DensityFit>();
for (const f of DENSITY_FITS) FIT_BY_PARTS.set(f.parts.map((p) => p.part).join('|'), f);
// salts by cation, then anion: looked up without building a key per pair
const SALT_FITS = new Map<string, Map<string, DensityFit>>();
for (const f of DENSITY_FITS) {
  if (f.parts.length !== 2) continue;
  const byAnion = SALT_FITS.get(f.parts[0].part) ?? new Map<string, DensityFit>();
  byAnion.set(f.parts[1].part, f);
  SALT_FITS.set(f.parts[0].part, byAnion);
}
const fitMolarMass = new Map<DensityFit, number>(DENSITY_FITS.map((f) => [f, compositionMassGPerMol(parseFormula(f.formula).composition)]));

/**
 * Apparent specific volume of a fitted solute, L/kg, at total solute mass fraction w and t °C: the reciprocal of the
 * apparent density of Laliberté & Cooper 2004, eq. 12, ρapp = (c0 w + c1) exp(1e−6 (t + c4)²) / (w + c2 + c3 t) kg/m³.
 * It is negative where the solute shrinks the solution (NaOH, Na2CO3 when dilute), which the reciprocal keeps finite.
 */
function fittedVolumeLPerKg(f: DensityFit, w: number, t: number): number {
  const [c0, c1, c2, c3, c4] = f.c;
  return (1000 * (w + c2 + c3 * t)) / ((c0 * w + c1) * Math.exp(1e-6 * (t + c4) ** 2));
}

/** A solute before it is printed: its label is built only when SPECIES, CONSTANTS or a warning reads it. */
interface Pending { fit?: DensityFit; first: DensityPartAmount; second?: DensityPartAmount; concentrationM: number; massKgPerL: number; estimateLPerKg: number }

/** Every Pending has the same fields in the same order, so the loops over them see one shape. */
function pending(fit: DensityFit | undefined, first: DensityPartAmount, second: DensityPartAmount | undefined, concentrationM: number, massKgPerL: number, estimateLPerKg: number): Pending {
  return { fit, first, second, concentrationM, massKgPerL, estimateLPerKg };
}

/** A solute's printed name: the fit's formula, or its parts' labels for an estimate. */
function labelOf(s: Pending): string {
  if (s.fit) return s.fit.formula;
  return s.second ? `${s.first.label} ${s.second.label}` : s.first.label;
}

const estimateOf = (organic: boolean): number => (organic ? DENSITY_ESTIMATE.organicLPerKg : DENSITY_ESTIMATE.inorganicLPerKg);

/** Pairs cations with anions in proportion to their equivalents (each cation's charge shared over the anions). */
function solutesOf(parts: readonly DensityPartAmount[]): Pending[] {
  // one pass sorts the parts by sign; the equivalents of each side are equal when the charges balance
  const cations: DensityPartAmount[] = [], anions: DensityPartAmount[] = [], neutrals: DensityPartAmount[] = [];
  let totalEq = 0;
  for (const p of parts) {
    if (!(p.concentrationM > 0)) continue;
    if (p.charge === 0) neutrals.push(p);
    else {
      (p.charge > 0 ? cations : anions).push(p);
      totalEq += Math.abs(p.charge) * p.concentrationM;
    }
  }
  totalEq /= 2;
  const out: Pending[] = [];
  for (const c of cations) {
    const byAnion = SALT_FITS.get(c.part);
    const cEq = c.charge * c.concentrationM;
    for (const a of anions) {
      const eq = (cEq * -a.charge * a.concentrationM) / totalEq; // equivalents per litre of the salt c–a
      const fit = byAnion?.get(a.part);
      if (fit) {
        const units = eq / (fit.parts[0].count * c.charge);
        out.push(pending(fit, c, a, units, (units * (fitMolarMass.get(fit) as number)) / 1000, estimateOf(false)));
      } else {
        const massGPerL = eq * (c.molarMassGPerMol / c.charge + a.molarMassGPerMol / -a.charge);
        out.push(pending(undefined, c, a, eq / c.charge, massGPerL / 1000, estimateOf(c.organic || a.organic)));
      }
    }
  }
  // an ion left without partners (a charge the parts do not balance) still occupies volume: estimated alone
  if (cations.length === 0 || anions.length === 0) {
    for (const p of [...cations, ...anions]) out.push(pending(undefined, p, undefined, p.concentrationM, (p.concentrationM * p.molarMassGPerMol) / 1000, estimateOf(p.organic)));
  }
  for (const n of neutrals) {
    const fit = FIT_BY_PARTS.get(n.part);
    const massKgPerL = fit ? (n.concentrationM * (fitMolarMass.get(fit) as number)) / 1000 : (n.concentrationM * n.molarMassGPerMol) / 1000;
    out.push(pending(fit, n, undefined, n.concentrationM, massKgPerL, estimateOf(n.organic)));
  }
  return out;
}

/** Apparent specific volume, L/kg, of a solute at total solute mass fraction w: its fit, or the stated estimate. */
function volumeOf(s: Pending, w: number, t: number): { lPerKg: number; fitted: boolean } {
  if (s.fit) {
    const v = fittedVolumeLPerKg(s.fit, w, t);
    if (Number.isFinite(v)) return { lPerKg: v, fitted: true };
  }
  return { lPerKg: s.estimateLPerKg, fitted: false };
}

/** Whether a solute's volume at w and t comes from its fit (a fit that is not finite there gives way to the estimate). */
function fittedAt(s: Pending, w: number, t: number): boolean {
  return s.fit !== undefined && Number.isFinite(fittedVolumeLPerKg(s.fit, w, t));
}

const fmt = (x: number, digits = 3): string => String(Number(x.toPrecision(digits)));

/**
 * Density of a solution and its kilograms of water per litre, from the parts it holds (mol/L) at t °C.
 * The volume balance of one litre, 1 = (ρ − Σ m_i)/ρw + Σ m_i v_i(x), x = Σ m_i/ρ the solute mass fraction, is solved
 * by substitution (v_i moves little with x) to 1e−12 kg/L, and refused when it does not settle or the solutes alone fill the litre.
 * @example solutionDensity([{ part: 'Na+', label: 'Na⁺', charge: 1, concentrationM: 1, molarMassGPerMol: 22.99, organic: false },
 *   { part: 'Cl-', label: 'Cl⁻', charge: -1, concentrationM: 1, molarMassGPerMol: 35.45, organic: false }], 25).densityKgPerL // ≈ 1.0369
 */
export function solutionDensity(parts: readonly DensityPartAmount[], temperatureC: number): SolutionDensity {
  const rhoW = waterDensityKgPerL(temperatureC);
  const pending = solutesOf(parts);
  let soluteMass = 0;
  for (const x of pending) soluteMass += x.massKgPerL;
  const rho = pending.length === 0 ? rhoW : settleDensity(pending, soluteMass, rhoW, temperatureC);
  return new ComputedDensity(temperatureC, rho, rhoW, parts, pending, soluteMass);
}

const NO_WARNINGS: readonly string[] = Object.freeze([]);

/** A density and what it was summed over; the solutes' table and the source line are built when first read. */
class ComputedDensity implements SolutionDensity {
  readonly waterKgPerL: number;
  readonly warnings: readonly string[];
  private solutesTable?: DensitySolute[];
  private sourceLine?: string;

  constructor(readonly temperatureC: number, readonly densityKgPerL: number, readonly pureWaterKgPerL: number, readonly parts: readonly DensityPartAmount[],
    private readonly pending: Pending[], private readonly soluteMassKgPerL: number) {
    this.waterKgPerL = densityKgPerL - soluteMassKgPerL;
    // a warning needs solutes of at least LARGE_SOLUTE_G_PER_L: below that in all, there is none to look for
    this.warnings = soluteMassKgPerL * 1000 < LARGE_SOLUTE_G_PER_L ? NO_WARNINGS : densityWarnings(this.solutes, pureWaterKgPerL, this.waterKgPerL);
  }

  get solutes(): DensitySolute[] {
    return (this.solutesTable ??= describeSolutes(this.pending, this.soluteMassKgPerL / this.densityKgPerL, this.temperatureC));
  }

  get source(): string {
    return (this.sourceLine ??= sourceOf(this.pending, this.soluteMassKgPerL / this.densityKgPerL, this.temperatureC, () => this.solutes));
  }
}

/** The solutes as SPECIES and CONSTANTS print them, at solute mass fraction w: volume, basis, source and range. */
function describeSolutes(pending: Pending[], w: number, temperatureC: number): DensitySolute[] {
  return pending.map((s) => {
    const v = volumeOf(s, w, temperatureC);
    const solute: DensitySolute = { label: labelOf(s), concentrationM: s.concentrationM, massGPerL: s.massKgPerL * 1000, volumeLPerKg: v.lPerKg, basis: v.fitted ? 'fit' : 'estimate',
      source: v.fitted && s.fit ? s.fit.source : DENSITY_ESTIMATE.source };
    const f = s.fit;
    if (f && v.fitted && (temperatureC < f.rangeC[0] || temperatureC > f.rangeC[1] || w > f.maxMassFraction)) {
      solute.outsideFit = `${f.rangeC[0]}–${f.rangeC[1]} °C, solute mass fraction up to ${fmt(f.maxMassFraction)}`;
    }
    return solute;
  });
}

/** A density candidate worth evaluating: finite and above zero. */
function usableDensity(rho: number): boolean {
  return Number.isFinite(rho) && rho > 0;
}

// the fits' temperature factors, masses and estimates of the solutes being settled, reused from call to call: the
// balance is evaluated synchronously and never re-entered, and nothing is allocated per density
let fitC0 = new Float64Array(8), fitC1 = new Float64Array(8), fitShift = new Float64Array(8), soluteKg = new Float64Array(8), estimateV = new Float64Array(8);
let fitted = new Uint8Array(8);

/** Apparent specific volume, L/kg, of settled solute i at solute mass fraction x: its fit, or its stated estimate. */
function settledVolume(i: number, x: number): number {
  if (fitted[i]) {
    const v = (x + fitShift[i]) / (fitC0[i] * x + fitC1[i]);
    if (Number.isFinite(v)) return v;
  }
  return estimateV[i];
}

/**
 * g(ρ) = ρw (1 − Σ m_i v_i(Σm/ρ)) + Σm − ρ, kg/L, over the n settled solutes; refused when the solutes alone would
 * fill the litre.
 */
function densityBalance(n: number, soluteMass: number, rhoW: number, r: number): number {
  const x = soluteMass / r;
  let soluteVolumeL = 0;
  for (let i = 0; i < n; i++) soluteVolumeL += soluteKg[i] * settledVolume(i, x);
  if (!(soluteVolumeL < 1)) {
    return fail({ code: 'no_convergence', argument: 'amounts', received: `solutes that would take up ${fmt(soluteVolumeL)} L of each litre of solution by themselves`,
      expected: 'a composition that can be dissolved: check the amounts, their units and the volume' });
  }
  return rhoW * (1 - soluteVolumeL) + soluteMass - r;
}

/**
 * The density, kg/L, at which the litre's volume balance closes: ρ = ρw (1 − Σ m_i v_i(x)) + Σ m_i with x = Σ m_i/ρ,
 * by substitution and secant steps to 1e−12 kg/L. Solutes that would fill the litre by themselves have no solution: a coded failure
 * (no_convergence, which an inverse search backs off from at its limit), as is a balance that does not settle.
 */
function settleDensity(solutes: Pending[], soluteMass: number, rhoW: number, temperatureC: number): number {
  const n = solutes.length;
  if (fitC0.length < n) {
    const size = 2 * n;
    fitC0 = new Float64Array(size); fitC1 = new Float64Array(size); fitShift = new Float64Array(size); soluteKg = new Float64Array(size);
    estimateV = new Float64Array(size); fitted = new Uint8Array(size);
  }
  // the fits' temperature factors do not depend on the composition: computed once, so each pass is arithmetic
  for (let i = 0; i < n; i++) {
    const s = solutes[i];
    soluteKg[i] = s.massKgPerL;
    estimateV[i] = s.estimateLPerKg;
    fitted[i] = s.fit ? 1 : 0;
    if (!s.fit) continue;
    const f = s.fit.c, scale = Math.exp(1e-6 * (temperatureC + f[4]) ** 2) / 1000;
    fitC0[i] = f[0] * scale; fitC1[i] = f[1] * scale; fitShift[i] = f[2] + f[3] * temperatureC;
  }
  // the substitution ρ ← ρ + g is a contraction; a secant step on g (once two points are known) takes it to
  // 1e−12 kg/L in a few passes where a steep fit would make substitution slow
  let rho = rhoW + 0.7 * soluteMass, g = densityBalance(n, soluteMass, rhoW, rho);
  let previous = NaN, gPrevious = NaN;
  for (let iter = 0; iter < 100; iter++) {
    const secant = Number.isFinite(previous) && g !== gPrevious ? (g * (rho - previous)) / (g - gPrevious) : NaN;
    const next = Number.isFinite(secant) && usableDensity(rho - secant) ? rho - secant : rho + g;
    previous = rho; gPrevious = g;
    rho = next;
    g = densityBalance(n, soluteMass, rhoW, rho);
    if (Math.abs(g) <= 1e-12 && Math.abs(rho - previous) <= 1e-9) return rho;
  }
  return fail({ code: 'no_convergence', argument: 'amounts', received: 'a solution density that did not settle', expected: 'a composition within the density fits; please report this case' });
}

function densityWarnings(solutes: DensitySolute[], rhoW: number, waterKgPerL: number): string[] {
  const warnings: string[] = [];
  for (const s of solutes) {
    if (s.outsideFit && s.massGPerL >= LARGE_SOLUTE_G_PER_L) {
      warnings.push(`density: ${s.label} at ${fmt(s.massGPerL)} g/L is outside the data its density fit was made to (${s.outsideFit}); the kg of water per litre, and so every molality, is extrapolated`);
    }
  }
  const estimated = solutes.filter((s) => s.basis === 'estimate');
  const estimatedMass = estimated.reduce((sum, s) => sum + s.massGPerL, 0);
  if (estimatedMass >= LARGE_SOLUTE_G_PER_L) {
    // w = ρw (1 − Σ m v): a ± in v moves w by ρw · m · ±v
    const percent = (100 * rhoW * (estimatedMass / 1000) * DENSITY_ESTIMATE.plusMinusLPerKg) / waterKgPerL;
    warnings.push(`density: no density data for ${estimated.map((s) => s.label).join(', ')} (${fmt(estimatedMass)} g/L): their volume is a stated estimate (${DENSITY_ESTIMATE.source}), so the kg of water per litre, and so every molality, is uncertain by about ±${fmt(percent, 2)} %`);
  }
  return warnings;
}

// the source line depends only on which solutes there are and whether each was fitted: one text per such list
const SOURCE_TEXTS = new KeyTrie<string>(2000);

// the key of the last line looked up (three texts per solute) and the line: a table's rows sum the same solutes
let lastSourceKey: string[] = [];
let sourceKeyScratch: string[] = [];
let lastSourceLine = '';

/** The source line of a density: the last one when the solutes are the same, else from the cache of lines seen before. */
function sourceOf(pending: Pending[], w: number, temperatureC: number, solutes: () => DensitySolute[]): string {
  // keyed by what the line prints (a custom form's label may change under the same part key)
  const key = sourceKeyScratch;
  key.length = 0;
  for (const s of pending) key.push(s.fit ? s.fit.formula : s.first.label, s.second && !s.fit ? s.second.label : '', fittedAt(s, w, temperatureC) ? 'fit' : 'estimate');
  let same = key.length === lastSourceKey.length;
  for (let k = 0; same && k < key.length; k++) same = key[k] === lastSourceKey[k];
  if (same) return lastSourceLine;
  let node = SOURCE_TEXTS.start();
  for (const k of key) node = SOURCE_TEXTS.step(node, k);
  lastSourceLine = node.value ?? SOURCE_TEXTS.set(node, sourceText(solutes()));
  // the key just walked becomes the last one; the previous array is reused for the next key
  sourceKeyScratch = lastSourceKey;
  lastSourceKey = key;
  return lastSourceLine;
}

function sourceText(solutes: DensitySolute[]): string {
  if (solutes.length === 0) return `pure water, ${WATER_SOURCES.density}`;
  const fits = solutes.filter((s) => s.basis === 'fit');
  const bySource = [...new Set(fits.map((s) => s.source))].map((source) => `fits for ${[...new Set(fits.filter((s) => s.source === source).map((s) => s.label))].join(', ')} (${source})`);
  const estimated = solutes.filter((s) => s.basis === 'estimate').map((s) => s.label);
  const parts = [...bySource, estimated.length > 0 ? `estimated: ${estimated.join(', ')}` : ''].filter(Boolean);
  return `${MIXING_RULE}; ${parts.join('; ')}; water ${WATER_SOURCES.density}`;
}

/** An acid system's total in a solution, with its ln Ka at the temperature (first proton lost first). */
export interface SystemAmount { system: AcidSystem; totalM: number; lnKa: Float64Array }

const H_MASS = compositionMassGPerMol({ H: 1 });
/** What a part is, apart from its amount: looked up once per ion id or acid form, then reused by every solve. */
type PartInfo = Omit<DensityPartAmount, 'concentrationM'>;
const ionInfo = new Map<string, PartInfo>();
const formInfo = new WeakMap<AcidSystem, PartInfo[]>();

function ionPart(id: string, charge: number, concentrationM: number): DensityPartAmount {
  let info = ionInfo.get(id);
  if (!info) {
    // the ion's formula is its id without the charge: Na+ → Na, ClO4- → ClO4, Ca2+ → Ca
    const composition = parseFormula(id.replace(/\d*[+-]$/, '')).composition;
    info = { part: id, label: ionLabel(id), charge, molarMassGPerMol: compositionMassGPerMol(composition), organic: (composition.C ?? 0) > 0 };
    ionInfo.set(id, info);
  }
  return { part: info.part, label: info.label, charge, concentrationM, molarMassGPerMol: info.molarMassGPerMol, organic: info.organic };
}

function formsOf(system: AcidSystem): PartInfo[] {
  let forms = formInfo.get(system);
  if (!forms) {
    // a user-defined system may have no formula: its forms get the stated molar mass of the estimate
    const composition = system.formulaMostProtonated ? parseFormula(system.formulaMostProtonated).composition : undefined;
    const top = composition ? { massGPerMol: compositionMassGPerMol(composition), organic: (composition.C ?? 0) > 0 } : { massGPerMol: DENSITY_ESTIMATE.unknownMolarMassGPerMol, organic: true };
    forms = Array.from({ length: system.steps.length + 1 }, (_, protonsLost) => ({
      part: `${system.id}#${protonsLost}`, label: system.forms[protonsLost] ?? `${system.name} form ${protonsLost}`, charge: system.chargeMostProtonated - protonsLost,
      molarMassGPerMol: top.massGPerMol - protonsLost * H_MASS, organic: top.organic,
    }));
    formInfo.set(system, forms);
  }
  return forms;
}

function formPart(system: AcidSystem, protonsLost: number, concentrationM: number): DensityPartAmount {
  const f = formsOf(system)[protonsLost];
  return { part: f.part, label: f.label, charge: f.charge, concentrationM, molarMassGPerMol: f.molarMassGPerMol, organic: f.organic };
}

/**
 * The order in which the systems' steps give up protons, strongest acid first, as index·8 + step (problem.ts's
 * stepOrder, computed once per problem and passed in by it).
 */
export function stepOrderOf(systems: readonly { lnKa: Float64Array }[]): Int32Array {
  // one system whose steps are strongest first (pKa increasing, as at 25 °C): an order shared by every such problem
  if (systems.length === 1 && descending(systems[0].lnKa)) return ONE_SYSTEM_ORDER[systems[0].lnKa.length] ?? sortedStepOrder(systems);
  return sortedStepOrder(systems);
}

function descending(xs: Float64Array): boolean {
  for (let k = 1; k < xs.length; k++) if (!(xs[k] < xs[k - 1])) return false;
  return true;
}

const ONE_SYSTEM_ORDER = Array.from({ length: 8 }, (_, n) => Int32Array.from({ length: n }, (_, k) => k));

function sortedStepOrder(systems: readonly { lnKa: Float64Array }[]): Int32Array {
  const order: number[] = [];
  systems.forEach((s, i) => s.lnKa.forEach((_, k) => order.push(i * 8 + k)));
  order.sort((a, b) => systems[b >> 3].lnKa[b & 7] - systems[a >> 3].lnKa[a & 7]);
  return Int32Array.from(order);
}

let lostScratch = new Float64Array(32);

/**
 * The parts of a solution by stoichiometry, for its density: the protons the systems must lose (strong-ion charge
 * plus their most protonated charges) go to the steps strongest acid first; what is left over is H⁺ (strong acid in
 * excess) or OH⁻ (strong base in excess). The density moves little with the exact speciation, and this keeps it a
 * property of the composition, fixed before the solve.
 * @example stoichiometricParts([], [{ id: 'Na+', charge: 1, concentrationM: 0.1 }, { id: 'Cl-', charge: -1, concentrationM: 0.1 }], [])
 *   // → Na⁺ 0.1 mol/L and Cl⁻ 0.1 mol/L
 */
export function stoichiometricParts(systems: SystemAmount[], ions: readonly { id: string; charge: number; concentrationM: number }[], neutrals: DensityPartAmount[],
  stepOrder: Int32Array = stepOrderOf(systems)): DensityPartAmount[] {
  let remaining = 0;
  for (const ion of ions) remaining += ion.charge * ion.concentrationM;
  for (const s of systems) remaining += s.totalM * s.system.chargeMostProtonated;
  const parts: DensityPartAmount[] = [];
  for (const ion of ions) parts.push(ionPart(ion.id, ion.charge, ion.concentrationM));
  // lost[i·8 + k]: mol/L of system i that has lost its step k (so at least k + 1 protons)
  if (lostScratch.length < systems.length * 8) lostScratch = new Float64Array(systems.length * 16);
  // reused: a typed array over 64 bytes is allocated outside the heap, and this runs once per prepared problem
  const lost = lostScratch;
  lost.fill(0, 0, systems.length * 8);
  for (let o = 0; o < stepOrder.length && remaining > 0; o++) {
    const code = stepOrder[o], i = code >> 3, k = code & 7;
    const available = k === 0 ? systems[i].totalM : lost[code - 1];
    const taken = Math.min(remaining, Math.max(0, available - lost[code]));
    lost[code] += taken;
    remaining -= taken;
  }
  for (let i = 0; i < systems.length; i++) {
    const s = systems[i], n = s.lnKa.length;
    for (let j = 0; j <= n; j++) {
      const atLeastJ = j === 0 ? s.totalM : lost[i * 8 + j - 1];
      const atLeastNext = j === n ? 0 : lost[i * 8 + j];
      const c = atLeastJ - atLeastNext;
      if (c > 0) parts.push(formPart(s.system, j, c));
    }
  }
  if (remaining < 0) parts.push(ionPart('H+', 1, -remaining));
  if (remaining > 0) parts.push(ionPart('OH-', -1, remaining));
  for (const n of neutrals) parts.push(n);
  return parts;
}

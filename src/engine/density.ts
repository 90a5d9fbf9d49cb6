import { DENSITY_ESTIMATE, DENSITY_FITS } from '../catalogue';
import type { AcidSystem, DensityFit } from '../catalogue';
import { fail } from './failure';
import { parseFormula, compositionMassGPerMol } from './formula';
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
  solutes: DensitySolute[];
  /** sentences for WARNINGS: estimated solutes or fits out of range, when they are a large part of the solution */
  warnings: string[];
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

interface Pending { label: string; concentrationM: number; massKgPerL: number; fit?: DensityFit; estimateLPerKg: number }

/** Pairs cations with anions in proportion to their equivalents (each cation's charge shared over the anions). */
function solutesOf(parts: DensityPartAmount[]): Pending[] {
  const cations = parts.filter((p) => p.charge > 0 && p.concentrationM > 0);
  const anions = parts.filter((p) => p.charge < 0 && p.concentrationM > 0);
  const eqOf = (p: DensityPartAmount): number => Math.abs(p.charge) * p.concentrationM;
  const totalEq = (cations.reduce((s, p) => s + eqOf(p), 0) + anions.reduce((s, p) => s + eqOf(p), 0)) / 2;
  const out: Pending[] = [];
  const estimate = (organic: boolean): number => (organic ? DENSITY_ESTIMATE.organicLPerKg : DENSITY_ESTIMATE.inorganicLPerKg);
  for (const c of cations) {
    for (const a of anions) {
      const eq = (eqOf(c) * eqOf(a)) / totalEq; // equivalents per litre of the salt c–a
      const fit = SALT_FITS.get(c.part)?.get(a.part);
      if (fit) {
        const units = eq / (fit.parts[0].count * c.charge);
        out.push({ label: fit.formula, concentrationM: units, massKgPerL: (units * (fitMolarMass.get(fit) as number)) / 1000, fit, estimateLPerKg: estimate(false) });
      } else {
        const massGPerL = eq * (c.molarMassGPerMol / c.charge + a.molarMassGPerMol / -a.charge);
        out.push({ label: `${c.label} ${a.label}`, concentrationM: eq / c.charge, massKgPerL: massGPerL / 1000, estimateLPerKg: estimate(c.organic || a.organic) });
      }
    }
  }
  // an ion left without partners (a charge the parts do not balance) still occupies volume: estimated alone
  if (cations.length === 0 || anions.length === 0) {
    for (const p of [...cations, ...anions]) out.push({ label: p.label, concentrationM: p.concentrationM, massKgPerL: (p.concentrationM * p.molarMassGPerMol) / 1000, estimateLPerKg: estimate(p.organic) });
  }
  for (const n of parts.filter((p) => p.charge === 0 && p.concentrationM > 0)) {
    const fit = FIT_BY_PARTS.get(n.part);
    const massKgPerL = fit ? (n.concentrationM * (fitMolarMass.get(fit) as number)) / 1000 : (n.concentrationM * n.molarMassGPerMol) / 1000;
    out.push({ label: fit ? fit.formula : n.label, concentrationM: n.concentrationM, massKgPerL, fit, estimateLPerKg: estimate(n.organic) });
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

const fmt = (x: number, digits = 3): string => String(Number(x.toPrecision(digits)));

/**
 * Density of a solution and its kilograms of water per litre, from the parts it holds (mol/L) at t °C.
 * The volume balance of one litre, 1 = (ρ − Σ m_i)/ρw + Σ m_i v_i(x), x = Σ m_i/ρ the solute mass fraction, is solved
 * by substitution (v_i moves little with x) to 1e−12 kg/L, and refused when it does not settle or the solutes alone fill the litre.
 * @example solutionDensity([{ part: 'Na+', label: 'Na⁺', charge: 1, concentrationM: 1, molarMassGPerMol: 22.99, organic: false },
 *   { part: 'Cl-', label: 'Cl⁻', charge: -1, concentrationM: 1, molarMassGPerMol: 35.45, organic: false }], 25).densityKgPerL // ≈ 1.0369
 */
export function solutionDensity(parts: DensityPartAmount[], temperatureC: number): SolutionDensity {
  const rhoW = waterDensityKgPerL(temperatureC);
  const solutes = solutesOf(parts);
  const soluteMass = solutes.reduce((s, x) => s + x.massKgPerL, 0);
  const { rho, volumes } = solutes.length === 0 ? { rho: rhoW, volumes: [] } : settleDensity(solutes, soluteMass, rhoW, temperatureC);
  const w = soluteMass / rho;
  const out: DensitySolute[] = solutes.map((s, i) => {
    const v = volumes[i];
    const solute: DensitySolute = { label: s.label, concentrationM: s.concentrationM, massGPerL: s.massKgPerL * 1000, volumeLPerKg: v.lPerKg, basis: v.fitted ? 'fit' : 'estimate',
      source: v.fitted && s.fit ? s.fit.source : DENSITY_ESTIMATE.source };
    const f = s.fit;
    if (f && v.fitted && (temperatureC < f.rangeC[0] || temperatureC > f.rangeC[1] || w > f.maxMassFraction)) {
      solute.outsideFit = `${f.rangeC[0]}–${f.rangeC[1]} °C, solute mass fraction up to ${fmt(f.maxMassFraction)}`;
    }
    return solute;
  });
  const waterKgPerL = rho - soluteMass;
  // the source line is text for CONSTANTS and SPECIES only: built when first read, not for every forward solve
  let source: string | undefined;
  return {
    temperatureC, densityKgPerL: rho, waterKgPerL, pureWaterKgPerL: rhoW, solutes: out, warnings: densityWarnings(out, rhoW, waterKgPerL), parts,
    get source(): string { return (source ??= sourceText(out)); },
  };
}

/** A density candidate worth evaluating: finite and above zero. */
function usableDensity(rho: number): boolean {
  return Number.isFinite(rho) && rho > 0;
}

/**
 * The density, kg/L, at which the litre's volume balance closes: ρ = ρw (1 − Σ m_i v_i(x)) + Σ m_i with x = Σ m_i/ρ,
 * by substitution and secant steps to 1e−12 kg/L. Solutes that would fill the litre by themselves have no solution: a coded failure
 * (no_convergence, which an inverse search backs off from at its limit), as is a balance that does not settle.
 */
function settleDensity(solutes: Pending[], soluteMass: number, rhoW: number, temperatureC: number): { rho: number; volumes: { lPerKg: number; fitted: boolean }[] } {
  // the fits' temperature factors do not depend on the composition: computed once, so each pass is arithmetic
  const n = solutes.length;
  const c0 = new Float64Array(n), c1 = new Float64Array(n), shift = new Float64Array(n), mass = new Float64Array(n);
  solutes.forEach((s, i) => {
    mass[i] = s.massKgPerL;
    if (!s.fit) return;
    const f = s.fit.c, scale = Math.exp(1e-6 * (temperatureC + f[4]) ** 2) / 1000;
    c0[i] = f[0] * scale; c1[i] = f[1] * scale; shift[i] = f[2] + f[3] * temperatureC;
  });
  const volumeAt = (i: number, x: number): number => {
    const s = solutes[i];
    if (s.fit) {
      const v = (x + shift[i]) / (c0[i] * x + c1[i]);
      if (Number.isFinite(v)) return v;
    }
    return s.estimateLPerKg;
  };
  // g(ρ) = ρw (1 − Σ m_i v_i(Σm/ρ)) + Σm − ρ = 0: the substitution ρ ← ρ + g is a contraction; a secant step on g
  // (once two points are known) takes it to 1e−12 kg/L in a few passes where a steep fit would make substitution slow
  const balance = (r: number): number => {
    const x = soluteMass / r;
    let soluteVolumeL = 0;
    for (let i = 0; i < n; i++) soluteVolumeL += mass[i] * volumeAt(i, x);
    if (!(soluteVolumeL < 1)) {
      return fail({ code: 'no_convergence', argument: 'amounts', received: `solutes that would take up ${fmt(soluteVolumeL)} L of each litre of solution by themselves`,
        expected: 'a composition that can be dissolved: check the amounts, their units and the volume' });
    }
    return rhoW * (1 - soluteVolumeL) + soluteMass - r;
  };
  let rho = rhoW + 0.7 * soluteMass, g = balance(rho);
  let previous = NaN, gPrevious = NaN;
  for (let iter = 0; iter < 100; iter++) {
    const secant = Number.isFinite(previous) && g !== gPrevious ? (g * (rho - previous)) / (g - gPrevious) : NaN;
    const next = Number.isFinite(secant) && usableDensity(rho - secant) ? rho - secant : rho + g;
    previous = rho; gPrevious = g;
    rho = next;
    g = balance(rho);
    if (Math.abs(g) <= 1e-12 && Math.abs(rho - previous) <= 1e-9) {
      const x = soluteMass / rho;
      return { rho, volumes: solutes.map((_, i) => volumeOf(solutes[i], x, temperatureC)) };
    }
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
const ionMass = new Map<string, { massGPerMol: number; organic: boolean }>();
const topMass = new WeakMap<AcidSystem, { massGPerMol: number; organic: boolean }>();

function ionPart(id: string, charge: number, concentrationM: number): DensityPartAmount {
  let m = ionMass.get(id);
  if (!m) {
    // the ion's formula is its id without the charge: Na+ → Na, ClO4- → ClO4, Ca2+ → Ca
    const composition = parseFormula(id.replace(/\d*[+-]$/, '')).composition;
    m = { massGPerMol: compositionMassGPerMol(composition), organic: (composition.C ?? 0) > 0 };
    ionMass.set(id, m);
  }
  return { part: id, label: printedIon(id), charge, concentrationM, molarMassGPerMol: m.massGPerMol, organic: m.organic };
}

const SUPERSCRIPT: Record<string, string> = { '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹', '+': '⁺', '-': '⁻' };
/** An ion id as printed: Na+ → Na⁺, Ca2+ → Ca²⁺. */
function printedIon(id: string): string {
  return id.replace(/(\d*[+-])$/, (charge) => charge.split('').map((ch) => SUPERSCRIPT[ch]).join(''));
}

function formPart(system: AcidSystem, protonsLost: number, concentrationM: number): DensityPartAmount {
  let top = topMass.get(system);
  if (!top) {
    // a user-defined system may have no formula: its forms get the stated molar mass of the estimate
    const composition = system.formulaMostProtonated ? parseFormula(system.formulaMostProtonated).composition : undefined;
    top = composition ? { massGPerMol: compositionMassGPerMol(composition), organic: (composition.C ?? 0) > 0 } : { massGPerMol: DENSITY_ESTIMATE.unknownMolarMassGPerMol, organic: true };
    topMass.set(system, top);
  }
  return {
    part: `${system.id}#${protonsLost}`, label: system.forms[protonsLost] ?? `${system.name} form ${protonsLost}`, charge: system.chargeMostProtonated - protonsLost,
    concentrationM, molarMassGPerMol: top.massGPerMol - protonsLost * H_MASS, organic: top.organic,
  };
}

/**
 * The parts of a solution by stoichiometry, for its density: the protons the systems must lose (strong-ion charge
 * plus their most protonated charges) go to the steps strongest acid first; what is left over is H⁺ (strong acid in
 * excess) or OH⁻ (strong base in excess). The density moves little with the exact speciation, and this keeps it a
 * property of the composition, fixed before the solve.
 */
export function stoichiometricParts(systems: SystemAmount[], ions: { id: string; charge: number; concentrationM: number }[], neutrals: DensityPartAmount[]): DensityPartAmount[] {
  let remaining = 0;
  for (const ion of ions) remaining += ion.charge * ion.concentrationM;
  for (const s of systems) remaining += s.totalM * s.system.chargeMostProtonated;
  const parts: DensityPartAmount[] = ions.map((ion) => ionPart(ion.id, ion.charge, ion.concentrationM));
  // lost[i][k]: mol/L of system i that has lost its step k (so at least k + 1 protons)
  const lost = systems.map((s) => new Float64Array(s.lnKa.length));
  const steps = systems.flatMap((s, i) => Array.from(s.lnKa, (lnKa, k) => ({ i, k, lnKa })));
  steps.sort((a, b) => b.lnKa - a.lnKa);
  for (const st of steps) {
    if (!(remaining > 0)) break;
    const available = st.k === 0 ? systems[st.i].totalM : lost[st.i][st.k - 1];
    const taken = Math.min(remaining, Math.max(0, available - lost[st.i][st.k]));
    lost[st.i][st.k] += taken;
    remaining -= taken;
  }
  systems.forEach((s, i) => {
    const n = s.lnKa.length;
    for (let j = 0; j <= n; j++) {
      const atLeastJ = j === 0 ? s.totalM : lost[i][j - 1];
      const atLeastNext = j === n ? 0 : lost[i][j];
      const c = atLeastJ - atLeastNext;
      if (c > 0) parts.push(formPart(s.system, j, c));
    }
  });
  if (remaining < 0) parts.push(ionPart('H+', 1, -remaining));
  if (remaining > 0) parts.push({ ...ionPart('OH-', -1, remaining) });
  return [...parts, ...neutrals];
}

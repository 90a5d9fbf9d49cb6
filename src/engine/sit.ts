import { SIT_ESTIMATE_UNCERTAINTY, sitEpsilonRow, sitEstimate } from '../catalogue';
import { KeyTrie } from './keyTrie';
import type { Problem } from './problem';

// The specific ion interaction theory (Brønsted–Guggenheim–Scatchard form, as the NEA TDB reviews use it):
// log10 γi = −zi² D + Σk ε(i,k) mk, D = A√Im/(1 + 1.5√Im). The D term is the problem's scalar
// L = ln γ / z² (the Bates–Guggenheim factor); this module holds the rest: for each species an additive
// ln γ offset ln10·Σk ε(i,k) mk, and ln aw from the SIT osmotic coefficient. The offsets of the water
// ions and the system forms depend on the speciation, so the solver settles them with the solution.

/** The SIT's b = 1.5 kg^½ mol^-½ at every temperature (NEA TDB convention, Grenthe et al. 1997). */
export const SIT_B = 1.5;
/** Offsets and ln aw count as settled when a refresh moves them less than this (ln units; about 4e-13 pH). */
export const SIT_TOLERANCE = 1e-12;
/** Molar mass of water, kg/mol (IAPWS, common practice). */
const WATER_KG_PER_MOL = 0.018015268;

/** A charge-type estimate the solve used in place of a published ε. */
export interface EstimatedPair { cation: string; anion: string; epsilon: number; cationIndex: number; anionIndex: number }

/**
 * The SIT part of a problem. Species order: the variable species (H⁺, OH⁻, then each system's forms from
 * `formStart[i]`) followed by the strong ions; ε matrices carry ln 10 and are symmetric.
 */
export interface SitState {
  formStart: Int32Array;
  nVariable: number;
  charges: Float64Array;
  keys: string[];
  /** the pairs with an ε, each once: species a, species b, ln10·ε; those of two variable species first (`variablePairs` of them) */
  pairA: Int32Array;
  pairB: Int32Array;
  pairLnEps: Float64Array;
  variablePairs: number;
  /**
   * The strong ions' share, fixed while their molalities are (a solve does not move them): each variable species'
   * offset from its strong partners, and Σm, Σz²m and the pair sum of the strong ions among themselves. Refreshed
   * when a strong ion's molality differs from `strongMolal` (an inverse solve moves its own reagent's ions).
   */
  strongOffset: number[];
  strongMolal: number[];
  strongSumM: number;
  strongZ2M: number;
  strongPairSum: number;
  /** 1/ρw, L/kg: molality per mol/L */
  inverseRho: number;
  estimated: EstimatedPair[];
  /** ln γ offsets of the variable species in use */
  offset: number[];
  lnWaterActivity: number;
  // scratch for a refresh
  next: number[];
  nextLnWaterActivity: number;
  molal: number[];
}

/** What a species list fixes once and for all: keys, charges, where each system's forms start, and the ε pairs. */
interface SpeciesTable {
  keys: string[]; charges: Float64Array; formStart: Int32Array; nVariable: number;
  pairA: Int32Array; pairB: Int32Array; pairLnEps: Float64Array; variablePairs: number; estimated: EstimatedPair[];
  /** zeros as packed arrays of doubles, copied for each problem's offsets and scratch (see prepareSit) */
  zerosVariable: number[]; zerosAll: number[];
}
// one table per species list (catalogue ε): ion ids and form keys are made once, so the walk builds nothing
const speciesTables = new KeyTrie<SpeciesTable>(5000);

function speciesTable(problem: Problem): SpeciesTable {
  let node = speciesTables.step(speciesTables.step(speciesTables.start(), 'H+'), 'OH-');
  for (const s of problem.systems) for (const key of formKeysOf(s.system, s.lnCumK.length)) node = speciesTables.step(node, key);
  node = speciesTables.step(node, '|');
  for (const ion of problem.ions) node = speciesTables.step(node, ion.id);
  if (node.value) return node.value;
  const keys = ['H+', 'OH-'], charges = [1, -1];
  const formStart = new Int32Array(problem.systems.length);
  problem.systems.forEach((s, i) => {
    formStart[i] = keys.length;
    formKeysOf(s.system, s.lnCumK.length).forEach((key, j) => { keys.push(key); charges.push(s.z0 - j); });
  });
  const nVariable = keys.length;
  for (const ion of problem.ions) { keys.push(ion.id); charges.push(ion.charge); }
  const n = keys.length;
  const pairA: number[] = [], pairB: number[] = [], pairLnEps: number[] = [];
  const estimated: EstimatedPair[] = [];
  for (let a = 0; a < n; a++) {
    for (let b = 0; b < n; b++) {
      if (!(charges[a] > 0 && charges[b] < 0)) continue;
      // H⁺ with OH⁻: their product is Kw-small, and γH cancels from pH = pKw − log aw + log aOH; no pair
      if (a === 0 && b === 1) continue;
      const row = sitEpsilonRow(keys[a], keys[b]);
      const epsilon = row ? row.epsilon : sitEstimate(charges[a], charges[b], keys[b]);
      if (!row) estimated.push({ cation: keys[a], anion: keys[b], epsilon, cationIndex: a, anionIndex: b });
      if (epsilon !== 0) { pairA.push(a); pairB.push(b); pairLnEps.push(Math.LN10 * epsilon); }
    }
  }
  // the pairs of two variable species first: the refresh in a solve walks only these (see SitState.strongOffset)
  const order = pairLnEps.map((_, k) => k);
  const bothVariable = (k: number): boolean => pairA[k] < nVariable && pairB[k] < nVariable;
  order.sort((x, y) => Number(bothVariable(y)) - Number(bothVariable(x)) || x - y);
  const table: SpeciesTable = { keys, charges: Float64Array.from(charges), formStart, nVariable,
    pairA: Int32Array.from(order, (k) => pairA[k]), pairB: Int32Array.from(order, (k) => pairB[k]),
    pairLnEps: Float64Array.from(order, (k) => pairLnEps[k]), variablePairs: order.filter(bothVariable).length, estimated,
    zerosVariable: doubleZeros(nVariable), zerosAll: doubleZeros(n) };
  return speciesTables.set(node, table);
}

// a system's form keys (`phosphate/2`; a custom system's id may be reused with other data, so `id*z0/j` with its
// most protonated charge, on which the charge-type estimates depend; its forms carry no published ε), made once per system
const formKeys = new WeakMap<object, string[]>();
function formKeysOf(system: Problem['systems'][number]['system'], forms: number): string[] {
  let keys = formKeys.get(system);
  if (!keys || keys.length !== forms) {
    keys = Array.from({ length: forms }, (_, j) => `${system.id}${system.custom ? `*${system.chargeMostProtonated}` : ''}/${j}`);
    formKeys.set(system, keys);
  }
  return keys;
}

/** n zeros in an array whose elements are stored as doubles (built from a fraction, then zeroed, so it never holds small integers). */
function doubleZeros(n: number): number[] {
  const out: number[] = [];
  for (let i = 0; i < n; i++) out.push(0.5);
  return out.fill(0);
}

/**
 * Builds the SIT state for a prepared problem: the species list's table (keys, charges, ε pairs) is shared by every
 * problem with that list; the offsets and scratch are the problem's own.
 * @example prepareSit(prepareProblem(contents, 25, 'sit')).estimated // the charge-type ε estimates it uses
 */
export function prepareSit(problem: Problem): SitState {
  const t = speciesTable(problem);
  // copies of packed double arrays: a typed array over 64 bytes is allocated outside the heap, at about ten times the cost
  return {
    formStart: t.formStart, nVariable: t.nVariable, charges: t.charges, keys: t.keys, estimated: t.estimated,
    pairA: t.pairA, pairB: t.pairB, pairLnEps: t.pairLnEps, variablePairs: t.variablePairs, inverseRho: Math.exp(-problem.lnWaterDensity),
    // NaN: no strong share computed yet (a molality never equals NaN, so the first refresh computes it)
    strongOffset: t.zerosVariable.slice(), strongMolal: t.zerosAll.slice(t.nVariable).fill(NaN),
    strongSumM: 0, strongZ2M: 0, strongPairSum: 0,
    offset: t.zerosVariable.slice(), lnWaterActivity: 0, next: t.zerosVariable.slice(), nextLnWaterActivity: 0,
    molal: t.zerosAll.slice(),
  };
}

/** σ(x) = (3/x³)(1 + x − 1/(1+x) − 2 ln(1+x)) of the SIT osmotic coefficient; its series below x = 0.01. */
function osmoticSigma(x: number): number {
  if (x < 0.01) return 1 - 1.5 * x + 1.8 * x * x - 2 * x * x * x;
  return (3 / (x * x * x)) * (1 + x - 1 / (1 + x) - 2 * Math.log(1 + x));
}

/** Molalities (mol/kg, m = c/ρw as the engine converts) of every species at ln h with the problem's current constants. */
function fillMolalities(problem: Problem, sit: SitState, lnH: number): void {
  const m = sit.molal, rho = 1 / sit.inverseRho;
  m[0] = Math.exp(lnH) / rho;
  m[1] = Math.exp(problem.lnKwc - lnH) / rho;
  problem.systems.forEach((s, i) => {
    const cum = s.lnCumK, start = sit.formStart[i], c = problem.totalsM[i] / rho;
    let max = -Infinity;
    for (let j = 0; j < cum.length; j++) max = Math.max(max, cum[j] - j * lnH);
    let sum = 0;
    for (let j = 0; j < cum.length; j++) { const w = Math.exp(cum[j] - j * lnH - max); m[start + j] = w; sum += w; }
    for (let j = 0; j < cum.length; j++) m[start + j] = c > 0 ? (m[start + j] / sum) * c : 0;
  });
  problem.ions.forEach((ion, k) => { m[sit.nVariable + k] = ion.concentrationM / rho; });
}

/**
 * Computes, at ln h with the current constants, the offsets of the variable species (into `sit.next`) and ln aw.
 * Returns how far they are from those in use (ln units).
 * `atLastEvaluation`: ln h is the point of the last charge-balance evaluation, whose molalities of the
 * water ions and forms chargeBalanceJacobian has left in `sit.molal` (saves their exponentials).
 */
export function sitRefresh(problem: Problem, lnH: number, atLastEvaluation = false): number {
  const sit = problem.sit as SitState;
  if (!atLastEvaluation) fillMolalities(problem, sit, lnH);
  const m = sit.molal, nVar = sit.nVariable, next = sit.next, z = sit.charges, base = sit.strongOffset;
  if (strongShareMoved(problem, sit)) strongShare(sit);
  let sumM = sit.strongSumM, z2m = sit.strongZ2M, pairSum = sit.strongPairSum;
  // a variable species with its strong partners: Σ_b 2 ε m_a m_b = 2 m_a · (its strong offset)
  for (let a = 0; a < nVar; a++) {
    const ma = m[a];
    next[a] = base[a];
    sumM += ma;
    z2m += z[a] * z[a] * ma;
    pairSum += 2 * ma * base[a];
  }
  const pa = sit.pairA, pb = sit.pairB, pe = sit.pairLnEps;
  for (let k = 0; k < sit.variablePairs; k++) {
    const a = pa[k], b = pb[k], e = pe[k];
    next[a] += e * m[b];
    next[b] += e * m[a];
    pairSum += 2 * e * m[a] * m[b];
  }
  // SIT osmotic coefficient: Σm(1 − φ) = (2/3) ln10 A I^3/2 σ(b√I) − ln10 Σc Σa ε mc ma (the pair sum counts each pair twice)
  const ionic = z2m / 2, root = Math.sqrt(ionic);
  const oneMinusPhiSum = (2 / 3) * Math.LN10 * problem.debyeHuckelA * ionic * root * osmoticSigma(SIT_B * root) - pairSum / 2;
  sit.nextLnWaterActivity = -WATER_KG_PER_MOL * (sumM - oneMinusPhiSum);
  let change = Math.abs(sit.nextLnWaterActivity - sit.lnWaterActivity);
  for (let a = 0; a < nVar; a++) {
    change = Math.max(change, Math.abs(next[a] - sit.offset[a]));
  }
  return change;
}

/** Writes the strong ions' molalities into `sit.molal`; true when one differs from those the strong share was computed with. */
function strongShareMoved(problem: Problem, sit: SitState): boolean {
  const ions = problem.ions, m = sit.molal, nVar = sit.nVariable, held = sit.strongMolal;
  let moved = false;
  for (let k = 0; k < ions.length; k++) {
    const mk = ions[k].concentrationM * sit.inverseRho;
    m[nVar + k] = mk;
    if (mk !== held[k]) { held[k] = mk; moved = true; }
  }
  return moved;
}

/** The strong ions' share of the refresh (SitState.strongOffset), from the strong molalities in `sit.molal`. */
function strongShare(sit: SitState): void {
  const m = sit.molal, nVar = sit.nVariable, n = sit.keys.length, z = sit.charges, base = sit.strongOffset;
  let sumM = 0, z2m = 0, pairSum = 0;
  for (let a = nVar; a < n; a++) { sumM += m[a]; z2m += z[a] * z[a] * m[a]; }
  for (let a = 0; a < nVar; a++) base[a] = 0;
  const pa = sit.pairA, pb = sit.pairB, pe = sit.pairLnEps;
  for (let k = sit.variablePairs; k < pe.length; k++) {
    const a = pa[k], b = pb[k], e = pe[k];
    if (a < nVar) base[a] += e * m[b];
    else if (b < nVar) base[b] += e * m[a];
    else pairSum += 2 * e * m[a] * m[b];
  }
  sit.strongSumM = sumM;
  sit.strongZ2M = z2m;
  sit.strongPairSum = pairSum;
}

/**
 * Puts the offsets of the last refresh in use (the caller then sets the conditional constants). Returns the
 * first-order move of the root in ln h that the new constants cause at fixed L, −Δf/(∂f/∂ln h), from the
 * speciation of the refresh: the solver adds it to its iterate, so the lagged offsets do not slow Newton
 * down (a change of ln γ(H⁺) alone moves ln h by minus that change). `dfdy`: ∂f/∂ln h there, mol/L.
 */
export function sitApply(problem: Problem, dfdy = 0): number {
  const sit = problem.sit as SitState;
  const next = sit.next, off = sit.offset, m = sit.molal, rho = 1 / sit.inverseRho;
  const dH = next[0] - off[0];
  // f = h − oh + Σ c (z0 − ⟨j⟩) + strong; ∂f/∂lnKwc = −oh, ∂⟨j⟩/∂lnCumK[j] = α_j (j − ⟨j⟩)
  let df = -m[1] * rho * (sit.nextLnWaterActivity - sit.lnWaterActivity - dH - (next[1] - off[1]));
  const systems = problem.systems;
  for (let i = 0; i < systems.length; i++) {
    const start = sit.formStart[i], n = systems[i].lnCumK.length, c = problem.totalsM[i];
    if (!(c > 0)) continue;
    let mean = 0;
    for (let j = 0; j < n; j++) mean += j * m[start + j];
    mean /= c / rho;
    const d0 = next[start] - off[start];
    for (let j = 1; j < n; j++) df -= m[start + j] * rho * (j - mean) * (d0 - j * dH - (next[start + j] - off[start + j]));
  }
  for (let a = 0; a < sit.nVariable; a++) off[a] = next[a];
  sit.lnWaterActivity = sit.nextLnWaterActivity;
  const shift = dfdy > 0 ? -df / dfdy : -dH;
  return Number.isFinite(shift) ? shift : 0;
}

/** The offsets in use, and ln aw, to restore after a side computation re-solves the problem. */
export function sitSnapshot(problem: Problem): { offset: number[]; lnWaterActivity: number } | undefined {
  const sit = problem.sit;
  return sit ? { offset: sit.offset.slice(), lnWaterActivity: sit.lnWaterActivity } : undefined;
}

export function sitRestore(problem: Problem, snapshot: { offset: number[]; lnWaterActivity: number } | undefined): void {
  if (!problem.sit || !snapshot) return;
  const offset = problem.sit.offset;
  for (let a = 0; a < offset.length; a++) offset[a] = snapshot.offset[a];
  problem.sit.lnWaterActivity = snapshot.lnWaterActivity;
}

/**
 * ln γ offset of each strong ion at a solution (its counter-ions' molalities there), for SPECIES.
 * The variable species' offsets are the ones in use (`sit.offset`), with which the solution is consistent.
 */
export function sitStrongOffsets(problem: Problem, lnH: number): number[] {
  const sit = problem.sit as SitState;
  sitRefresh(problem, lnH);
  // the refresh in a solve leaves the strong ions' own offsets out (nothing in the solve reads them): every pair here
  const m = sit.molal, nVar = sit.nVariable, out = problem.ions.map(() => 0);
  for (let k = 0; k < sit.pairLnEps.length; k++) {
    const a = sit.pairA[k], b = sit.pairB[k], e = sit.pairLnEps[k];
    if (a >= nVar) out[a - nVar] += e * m[b];
    if (b >= nVar) out[b - nVar] += e * m[a];
  }
  return out;
}

/**
 * Pairs whose ε is a charge-type estimate and that matter at this solution: the cation and the anion each
 * at 1 mmol/kg or more and one of them at 0.02 mol/kg or more (where ± 0.10 kg/mol moves log γ by 0.002).
 */
export function sitEstimatesInUse(problem: Problem, lnH: number): EstimatedPair[] {
  const sit = problem.sit as SitState;
  fillMolalities(problem, sit, lnH);
  const m = sit.molal;
  return sit.estimated.filter((p) => {
    const a = m[p.cationIndex], b = m[p.anionIndex];
    return Math.min(a, b) >= 1e-3 && Math.max(a, b) * SIT_ESTIMATE_UNCERTAINTY >= 0.002;
  });
}

/**
 * ln γ offset of a species in a sodium chloride medium of molality `mediumMolal` (mol/kg): ln10·ε with
 * Na⁺ (anions) or Cl⁻ (cations) times the medium's molality. Used by PKA and FRACTIONS under `sit`,
 * whose stated ionic strength is read as NaCl medium (common practice for apparent constants).
 * @example naclMediumOffset('phosphate/2', -2, 1) // ln10 · (−0.15) · 1
 */
export function naclMediumOffset(key: string, charge: number, mediumMolal: number): number {
  if (charge === 0) return 0;
  const cation = charge > 0 ? key : 'Na+', anion = charge > 0 ? 'Cl-' : key;
  const row = sitEpsilonRow(cation, anion);
  const epsilon = row ? row.epsilon : sitEstimate(charge > 0 ? charge : 1, charge > 0 ? -1 : charge, anion);
  return Math.LN10 * epsilon * mediumMolal;
}

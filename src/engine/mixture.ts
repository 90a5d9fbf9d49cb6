import type { Reagent } from '../catalogue';
import { ProticError, fail, quote } from './failure';
import { MAX_COMPONENT_M } from './problem';
import { allReagents, readsAs, registryGeneration, resolveReagent } from './registry';
import type { ResolvedReagent } from './registry';
import { checkLength, plainText, screenText } from './textScreen';
import { parseUnit, splitMassStock, splitStock } from './units';
import type { Unit } from './units';
import { adjustedStockComposition, parseAdjustedStock } from './adjustedStock';
import { decodeHandle, handleReagent, looksLikeHandle } from './stockHandle';
import type { StockComposition } from './stockHandle';

/** One batch-record row: a reagent, an amount and its unit (row is 1-based, for messages). */
export interface MixtureRow {
  reagent: string;
  amount: number;
  unit: string;
  row: number;
}

/** What a row puts into the solution. */
export interface RowAudit {
  row: number;
  text: string;
  reagent: Reagent;
  /** moles of reagent formula units */
  moles: number;
  /** volume the row adds when it is a stock or liquid dispensed by volume, L */
  volumeL: number;
}

/** Moles of each acid system and strong ion in a final volume. */
export interface Contents {
  systemMoles: Map<string, number>;
  ionMoles: Map<string, number>;
  volumeL: number;
  rows: RowAudit[];
  /** warnings carried in by made solutions (a stock adjusted outside the model's range) */
  notes?: string[];
}

export interface ReagentSpec {
  resolved: ResolvedReagent;
  /** for a stock such as `1.2 M HCl`, its concentration in mol/L */
  stockM?: number;
  /** a made solution (a STOCK handle or a pH-adjusted stock): its reagent is one litre of it, stockM is 1 */
  made?: StockComposition;
}

// Resolved reagent texts, so a table that repeats the same reagents parses each once.
const specCache = new Map<string, ReagentSpec>();
let specCacheGeneration = -1;

/**
 * Readers tried first, on the screened text, before stocks and names: the one place where a text of another kind
 * (a STOCK handle, a stock with a pH such as `1 M Tris-HCl pH 8.0`) is recognised. Each returns its spec, or
 * undefined when the text is not its kind.
 */
export type SpecReader = (text: string, argument: string, row?: number) => ReagentSpec | undefined;
const SPEC_READERS: SpecReader[] = [(text, argument, row) => readAdjustedStock(text, argument, row)];

/** Adds a reader to the hook above (e.g. STOCK handles); cached parses are dropped so they see it. */
export function registerSpecReader(reader: SpecReader): void {
  SPEC_READERS.push(reader);
  specCache.clear();
}

/** Parses a reagent cell: a stock (`0.5 M NaOH`, `NaOH 1 M`, `1 N HCl`, `10% (w/v) NaOH`) or a catalogue name or formula. */
export function parseReagentSpec(text: string, argument: string, row?: number): ReagentSpec {
  if (specCacheGeneration !== registryGeneration()) {
    specCache.clear();
    specCacheGeneration = registryGeneration();
  }
  const hit = specCache.get(text);
  if (hit) return hit;
  const spec = parseReagentSpecUncached(text, argument, row);
  if (specCache.size > 10000) specCache.clear();
  specCache.set(text, spec);
  return spec;
}

/** A w/v stock holds at most 100 g per 100 mL: beyond that the solute outweighs a litre of water-like solution (stated limit). */
export const MAX_MASS_STOCK_G_PER_L = 1000;

function madeSpec(made: StockComposition, text: string): ReagentSpec {
  return { resolved: { reagent: handleReagent(made, text), molarMassGPerMol: 0, hydrateWater: 0, matchedBy: 'name' }, stockM: 1, made };
}

/** A stock with a pH, as on a bottle label: the first of the readers. */
const readAdjustedStock: SpecReader = (text, argument, row) => {
  const adjusted = parseAdjustedStock(text);
  return adjusted ? madeSpec(adjustedStockComposition(adjusted, text, argument, row), text) : undefined;
};

function parseReagentSpecUncached(raw: string, argument: string, row?: number): ReagentSpec {
  // a STOCK handle is read exactly as written, before any folding: its check digits cover every character
  if (looksLikeHandle(raw)) return madeSpec(decodeHandle(raw, argument, row), raw);
  screenText(raw, argument, row, (folded) => {
    const stock = splitStock(folded) ?? splitMassStock(folded);
    return readsAs(stock ? stock.rest : folded);
  });
  const text = plainText(raw).trim();
  for (const read of SPEC_READERS) {
    const spec = read(text, argument, row);
    if (spec) return spec;
  }
  checkLength(text, argument, row);
  const massStock = splitMassStock(text);
  if (massStock) {
    if (!(massStock.gramsPerL > 0)) fail({ code: 'bad_amount', argument, row, received: quote(raw), expected: 'a stock concentration above zero' });
    if (massStock.gramsPerL > MAX_MASS_STOCK_G_PER_L) {
      fail({ code: 'bad_amount', argument, row, received: quote(raw), expected: `at most ${MAX_MASS_STOCK_G_PER_L} g/L (100% w/v): a solution cannot hold more solute than that per litre; check the number and its unit` });
    }
    const resolved = resolveReagent(massStock.rest, argument, row);
    if (resolved.reagent.liquid) {
      fail({ code: 'bad_argument', argument, row, received: quote(raw), expected: `a solid or a formula before a mass concentration; ${resolved.reagent.name} is a liquid as sold (write its volume, or a stock in M)` });
    }
    // the hydrate as written (or named) sets the molar mass: 50 g/L of Na2HPO4·7H2O is 0.187 mol/L
    return checkedStock({ resolved, stockM: massStock.gramsPerL / resolved.molarMassGPerMol }, raw, argument, row);
  }
  const stock = splitStock(text);
  if (stock) {
    const resolved = resolveReagent(stock.rest, argument, row);
    const concentrationM = stock.normality === undefined ? stock.concentrationM : stock.normality / equivalentsPerMol(resolved.reagent, raw, argument, row);
    if (!(concentrationM > 0)) fail({ code: 'bad_amount', argument, row, received: quote(raw), expected: 'a stock concentration above zero' });
    if (resolved.reagent.liquid) {
      fail({ code: 'bad_argument', argument, row, received: quote(raw), expected: `a compound before a molarity; ${resolved.reagent.name} is a liquid as sold (write its volume, or ${resolved.reagent.formula} for the compound)` });
    }
    return checkedStock({ resolved, stockM: concentrationM }, raw, argument, row);
  }
  try {
    return { resolved: resolveReagent(text, argument, row) };
  } catch (error) {
    // the readable part of a STOCK cell without its exact part: it was cut short, say so
    if (error instanceof ProticError && error.failure.code === 'unknown_reagent' && /^[^:]{1,200}: \S/.test(text)) {
      fail({ code: 'bad_argument', argument, row, received: `the stock ${quote(text)}`, expected: 'a reagent, or a stock cell exactly as PROTIC.STOCK wrote it (this reads like a stock cell whose exact part is missing: it may have been cut short); make the stock again with STOCK rather than editing its text' });
    }
    throw error;
  }
}

/** Equivalents per mole for normality: strong acids and bases only, since elsewhere N depends on the reaction. */
function equivalentsPerMol(reagent: Reagent, text: string, argument: string, row?: number): number {
  if (reagent.normalityEqPerMol === undefined) {
    fail({ code: 'bad_unit', argument, row, received: quote(text),
      expected: `a molarity (M) for ${reagent.name}: normality (N) is taken only for strong acids and bases (HCl, HNO3, NaOH, KOH 1 eq/mol; H2SO4 2 eq/mol), since elsewhere it depends on the reaction` });
  }
  return reagent.normalityEqPerMol;
}

/**
 * A stock that cannot exist is refused: more of one component than any aqueous solution holds (MAX_COMPONENT_M),
 * more than the compound's solubility, or more concentrated than the pure liquid compound.
 */
function checkedStock(spec: ReagentSpec, text: string, argument: string, row?: number): ReagentSpec {
  const { reagent } = spec.resolved;
  const stockM = spec.stockM as number;
  const refuse = (why: string): never => fail({ code: 'bad_amount', argument, row, received: quote(text), expected: `a stock that can exist: ${why}; check the number and its unit` });
  if (reagent.solvent) fail({ code: 'bad_argument', argument, row, received: quote(text), expected: 'water as a row of its own, by volume: it is the solvent, not a stock' });
  for (const s of reagent.systems) if (stockM * s.count > MAX_COMPONENT_M) refuse(`at most ${MAX_COMPONENT_M} mol/L of any one component, and this is ${Number((stockM * s.count).toPrecision(4))} mol/L of ${s.systemId}`);
  for (const ion of reagent.ions) if (stockM * ion.count > MAX_COMPONENT_M) refuse(`at most ${MAX_COMPONENT_M} mol/L of any one component, and this is ${Number((stockM * ion.count).toPrecision(4))} mol/L of ${ion.ionId}`);
  if (reagent.solubilityLimit && stockM > reagent.solubilityLimit.maxM) {
    refuse(`${reagent.name} dissolves to at most about ${reagent.solubilityLimit.maxM} mol/L (${reagent.solubilityLimit.source})`);
  }
  const pure = allReagents().find((r) => r.liquid && r.liquid.massFraction === 1 && r.formula === reagent.formula);
  if (pure?.liquid) {
    const pureM = (pure.liquid.densityGPerML * 1000) / spec.resolved.molarMassGPerMol;
    if (stockM > pureM * (1 + 1e-9)) refuse(`the pure compound (${pure.name}) is ${Number(pureM.toPrecision(4))} mol/L`);
  }
  return spec;
}

/** Moles per litre of what is dispensed by volume (stock or catalogue liquid), or undefined for a solid. */
export function molesPerLitreDispensed(spec: ReagentSpec): number | undefined {
  if (spec.stockM !== undefined) return spec.stockM;
  const liquid = spec.resolved.reagent.liquid;
  if (liquid) return (liquid.densityGPerML * 1000 * liquid.massFraction) / spec.resolved.molarMassGPerMol;
  return undefined;
}

function rowMoles(spec: ReagentSpec, amount: number, unit: Unit, volumeL: number | undefined, row: MixtureRow): { moles: number; volumeL: number } {
  const value = amount * unit.toBase;
  const reagent = spec.resolved.reagent;
  const refuseUnit = (expected: string): never => fail({ code: 'bad_unit', argument: 'units', row: row.row, received: quote(row.unit), expected });
  if (reagent.solvent) {
    // the solvent adds its volume and nothing else; the volume rules are those of any dispensed liquid
    if (unit.kind !== 'volume') refuseUnit(`a volume (L mL µL) for ${reagent.name}, the solvent`);
    return { moles: 0, volumeL: value };
  }
  if (reagent.excipient?.nominalMolarMass && (unit.kind === 'amount' || unit.kind === 'concentration')) {
    refuseUnit(`a mass (g mg) or a mass concentration (g/L, % w/v) for ${reagent.name}: a mixture of molecules has only a nominal molar mass`);
  }
  switch (unit.kind) {
    case 'mass':
      if (spec.stockM !== undefined) refuseUnit('a volume (L mL µL) or an amount (mol mmol µmol) for a stock solution');
      {
        // a liquid as sold is weighed whole: only its assay fraction is the compound, and it brings its own volume
        const liquid = reagent.liquid;
        if (liquid) return { moles: (value * liquid.massFraction) / spec.resolved.molarMassGPerMol, volumeL: value / (liquid.densityGPerML * 1000) };
        return { moles: value / spec.resolved.molarMassGPerMol, volumeL: 0 };
      }
    case 'amount':
    case 'concentration':
      if (spec.made) refuseUnit(`a volume (L mL µL) of ${spec.made.name}, a made solution`);
      return unit.kind === 'amount' ? { moles: value, volumeL: 0 } : { moles: value * (volumeL ?? 1), volumeL: 0 };
    case 'massConcentration':
      if (spec.stockM !== undefined) refuseUnit('a volume (L mL µL) or an amount (mol mmol µmol) for a stock solution');
      if (reagent.liquid && reagent.liquid.massFraction < 1) {
        refuseUnit(`a volume or a mass for ${reagent.name}, a liquid as sold: a mass concentration would not say whether it counts the liquid or the compound`);
      }
      return { moles: (value * (volumeL ?? 1)) / spec.resolved.molarMassGPerMol, volumeL: 0 };
    case 'normality':
      if (spec.stockM !== undefined) refuseUnit('a volume (L mL µL) or an amount (mol mmol µmol) for a stock solution');
      return { moles: (value / equivalentsPerMol(reagent, row.reagent, 'reagents', row.row)) * (volumeL ?? 1), volumeL: 0 };
    case 'volume': {
      const perL = molesPerLitreDispensed(spec);
      if (perL === undefined) {
        const sold = allReagents().filter((r) => r.liquid && r.formula === reagent.formula).map((r) => r.name);
        refuseUnit(sold.length > 0
          ? `a mass or amount for ${reagent.name}, the pure compound; by volume write the liquid as sold (${sold.join(', ')}) or a stock such as 1 M ${reagent.formula}`
          : `a mass or amount for ${reagent.name}, a solid; a volume needs a stock (1 M ...) or a liquid with a catalogue density`);
      }
      return { moles: value * (perL as number), volumeL: value };
    }
  }
}

export function addReagent(contents: Contents, reagent: Reagent, moles: number): void {
  for (const s of reagent.systems) contents.systemMoles.set(s.systemId, (contents.systemMoles.get(s.systemId) ?? 0) + moles * s.count);
  for (const ion of reagent.ions) contents.ionMoles.set(ion.ionId, (contents.ionMoles.get(ion.ionId) ?? 0) + moles * ion.count);
}

/**
 * Turns batch-record rows into moles in a final volume. An empty mixture is refused (pure water is a
 * `water` row). The volume is needed when any row is a mass, an amount or a volume; with only concentrations none is; with only stock volumes (and
 * concentrations) the volumes are added (additive-volume assumption).
 */
export function buildContents(rows: MixtureRow[], volumeL: number | undefined): Contents {
  return contentsFromParsed(rows.map((row) => ({ row, spec: parseReagentSpec(row.reagent, 'reagents', row.row), unit: parseUnit(row.unit, 'units', row.row) })), volumeL);
}

/** A row whose reagent text and unit are already parsed (the cell layer parses a column once for a whole table). */
export interface ParsedRow {
  row: MixtureRow;
  spec: ReagentSpec;
  unit: Unit;
}

/** `buildContents` for rows already parsed, in row order: the same checks, the same failures. */
export function contentsFromParsed(parsed: ParsedRow[], volumeL: number | undefined): Contents {
  if (parsed.length === 0) {
    fail({ code: 'bad_argument', argument: 'reagents', received: 'no reagent rows', expected: 'at least one row; for pure water write a row water (or WFI) with its volume' });
  }
  let finalVolumeL = volumeL;
  if (finalVolumeL === undefined) {
    const needsVolume = parsed.find((p) => p.unit.kind === 'mass' || p.unit.kind === 'amount');
    if (needsVolume) {
      fail({ code: 'missing_volume', argument: 'volume', row: needsVolume.row.row, received: 'no volume',
        expected: `the final volume in litres, because row ${needsVolume.row.row} is a ${needsVolume.unit.kind} (${needsVolume.unit.symbol})` });
    }
    const volumes = parsed.filter((p) => p.unit.kind === 'volume');
    if (volumes.length > 0) finalVolumeL = volumes.reduce((sum, p) => sum + p.row.amount * p.unit.toBase, 0);
  }
  if (finalVolumeL !== undefined && !(finalVolumeL > 0)) {
    fail({ code: 'bad_argument', argument: 'volume', received: `${finalVolumeL} L`, expected: 'a final volume above zero, in litres' });
  }
  const contents: Contents = { systemMoles: new Map(), ionMoles: new Map(), volumeL: finalVolumeL ?? 1, rows: [] };
  for (const p of parsed) {
    const { moles, volumeL: rowVolumeL } = rowMoles(p.spec, p.row.amount, p.unit, finalVolumeL, p.row);
    // an excipient changes no equilibrium, so the component cap never sees it: its mass per litre is bounded here
    if (p.spec.resolved.reagent.excipient && (moles * p.spec.resolved.molarMassGPerMol) / contents.volumeL > MAX_MASS_STOCK_G_PER_L) {
      fail({ code: 'out_of_range', argument: 'amounts', row: p.row.row, received: `${p.spec.resolved.reagent.name} at ${Number(((moles * p.spec.resolved.molarMassGPerMol) / contents.volumeL).toPrecision(4))} g/L`,
        expected: `at most ${MAX_MASS_STOCK_G_PER_L} g per litre of the final solution; check the amount, its unit and the volume` });
    }
    addReagent(contents, p.spec.resolved.reagent, moles);
    contents.rows.push({ row: p.row.row, text: p.row.reagent, reagent: p.spec.resolved.reagent, moles, volumeL: rowVolumeL });
    const note = p.spec.made?.warning;
    if (note && !(contents.notes ??= []).includes(note)) contents.notes.push(note);
  }
  // The final volume includes every volume dispensed into it: less than that is a typo, not a solution.
  const dispensedL = contents.rows.reduce((sum, r) => sum + r.volumeL, 0);
  if (volumeL !== undefined && dispensedL > volumeL * (1 + 1e-9)) {
    fail({ code: 'bad_argument', argument: 'volume', received: `${volumeL} L`,
      expected: `at least the ${Number(dispensedL.toPrecision(4))} L of stocks and liquids the rows add, since the final volume includes them` });
  }
  return contents;
}

/**
 * The same contents with each row's moles replaced (row r → moles[r]) and the final volume set: the maps rebuilt from
 * the rows' reagents as buildContents builds them, without its volume and mass checks, for differences of a mixture
 * already read (a step there may cross a check's edge, as a stock that fills the volume does).
 * @example contentsWithMoles(c, c.rows.map((r) => r.moles * 1.0001), c.volumeL) // every row 0.01 % more
 */
export function contentsWithMoles(contents: Contents, moles: readonly number[], volumeL: number): Contents {
  const out: Contents = { systemMoles: new Map(), ionMoles: new Map(), volumeL, rows: [], notes: contents.notes };
  // every key of the original, in its order (the problem's systems keep their indices; a system at zero stays)
  for (const k of contents.systemMoles.keys()) out.systemMoles.set(k, 0);
  for (const k of contents.ionMoles.keys()) out.ionMoles.set(k, 0);
  contents.rows.forEach((row, r) => {
    addReagent(out, row.reagent, moles[r]);
    // a dispensed row's volume follows its moles (a row at 0 dispenses none)
    out.rows.push({ ...row, moles: moles[r], volumeL: row.moles > 0 ? (row.volumeL * moles[r]) / row.moles : 0 });
  });
  return out;
}

/**
 * Moles of reagent a row holds per unit of its amount (a row's moles are proportional to its amount), from the
 * row's reagent and unit alone: no volume or mass check, so a row at 0 has its rate too.
 * @example molesPerUnit({ reagent: 'NaCl', amount: 0, unit: 'g', row: 1 }, 1) // 1/58.44 mol per g
 */
export function molesPerUnit(row: MixtureRow, volumeL: number | undefined): number {
  return rowMoles(parseReagentSpec(row.reagent, 'reagents', row.row), 1, parseUnit(row.unit, 'units', row.row), volumeL, row).moles;
}

export function cloneContents(contents: Contents): Contents {
  return { systemMoles: new Map(contents.systemMoles), ionMoles: new Map(contents.ionMoles), volumeL: contents.volumeL, rows: [...contents.rows], notes: contents.notes };
}

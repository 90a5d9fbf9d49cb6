import type { Reagent } from '../catalogue';
import { ProticError, fail, quote } from './failure';
import { registryGeneration, resolveReagent } from './registry';
import type { ResolvedReagent } from './registry';
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
 * Parses a reagent cell: a stock (`0.5 M NaOH`), a made solution (a STOCK handle, or a pH-adjusted
 * stock such as `1 M Tris-HCl pH 8.0`, whose composition the text alone fixes), or a
 * catalogue name or formula.
 */
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

function madeSpec(made: StockComposition, text: string): ReagentSpec {
  return { resolved: { reagent: handleReagent(made, text), molarMassGPerMol: 0, hydrateWater: 0, matchedBy: 'name' }, stockM: 1, made };
}

function parseReagentSpecUncached(text: string, argument: string, row: number | undefined): ReagentSpec {
  // made solutions first: a handle's readable part, or a bottle label, must never be read as a plain reagent
  if (looksLikeHandle(text)) return madeSpec(decodeHandle(text, argument, row), text);
  const adjusted = parseAdjustedStock(text);
  if (adjusted) return madeSpec(adjustedStockComposition(adjusted, text, argument, row), text);
  const massStock = splitMassStock(text);
  if (massStock) {
    if (!(massStock.gramsPerL > 0)) fail({ code: 'bad_amount', argument, row, received: quote(text), expected: 'a stock concentration above zero' });
    const resolved = resolveReagent(massStock.rest, argument, row);
    if (resolved.reagent.liquid) {
      fail({ code: 'bad_argument', argument, row, received: quote(text), expected: `a solid or a formula before a mass concentration; ${resolved.reagent.name} is a liquid as sold (write its volume, or a stock in M)` });
    }
    // the hydrate as written (or named) sets the molar mass: 50 g/L of Na2HPO4·7H2O is 0.187 mol/L
    return { resolved, stockM: massStock.gramsPerL / resolved.molarMassGPerMol };
  }
  const stock = splitStock(text);
  if (stock) {
    if (!(stock.concentrationM > 0)) fail({ code: 'bad_amount', argument, row, received: quote(text), expected: 'a stock concentration above zero' });
    return { resolved: resolveReagent(stock.rest, argument, row), stockM: stock.concentrationM };
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

/** Moles per litre of what is dispensed by volume (stock or catalogue liquid), or undefined for a solid. */
export function molesPerLitreDispensed(spec: ReagentSpec): number | undefined {
  if (spec.stockM !== undefined) return spec.stockM;
  const liquid = spec.resolved.reagent.liquid;
  if (liquid) return (liquid.densityGPerML * 1000 * liquid.massFraction) / spec.resolved.molarMassGPerMol;
  return undefined;
}

function rowMoles(spec: ReagentSpec, amount: number, unit: Unit, volumeL: number | undefined, row: MixtureRow): { moles: number; volumeL: number } {
  const value = amount * unit.toBase;
  switch (unit.kind) {
    case 'mass':
      if (spec.stockM !== undefined) fail({ code: 'bad_unit', argument: 'units', row: row.row, received: quote(row.unit), expected: 'a volume (L mL µL) or an amount (mol mmol µmol) for a stock solution' });
      {
        // a liquid as sold is weighed whole: only its assay fraction is the compound, and it brings its own volume
        const liquid = spec.resolved.reagent.liquid;
        if (liquid) return { moles: (value * liquid.massFraction) / spec.resolved.molarMassGPerMol, volumeL: value / (liquid.densityGPerML * 1000) };
        return { moles: value / spec.resolved.molarMassGPerMol, volumeL: 0 };
      }
    case 'amount':
    case 'concentration':
      if (spec.made) fail({ code: 'bad_unit', argument: 'units', row: row.row, received: quote(row.unit), expected: `a volume (L mL µL) of ${spec.made.name}, a made solution` });
      return unit.kind === 'amount' ? { moles: value, volumeL: 0 } : { moles: value * (volumeL ?? 1), volumeL: 0 };
    case 'volume': {
      const perL = molesPerLitreDispensed(spec);
      if (perL === undefined) {
        fail({ code: 'bad_unit', argument: 'units', row: row.row, received: quote(row.unit),
          expected: `a mass or amount for ${spec.resolved.reagent.name}, a solid; a volume needs a stock (1 M ...) or a liquid with a catalogue density` });
      }
      return { moles: value * perL, volumeL: value };
    }
  }
}

export function addReagent(contents: Contents, reagent: Reagent, moles: number): void {
  for (const s of reagent.systems) contents.systemMoles.set(s.systemId, (contents.systemMoles.get(s.systemId) ?? 0) + moles * s.count);
  for (const ion of reagent.ions) contents.ionMoles.set(ion.ionId, (contents.ionMoles.get(ion.ionId) ?? 0) + moles * ion.count);
}

/**
 * Turns batch-record rows into moles in a final volume. The volume is needed when any row is a
 * mass, an amount or a volume; with only concentrations none is; with only stock volumes (and
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

export function cloneContents(contents: Contents): Contents {
  return { systemMoles: new Map(contents.systemMoles), ionMoles: new Map(contents.ionMoles), volumeL: contents.volumeL, rows: [...contents.rows], notes: contents.notes };
}

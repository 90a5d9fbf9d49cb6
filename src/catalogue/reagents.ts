import type { Reagent } from './types';

// Handbook molar masses, recalled (not checked): kept only as a cross-check of each formula and hydrate (a wrong water
// or counter-ion is off by 1 g/mol or more). The molar mass Protic uses is always the sum of the CIAAW 2021
// conventional atomic weights (elements.ts), which test/molarMass.ciaaw.test.ts checks independently.
export const CRC = 'CRC Handbook of Chemistry and Physics, physical constants of compounds';
// Densities and assays of concentrated liquids as sold.
export const CRC_DENSITY = 'CRC Handbook, concentrative properties of aqueous solutions, 20 °C';

export interface ReagentInput {
  id: string;
  name: string;
  aliases?: string[];
  formula: string;
  hydrateWater?: number;
  system?: string;
  systemCount?: number;
  /** for reagents that release more than one acid system */
  systemsMap?: Record<string, number>;
  ions?: Record<string, number>;
  liquid?: Reagent['liquid'];
  mm?: number;
  /** equivalents per mole, for normality: strong acids and bases only */
  eq?: number;
  solubility?: Reagent['solubilityLimit'];
  excipient?: Reagent['excipient'];
  solvent?: boolean;
}

export function r(input: ReagentInput): Reagent {
  return {
    id: input.id,
    name: input.name,
    aliases: input.aliases ?? [],
    formula: input.formula,
    hydrateWater: input.hydrateWater ?? 0,
    systems: input.systemsMap
      ? Object.entries(input.systemsMap).map(([systemId, count]) => ({ systemId, count }))
      : input.system ? [{ systemId: input.system, count: input.systemCount ?? 1 }] : [],
    ions: Object.entries(input.ions ?? {}).map(([ionId, count]) => ({ ionId, count })),
    liquid: input.liquid,
    handbookMolarMass: input.mm === undefined ? undefined : { gPerMol: input.mm, source: CRC, level: 'recalled' },
    ...(input.eq === undefined ? {} : { normalityEqPerMol: input.eq }),
    ...(input.solubility === undefined ? {} : { solubilityLimit: input.solubility }),
    ...(input.excipient === undefined ? {} : { excipient: input.excipient }),
    ...(input.solvent ? { solvent: true } : {}),
  };
}

export const REAGENTS: readonly Reagent[] = [
  // phosphate
  r({ id: 'h3po4', name: 'phosphoric acid', aliases: ['orthophosphoric acid'], formula: 'H3PO4', system: 'phosphate', mm: 97.99 }),
  r({ id: 'h3po4-85', name: 'phosphoric acid 85%', aliases: ['phosphoric acid 85 %', 'ortho-phosphoric acid 85%', 'concentrated phosphoric acid'], formula: 'H3PO4', system: 'phosphate',
    liquid: { densityGPerML: 1.685, massFraction: 0.85, source: CRC_DENSITY, level: 'recalled' } }),
  r({ id: 'nah2po4', name: 'sodium dihydrogen phosphate', aliases: ['monosodium phosphate', 'sodium phosphate monobasic'], formula: 'NaH2PO4', system: 'phosphate', ions: { 'Na+': 1 }, mm: 119.98 }),
  r({ id: 'nah2po4-1', name: 'sodium dihydrogen phosphate monohydrate', aliases: ['sodium phosphate monobasic monohydrate'], formula: 'NaH2PO4', hydrateWater: 1, system: 'phosphate', ions: { 'Na+': 1 }, mm: 137.99 }),
  r({ id: 'nah2po4-2', name: 'sodium dihydrogen phosphate dihydrate', aliases: ['sodium phosphate monobasic dihydrate'], formula: 'NaH2PO4', hydrateWater: 2, system: 'phosphate', ions: { 'Na+': 1 }, mm: 156.01 }),
  r({ id: 'na2hpo4', name: 'disodium hydrogen phosphate', aliases: ['disodium phosphate', 'sodium phosphate dibasic'], formula: 'Na2HPO4', system: 'phosphate', ions: { 'Na+': 2 }, mm: 141.96 }),
  r({ id: 'na2hpo4-2', name: 'disodium hydrogen phosphate dihydrate', aliases: ['sodium phosphate dibasic dihydrate'], formula: 'Na2HPO4', hydrateWater: 2, system: 'phosphate', ions: { 'Na+': 2 }, mm: 177.99 }),
  r({ id: 'na2hpo4-7', name: 'disodium hydrogen phosphate heptahydrate', aliases: ['sodium phosphate dibasic heptahydrate'], formula: 'Na2HPO4', hydrateWater: 7, system: 'phosphate', ions: { 'Na+': 2 }, mm: 268.07 }),
  r({ id: 'na2hpo4-12', name: 'disodium hydrogen phosphate dodecahydrate', aliases: ['sodium phosphate dibasic dodecahydrate'], formula: 'Na2HPO4', hydrateWater: 12, system: 'phosphate', ions: { 'Na+': 2 }, mm: 358.14 }),
  r({ id: 'na3po4', name: 'trisodium phosphate', aliases: ['sodium phosphate tribasic'], formula: 'Na3PO4', system: 'phosphate', ions: { 'Na+': 3 }, mm: 163.94 }),
  r({ id: 'na3po4-12', name: 'trisodium phosphate dodecahydrate', aliases: ['sodium phosphate tribasic dodecahydrate'], formula: 'Na3PO4', hydrateWater: 12, system: 'phosphate', ions: { 'Na+': 3 }, mm: 380.12 }),
  r({ id: 'kh2po4', name: 'potassium dihydrogen phosphate', aliases: ['monopotassium phosphate', 'potassium phosphate monobasic'], formula: 'KH2PO4', system: 'phosphate', ions: { 'K+': 1 }, mm: 136.09 }),
  r({ id: 'k2hpo4', name: 'dipotassium hydrogen phosphate', aliases: ['dipotassium phosphate', 'potassium phosphate dibasic'], formula: 'K2HPO4', system: 'phosphate', ions: { 'K+': 2 }, mm: 174.18 }),
  r({ id: 'k2hpo4-3', name: 'dipotassium hydrogen phosphate trihydrate', aliases: ['potassium phosphate dibasic trihydrate'], formula: 'K2HPO4', hydrateWater: 3, system: 'phosphate', ions: { 'K+': 2 }, mm: 228.22 }),
  r({ id: 'k3po4', name: 'tripotassium phosphate', aliases: ['potassium phosphate tribasic'], formula: 'K3PO4', system: 'phosphate', ions: { 'K+': 3 }, mm: 212.27 }),
  // citrate
  r({ id: 'citric', name: 'citric acid', aliases: ['citric acid anhydrous'], formula: 'C6H8O7', system: 'citrate', mm: 192.12 }),
  r({ id: 'citric-1', name: 'citric acid monohydrate', formula: 'C6H8O7', hydrateWater: 1, system: 'citrate', mm: 210.14 }),
  r({ id: 'kh2cit', name: 'potassium dihydrogen citrate', aliases: ['monopotassium citrate'], formula: 'KH2C6H5O7', system: 'citrate', ions: { 'K+': 1 }, mm: 230.21 }),
  r({ id: 'nah2cit', name: 'sodium dihydrogen citrate', aliases: ['monosodium citrate'], formula: 'NaH2C6H5O7', system: 'citrate', ions: { 'Na+': 1 }, mm: 214.11 }),
  r({ id: 'na2hcit-15', name: 'disodium hydrogen citrate sesquihydrate', aliases: ['disodium citrate sesquihydrate'], formula: 'Na2HC6H5O7', hydrateWater: 1.5, system: 'citrate', ions: { 'Na+': 2 }, mm: 263.11 }),
  r({ id: 'na3cit', name: 'trisodium citrate', aliases: ['sodium citrate anhydrous', 'sodium citrate tribasic anhydrous'], formula: 'Na3C6H5O7', system: 'citrate', ions: { 'Na+': 3 }, mm: 258.07 }),
  r({ id: 'na3cit-2', name: 'trisodium citrate dihydrate', aliases: ['sodium citrate dihydrate', 'sodium citrate tribasic dihydrate'], formula: 'Na3C6H5O7', hydrateWater: 2, system: 'citrate', ions: { 'Na+': 3 }, mm: 294.10 }),
  r({ id: 'k3cit-1', name: 'tripotassium citrate monohydrate', aliases: ['potassium citrate monohydrate'], formula: 'K3C6H5O7', hydrateWater: 1, system: 'citrate', ions: { 'K+': 3 }, mm: 324.41 }),
  // acetate
  r({ id: 'acetic', name: 'acetic acid', aliases: ['ethanoic acid', 'HOAc', 'AcOH'], formula: 'CH3COOH', system: 'acetate', mm: 60.05 }),
  r({ id: 'acetic-glacial', name: 'glacial acetic acid', aliases: ['acetic acid glacial', 'acetic acid 100%'], formula: 'CH3COOH', system: 'acetate',
    liquid: { densityGPerML: 1.049, massFraction: 1.0, source: CRC_DENSITY, level: 'recalled' } }),
  r({ id: 'naoac', name: 'sodium acetate', aliases: ['sodium acetate anhydrous', 'NaOAc', 'NaAc'], formula: 'CH3COONa', system: 'acetate', ions: { 'Na+': 1 }, mm: 82.03 }),
  r({ id: 'naoac-3', name: 'sodium acetate trihydrate', formula: 'CH3COONa', hydrateWater: 3, system: 'acetate', ions: { 'Na+': 1 }, mm: 136.08 }),
  r({ id: 'koac', name: 'potassium acetate', aliases: ['KOAc'], formula: 'CH3COOK', system: 'acetate', ions: { 'K+': 1 }, mm: 98.14 }),
  r({ id: 'nh4oac', name: 'ammonium acetate', aliases: ['NH4OAc'], formula: 'CH3COONH4', systemsMap: { acetate: 1, ammonium: 1 }, mm: 77.08 }),
  // carbonate
  r({ id: 'nahco3', name: 'sodium bicarbonate', aliases: ['sodium hydrogen carbonate'], formula: 'NaHCO3', system: 'carbonate', ions: { 'Na+': 1 }, mm: 84.01 }),
  r({ id: 'na2co3', name: 'sodium carbonate', aliases: ['sodium carbonate anhydrous', 'soda ash'], formula: 'Na2CO3', system: 'carbonate', ions: { 'Na+': 2 }, mm: 105.99 }),
  r({ id: 'na2co3-1', name: 'sodium carbonate monohydrate', formula: 'Na2CO3', hydrateWater: 1, system: 'carbonate', ions: { 'Na+': 2 }, mm: 124.00 }),
  r({ id: 'nh4hco3', name: 'ammonium bicarbonate', aliases: ['ammonium hydrogen carbonate'], formula: 'NH4HCO3', systemsMap: { ammonium: 1, carbonate: 1 }, mm: 79.06 }),
  r({ id: 'na2co3-10', name: 'sodium carbonate decahydrate', aliases: ['washing soda'], formula: 'Na2CO3', hydrateWater: 10, system: 'carbonate', ions: { 'Na+': 2 }, mm: 286.14 }),
  r({ id: 'khco3', name: 'potassium bicarbonate', aliases: ['potassium hydrogen carbonate'], formula: 'KHCO3', system: 'carbonate', ions: { 'K+': 1 }, mm: 100.12 }),
  r({ id: 'k2co3', name: 'potassium carbonate', formula: 'K2CO3', system: 'carbonate', ions: { 'K+': 2 }, mm: 138.21 }),
  // borate
  r({ id: 'h3bo3', name: 'boric acid', aliases: ['orthoboric acid'], formula: 'H3BO3', system: 'borate', mm: 61.83 }),
  r({ id: 'borax-10', name: 'borax decahydrate', aliases: ['borax', 'sodium tetraborate decahydrate', 'disodium tetraborate decahydrate'], formula: 'Na2B4O7', hydrateWater: 10, system: 'borate', systemCount: 4, ions: { 'Na+': 2 }, mm: 381.37 }),
  r({ id: 'borax', name: 'sodium tetraborate', aliases: ['borax anhydrous', 'disodium tetraborate'], formula: 'Na2B4O7', system: 'borate', systemCount: 4, ions: { 'Na+': 2 }, mm: 201.22 }),
  // phthalate, oxalate, tartrate, succinate, formate, lactate, maleate
  r({ id: 'khp', name: 'potassium hydrogen phthalate', aliases: ['KHP', 'potassium biphthalate', 'potassium acid phthalate'], formula: 'KHC8H4O4', system: 'phthalate', ions: { 'K+': 1 }, mm: 204.22 }),
  r({ id: 'phthalic', name: 'phthalic acid', formula: 'C8H6O4', system: 'phthalate', mm: 166.13 }),
  r({ id: 'oxalic-2', name: 'oxalic acid dihydrate', formula: 'H2C2O4', hydrateWater: 2, system: 'oxalate', mm: 126.07 }),
  r({ id: 'oxalic', name: 'oxalic acid', aliases: ['oxalic acid anhydrous'], formula: 'H2C2O4', system: 'oxalate', mm: 90.03 }),
  r({ id: 'na2ox', name: 'sodium oxalate', formula: 'Na2C2O4', system: 'oxalate', ions: { 'Na+': 2 }, mm: 134.00 }),
  // The pH 1.68 calibration salt: one K⁺ and two oxalate units, three protons between them.
  r({ id: 'ktetrox-2', name: 'potassium tetroxalate dihydrate', aliases: ['potassium tetraoxalate dihydrate', 'potassium trihydrogen dioxalate dihydrate'],
    formula: 'KH3(C2O4)2', hydrateWater: 2, systemsMap: { oxalate: 2 }, ions: { 'K+': 1 }, mm: 254.19 }),
  r({ id: 'tartaric', name: 'L-tartaric acid', aliases: ['tartaric acid'], formula: 'C4H6O6', system: 'tartrate', mm: 150.09 }),
  r({ id: 'khtart', name: 'potassium hydrogen tartrate', aliases: ['potassium bitartrate', 'cream of tartar'], formula: 'KHC4H4O6', system: 'tartrate', ions: { 'K+': 1 }, mm: 188.18 }),
  r({ id: 'knatart-4', name: 'potassium sodium tartrate tetrahydrate', aliases: ['Rochelle salt', 'sodium potassium tartrate tetrahydrate'], formula: 'KNaC4H4O6', hydrateWater: 4, system: 'tartrate', ions: { 'K+': 1, 'Na+': 1 }, mm: 282.22 }),
  r({ id: 'succinic', name: 'succinic acid', formula: 'C4H6O4', system: 'succinate', mm: 118.09 }),
  r({ id: 'na2succ-6', name: 'disodium succinate hexahydrate', aliases: ['sodium succinate hexahydrate'], formula: 'Na2C4H4O4', hydrateWater: 6, system: 'succinate', ions: { 'Na+': 2 }, mm: 270.14 }),
  r({ id: 'nh4hcoo', name: 'ammonium formate', formula: 'HCOONH4', systemsMap: { formate: 1, ammonium: 1 }, mm: 63.06 }),
  r({ id: 'formic', name: 'formic acid', formula: 'HCOOH', system: 'formate', mm: 46.03 }),
  r({ id: 'nahcoo', name: 'sodium formate', formula: 'HCOONa', system: 'formate', ions: { 'Na+': 1 }, mm: 68.01 }),
  r({ id: 'lactic', name: 'lactic acid', aliases: ['DL-lactic acid'], formula: 'C3H6O3', system: 'lactate', mm: 90.08 }),
  r({ id: 'nalac', name: 'sodium lactate', formula: 'NaC3H5O3', system: 'lactate', ions: { 'Na+': 1 }, mm: 112.06 }),
  r({ id: 'maleic', name: 'maleic acid', formula: 'C4H4O4', system: 'maleate', mm: 116.07 }),
  // sulfate
  r({ id: 'h2so4', name: 'sulfuric acid', aliases: ['sulphuric acid'], formula: 'H2SO4', system: 'sulfate', mm: 98.08, eq: 2,
    solubility: { maxM: 18.8, source: 'CRC Handbook, the pure acid, density 1.83 g/mL at 20 °C, is 18.7 mol/L (from memory)' } }),
  r({ id: 'h2so4-96', name: 'sulfuric acid 96%', aliases: ['sulfuric acid 96 %', 'sulphuric acid 96%', 'concentrated sulfuric acid'], formula: 'H2SO4', system: 'sulfate', eq: 2,
    liquid: { densityGPerML: 1.835, massFraction: 0.96, source: CRC_DENSITY, level: 'recalled' } }),
  r({ id: 'na2so4', name: 'sodium sulfate', aliases: ['sodium sulfate anhydrous', 'sodium sulphate'], formula: 'Na2SO4', system: 'sulfate', ions: { 'Na+': 2 }, mm: 142.04 }),
  r({ id: 'na2so4-10', name: 'sodium sulfate decahydrate', aliases: ["Glauber's salt"], formula: 'Na2SO4', hydrateWater: 10, system: 'sulfate', ions: { 'Na+': 2 }, mm: 322.20 }),
  r({ id: 'k2so4', name: 'potassium sulfate', formula: 'K2SO4', system: 'sulfate', ions: { 'K+': 2 }, mm: 174.26 }),
  r({ id: 'nahso4', name: 'sodium hydrogen sulfate', aliases: ['sodium bisulfate'], formula: 'NaHSO4', system: 'sulfate', ions: { 'Na+': 1 }, mm: 120.06 }),
  r({ id: 'mgso4-7', name: 'magnesium sulfate heptahydrate', aliases: ['Epsom salt'], formula: 'MgSO4', hydrateWater: 7, system: 'sulfate', ions: { 'Mg2+': 1 }, mm: 246.47 }),
  r({ id: 'nh4-2so4', name: 'ammonium sulfate', formula: '(NH4)2SO4', systemsMap: { sulfate: 1, ammonium: 2 }, mm: 132.14 }),
  // ammonium
  r({ id: 'nh4cl', name: 'ammonium chloride', formula: 'NH4Cl', system: 'ammonium', ions: { 'Cl-': 1 }, mm: 53.49 }),
  r({ id: 'nh3-28', name: 'ammonia solution 28%', aliases: ['ammonium hydroxide 28%', 'aqueous ammonia 28%', 'concentrated ammonia'], formula: 'NH3', system: 'ammonium',
    liquid: { densityGPerML: 0.898, massFraction: 0.28, source: CRC_DENSITY, level: 'recalled' } }),
  r({ id: 'nh3', name: 'ammonia', formula: 'NH3', system: 'ammonium', mm: 17.03 }),
  // Tris and Good's buffers
  r({ id: 'tris', name: 'Tris', aliases: ['Tris base', 'trometamol', 'tromethamine', 'THAM', 'tris(hydroxymethyl)aminomethane'], formula: 'C4H11NO3', system: 'tris', mm: 121.14 }),
  r({ id: 'tris-hcl', name: 'Tris hydrochloride', aliases: ['Tris HCl', 'Tris-HCl', 'Tris·HCl', 'trometamol hydrochloride', 'Tris base hydrochloride'], formula: 'C4H11NO3·HCl', system: 'tris', ions: { 'Cl-': 1 }, mm: 157.60 }),
  r({ id: 'hepes', name: 'HEPES', aliases: ['HEPES free acid', 'HEPES acid'], formula: 'C8H18N2O4S', system: 'hepes', mm: 238.30 }),
  r({ id: 'hepes-na', name: 'HEPES sodium salt', aliases: ['HEPES sodium', 'sodium HEPES', 'HEPES Na', 'Na HEPES'], formula: 'C8H17N2NaO4S', system: 'hepes', ions: { 'Na+': 1 }, mm: 260.29 }),
  r({ id: 'mes', name: 'MES', aliases: ['MES free acid', 'MES acid'], formula: 'C6H13NO4S', system: 'mes', mm: 195.24 }),
  r({ id: 'mes-1', name: 'MES monohydrate', formula: 'C6H13NO4S', hydrateWater: 1, system: 'mes', mm: 213.25 }),
  r({ id: 'mes-na', name: 'MES sodium salt', aliases: ['MES sodium', 'sodium MES', 'MES Na'], formula: 'C6H12NNaO4S', system: 'mes', ions: { 'Na+': 1 }, mm: 217.22 }),
  r({ id: 'mops', name: 'MOPS', aliases: ['MOPS free acid', 'MOPS acid'], formula: 'C7H15NO4S', system: 'mops', mm: 209.26 }),
  r({ id: 'mops-na', name: 'MOPS sodium salt', aliases: ['MOPS sodium', 'MOPS Na'], formula: 'C7H14NNaO4S', system: 'mops', ions: { 'Na+': 1 }, mm: 231.25 }),
  r({ id: 'pipes', name: 'PIPES', aliases: ['PIPES free acid', 'PIPES acid'], formula: 'C8H18N2O6S2', system: 'pipes', mm: 302.37 }),
  r({ id: 'pipes-na2', name: 'PIPES disodium salt', aliases: ['PIPES disodium'], formula: 'C8H16N2Na2O6S2', system: 'pipes', ions: { 'Na+': 2 }, mm: 346.33 }),
  r({ id: 'aces', name: 'ACES', formula: 'C4H10N2O4S', system: 'aces', mm: 182.20 }),
  r({ id: 'tes', name: 'TES', formula: 'C6H15NO6S', system: 'tes', mm: 229.25 }),
  r({ id: 'bicine', name: 'bicine', formula: 'C6H13NO4', system: 'bicine', mm: 163.17 }),
  r({ id: 'tricine', name: 'tricine', formula: 'C6H13NO5', system: 'tricine', mm: 179.17 }),
  r({ id: 'taps', name: 'TAPS', formula: 'C7H17NO6S', system: 'taps', mm: 243.28 }),
  r({ id: 'ches', name: 'CHES', formula: 'C8H17NO3S', system: 'ches', mm: 207.29 }),
  r({ id: 'caps', name: 'CAPS', formula: 'C9H19NO3S', system: 'caps', mm: 221.32 }),
  // amino acids, imidazole, EDTA
  r({ id: 'glycine', name: 'glycine', aliases: ['aminoacetic acid'], formula: 'C2H5NO2', system: 'glycine', systemCount: 1, ions: {}, mm: 75.07 }),
  r({ id: 'histidine', name: 'L-histidine', aliases: ['histidine'], formula: 'C6H9N3O2', system: 'histidine', mm: 155.15 }),
  r({ id: 'histidine-hcl-1', name: 'L-histidine monohydrochloride monohydrate', aliases: ['histidine hydrochloride monohydrate', 'L-histidine hydrochloride monohydrate', 'histidine HCl monohydrate'], formula: 'C6H9N3O2·HCl', hydrateWater: 1, system: 'histidine', ions: { 'Cl-': 1 }, mm: 209.63 }),
  r({ id: 'imidazole', name: 'imidazole', formula: 'C3H4N2', system: 'imidazole', mm: 68.08 }),
  r({ id: 'edta', name: 'EDTA free acid', aliases: ['edetic acid'], formula: 'C10H16N2O8', system: 'edta', mm: 292.24 }),
  r({ id: 'na2edta-2', name: 'disodium EDTA dihydrate', aliases: ['EDTA disodium salt dihydrate', 'edetate disodium dihydrate', 'disodium edetate dihydrate', 'Na2EDTA·2H2O'], formula: 'C10H14N2Na2O8', hydrateWater: 2, system: 'edta', ions: { 'Na+': 2 }, mm: 372.24 }),
  r({ id: 'na4edta', name: 'tetrasodium EDTA', aliases: ['EDTA tetrasodium salt'], formula: 'C10H12N2Na4O8', system: 'edta', ions: { 'Na+': 4 }, mm: 380.17 }),
  // strong acids and bases
  r({ id: 'hcl', name: 'hydrogen chloride', aliases: ['hydrochloric acid'], formula: 'HCl', ions: { 'Cl-': 1 }, mm: 36.46, eq: 1,
    solubility: { maxM: 14, source: 'CRC Handbook, HCl saturates water near 42 % w/w at 20 °C, about 14 mol/L (from memory)' } }),
  r({ id: 'hcl-37', name: 'hydrochloric acid 37%', aliases: ['hydrochloric acid 37 %', 'concentrated hydrochloric acid'], formula: 'HCl', ions: { 'Cl-': 1 }, eq: 1,
    liquid: { densityGPerML: 1.184, massFraction: 0.37, source: CRC_DENSITY, level: 'recalled' } }),
  r({ id: 'hno3', name: 'nitric acid', formula: 'HNO3', ions: { 'NO3-': 1 }, mm: 63.01, eq: 1 }),
  r({ id: 'hno3-70', name: 'nitric acid 70%', aliases: ['nitric acid 70 %', 'concentrated nitric acid'], formula: 'HNO3', ions: { 'NO3-': 1 }, eq: 1,
    liquid: { densityGPerML: 1.413, massFraction: 0.70, source: CRC_DENSITY, level: 'recalled' } }),
  r({ id: 'hclo4', name: 'perchloric acid', formula: 'HClO4', ions: { 'ClO4-': 1 }, mm: 100.46 }),
  r({ id: 'naoh', name: 'sodium hydroxide', aliases: ['caustic soda'], formula: 'NaOH', ions: { 'Na+': 1 }, mm: 40.00, eq: 1 }),
  r({ id: 'naoh-50', name: 'sodium hydroxide 50%', aliases: ['sodium hydroxide 50 %', 'caustic soda 50%'], formula: 'NaOH', ions: { 'Na+': 1 }, eq: 1,
    liquid: { densityGPerML: 1.525, massFraction: 0.50, source: CRC_DENSITY, level: 'recalled' } }),
  r({ id: 'koh', name: 'potassium hydroxide', aliases: ['caustic potash'], formula: 'KOH', ions: { 'K+': 1 }, mm: 56.11, eq: 1,
    solubility: { maxM: 15, source: 'CRC Handbook, KOH about 121 g per 100 g water at 25 °C, a 55 % w/w solution near 15 mol/L (from memory)' } }),
  // inert salts
  r({ id: 'nacl', name: 'sodium chloride', aliases: ['salt'], formula: 'NaCl', ions: { 'Na+': 1, 'Cl-': 1 }, mm: 58.44,
    solubility: { maxM: 5.45, source: 'CRC Handbook, NaCl 36.0 g per 100 g water at 25 °C, a 26.5 % w/w solution of density 1.197, 5.43 mol/L (from memory)' } }),
  r({ id: 'kcl', name: 'potassium chloride', formula: 'KCl', ions: { 'K+': 1, 'Cl-': 1 }, mm: 74.55 }),
  r({ id: 'kno3', name: 'potassium nitrate', formula: 'KNO3', ions: { 'K+': 1, 'NO3-': 1 }, mm: 101.10 }),
  r({ id: 'nano3', name: 'sodium nitrate', formula: 'NaNO3', ions: { 'Na+': 1, 'NO3-': 1 }, mm: 84.99 }),
  r({ id: 'licl', name: 'lithium chloride', formula: 'LiCl', ions: { 'Li+': 1, 'Cl-': 1 }, mm: 42.39 }),
  r({ id: 'kbr', name: 'potassium bromide', formula: 'KBr', ions: { 'K+': 1, 'Br-': 1 }, mm: 119.00 }),
  r({ id: 'cacl2', name: 'calcium chloride', aliases: ['calcium chloride anhydrous'], formula: 'CaCl2', ions: { 'Ca2+': 1, 'Cl-': 2 }, mm: 110.98 }),
  r({ id: 'cacl2-2', name: 'calcium chloride dihydrate', formula: 'CaCl2', hydrateWater: 2, ions: { 'Ca2+': 1, 'Cl-': 2 }, mm: 147.01 }),
  r({ id: 'mgcl2', name: 'magnesium chloride', aliases: ['magnesium chloride anhydrous'], formula: 'MgCl2', ions: { 'Mg2+': 1, 'Cl-': 2 }, mm: 95.21 }),
  r({ id: 'mgcl2-6', name: 'magnesium chloride hexahydrate', formula: 'MgCl2', hydrateWater: 6, ions: { 'Mg2+': 1, 'Cl-': 2 }, mm: 203.30 }),
  // the solvent: a row of water adds its volume and nothing else
  r({ id: 'water', name: 'water', aliases: ['WFI', 'water for injection', 'water for injections', 'purified water', 'deionised water', 'deionized water', 'DI water', 'distilled water'],
    formula: 'H2O', solvent: true, mm: 18.015 }),
];

/**
 * Names the trade uses for more than one form (hydrates, or protonation states): they fail with the
 * choices instead of silently picking one, since a wrong hydrate is a wrong weigh-out.
 */
export const AMBIGUOUS_NAMES: readonly { name: string; choices: string[] }[] = [
  { name: 'sodium citrate', choices: ['trisodium citrate', 'trisodium citrate dihydrate', 'sodium dihydrogen citrate', 'disodium hydrogen citrate sesquihydrate'] },
  { name: 'sodium citrate tribasic', choices: ['trisodium citrate', 'trisodium citrate dihydrate'] },
  { name: 'potassium citrate', choices: ['tripotassium citrate monohydrate', 'potassium dihydrogen citrate'] },
  { name: 'sodium phosphate', choices: ['sodium dihydrogen phosphate', 'sodium dihydrogen phosphate monohydrate', 'sodium dihydrogen phosphate dihydrate', 'disodium hydrogen phosphate', 'disodium hydrogen phosphate dihydrate', 'disodium hydrogen phosphate heptahydrate', 'disodium hydrogen phosphate dodecahydrate', 'trisodium phosphate', 'trisodium phosphate dodecahydrate'] },
  { name: 'potassium phosphate', choices: ['potassium dihydrogen phosphate', 'dipotassium hydrogen phosphate', 'dipotassium hydrogen phosphate trihydrate', 'tripotassium phosphate'] },
  { name: 'sodium succinate', choices: ['disodium succinate hexahydrate'] },
  { name: 'histidine HCl', choices: ['L-histidine monohydrochloride monohydrate'] },
  { name: 'histidine hydrochloride', choices: ['L-histidine monohydrochloride monohydrate'] },
  { name: 'L-histidine hydrochloride', choices: ['L-histidine monohydrochloride monohydrate'] },
  { name: 'Na2EDTA', choices: ['disodium EDTA dihydrate'] },
  { name: 'disodium EDTA', choices: ['disodium EDTA dihydrate'] },
  { name: 'disodium edetate', choices: ['disodium EDTA dihydrate'] },
  { name: 'potassium tetroxalate', choices: ['potassium tetroxalate dihydrate'] },
  { name: 'MES hydrate', choices: ['MES', 'MES monohydrate'] },
  { name: 'EDTA', choices: ['EDTA free acid', 'disodium EDTA dihydrate', 'tetrasodium EDTA'] },
  { name: 'L-histidine monohydrochloride', choices: ['L-histidine monohydrochloride monohydrate'] },
  { name: 'histidine monohydrochloride', choices: ['L-histidine monohydrochloride monohydrate'] },
];

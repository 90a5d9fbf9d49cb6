// The engine's public surface: pure TypeScript, no Office, no DOM.
export { ACTIVITY_MODELS, MODEL_LIMIT_MOLAL, ionicStrengthFactor, lnGammaPerZ2, parseModel } from './activity';
export type { ActivityModel } from './activity';
export { chargeBalance } from './chargeBalance';
export type { BalanceOut } from './chargeBalance';
export { FAILURE_CODES, NOT_AVAILABLE_CODES, ProticError, describeFailure, fail, quote } from './failure';
export type { Failure, FailureCode, ReachableRange } from './failure';
export { MAX_FORMULA_DEPTH, compositionKey, compositionMassGPerMol, hydrateText, looksLikeFormula, molarMassGPerMol, parseFormula, splitHydrate, withoutHydrogens } from './formula';
export type { Composition, HydrateSplit, ParsedFormula } from './formula';
export { MAX_MASS_STOCK_G_PER_L, addReagent, buildContents, cloneContents, contentsFromParsed, molesPerLitreDispensed, parseReagentSpec, registerSpecReader } from './mixture';
export type { Contents, MixtureRow, ParsedRow, ReagentSpec, RowAudit, SpecReader } from './mixture';
export { MAX_COMPONENT_M, checkSystemRange, lnKaAt, prepareProblem, prepareSystem, setActivity } from './problem';
export type { PreparedSystem, Problem } from './problem';
export { recipeForTarget, recipeLine } from './recipe';
export type { RecipeLine } from './recipe';
export {
  allReagents, allSystems, closestReagentNames, compactName, molarMassOfReagent, normaliseName, reagentByName, registryGeneration,
  resolveReagent, resolveSystem, setCustomDefinitions, systemFor,
} from './registry';
export { MAX_REAGENT_TEXT, firstCharacterProblem, foldConfusables, plainText, screenText } from './textScreen';
export type { CharacterProblem } from './textScreen';
export type { ResolvedReagent } from './registry';
export { bufferCapacity, ionLabel, modelWarning, speciesRows } from './results';
export type { SpeciesRow } from './results';
export { lnGammaZ2For, lnHFromPH, pHFromLnH, solve, solveFixedActivity, startingLnH } from './solver';
export type { Equilibrium } from './solver';
export { fractionsAt, systemMoments } from './speciation';
export { dpKaPerK, pKaAt } from './temperature';
export { MAX_TITRANT_VOLUME_RATIO, litresPerMole, molesToUnit, titrantForTarget, titrantLimit, titrantUnit, unitToMoles, withTitrant } from './titrant';
export type { TitrantLimitReason, TitrantOptions, TitrantResult } from './titrant';
export { PH_TOLERANCE, solveInverse } from './inverse';
export type { InverseOutcome, InverseProblem } from './inverse';
export { iterateActivity } from './targetActivity';
export { IONIC_STRENGTH_RELATIVE_TOLERANCE, saltForIonicStrength } from './saltDose';
export type { SaltDoseResult } from './saltDose';
export { UNIT_LIST, findUnit, parseUnit, splitMassStock, splitStock, unitCaseHint } from './units';
export type { Unit, UnitKind } from './units';
export { WATER_RANGE_C, WATER_SOURCES, checkWaterRange, debyeHuckelA, pKw, waterDensityKgPerL, waterPermittivity } from './water';
export { applyCustomDefinitions, clearCustomDefinitions } from './customSystems';
export type { CustomFormDefinition, CustomSystemDefinition } from './customSystems';
export { apparentPKas, fractionsAtPH } from './apparent';
export { HANDLE_MAX_CHARS, HANDLE_VERSION, decodeHandle, encodeHandle, looksLikeHandle } from './stockHandle';
export type { StockComposition } from './stockHandle';
export { adjustedStockComposition, parseAdjustedStock } from './adjustedStock';
export type { AdjustedStockText } from './adjustedStock';
export { pHWithStepPKa, withStepPKa } from './alternative';
export { PHSensitivity, rowAmountSensitivities, shiftConstants, volumeSensitivity } from './uncertainty';
export { LADDER_EFFECTS, handLadder } from './handcheck';
export type { HandLadder } from './handcheck';

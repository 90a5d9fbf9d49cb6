// Failures are data: a union keyed on `code`, with the fields that explain it.

interface FailureFields {
  /** the argument the failure is about, as the user named it (`reagents`, `temperature`) */
  argument: string;
  /** 1-based row within a range argument */
  row?: number;
  /** what was received, as text */
  received: string;
  /** what would have been accepted */
  expected: string;
}

/** The range of a target an inverse solve can reach, for an `unreachable_target` message. */
export interface ReachableRange {
  /** what the target is: `pH`, `ionic strength` */
  quantity: string;
  low: number;
  high: number;
  /** unit after the numbers, e.g. ` mol/L`; none for pH */
  unit?: string;
}

export type Failure =
  | (FailureFields & { code: 'unknown_reagent' })
  | (FailureFields & { code: 'ambiguous_reagent' })
  | (FailureFields & { code: 'unknown_system' })
  | (FailureFields & { code: 'bad_formula'; position: number })
  | (FailureFields & { code: 'bad_character'; position: number })
  | (FailureFields & { code: 'bad_unit' })
  | (FailureFields & { code: 'bad_model' })
  | (FailureFields & { code: 'bad_amount' })
  | (FailureFields & { code: 'bad_argument' })
  | (FailureFields & { code: 'shape_mismatch' })
  | (FailureFields & { code: 'missing_volume' })
  | (FailureFields & { code: 'out_of_range' })
  | (FailureFields & { code: 'unreachable_target'; reason: string; reachable?: ReachableRange })
  | (FailureFields & { code: 'several_crossings'; quantity: string; crossings: number[]; crossingUnit: string })
  | (FailureFields & { code: 'no_convergence' });

export type FailureCode = Failure['code'];

/** Codes for a result that does not exist (`#N/A`); every other code is bad input (`#VALUE!`). */
export const NOT_AVAILABLE_CODES: readonly FailureCode[] = ['unreachable_target', 'several_crossings'];

const HEADLINES: Record<FailureCode, string> = {
  unknown_reagent: 'unknown reagent',
  ambiguous_reagent: 'the name does not say which form',
  unknown_system: 'unknown acid system',
  bad_formula: 'not a chemical formula',
  bad_character: 'a character that is not plain text',
  bad_unit: 'unit not allowed here',
  bad_model: 'unknown activity model',
  bad_amount: 'amount not usable',
  bad_argument: 'value not usable',
  shape_mismatch: 'ranges of different shapes',
  missing_volume: 'final volume needed',
  out_of_range: 'outside the range the data hold for',
  unreachable_target: 'target cannot be reached',
  several_crossings: 'more than one answer',
  no_convergence: 'the equilibrium did not converge',
};

/** Every failure code, for tests that each one has a message. */
export const FAILURE_CODES = Object.keys(HEADLINES) as FailureCode[];

function rangeText(r: ReachableRange): string {
  const n = (x: number): string => String(Number(x.toPrecision(5)));
  return r.low === r.high ? `${r.quantity} ${n(r.low)}${r.unit ?? ''} only` : `${r.quantity} ${n(r.low)} to ${n(r.high)}${r.unit ?? ''}`;
}

function crossingsText(at: number[], unit: string): string {
  return at.map((x) => `${Number(x.toPrecision(5))}${unit}`).join(', ');
}

/** The one place a failure becomes the sentence a user reads. */
export function describeFailure(failure: Failure): string {
  const where = failure.row === undefined ? failure.argument : `${failure.argument}, row ${failure.row}`;
  const detail =
    failure.code === 'bad_formula' || failure.code === 'bad_character' ? ` at character ${failure.position}` :
    failure.code === 'unreachable_target' ? `: ${failure.reason}${failure.reachable ? `; reachable ${rangeText(failure.reachable)}` : ''}` :
    failure.code === 'several_crossings' ? `: the ${failure.quantity} crosses it ${failure.crossings.length} times, at ${crossingsText(failure.crossings, failure.crossingUnit)}` : '';
  return `${where}: ${HEADLINES[failure.code]}${detail}. Received ${failure.received}; expected ${failure.expected}.`;
}

/** Thrown inside the engine and caught at the function layer; carries the failure as data. */
export class ProticError extends Error {
  readonly failure: Failure;
  constructor(failure: Failure) {
    super(describeFailure(failure));
    this.name = 'ProticError';
    this.failure = failure;
  }
}

export function fail(failure: Failure): never {
  throw new ProticError(failure);
}

/** Quotes a received value for a message, shortened so a 10,000-character cell stays readable. */
export function quote(value: unknown): string {
  if (value === null || value === undefined) return 'an empty cell';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : `the non-finite number ${String(value)}`;
  if (typeof value === 'boolean') return `the logical value ${value ? 'TRUE' : 'FALSE'}`;
  if (Array.isArray(value)) return `a range of ${value.length} row${value.length === 1 ? '' : 's'}`;
  if (typeof value !== 'string') return `a value of type ${typeof value}`;
  const text = String(value);
  if (text.trim() === '') return 'an empty text';
  const short = text.length > 60 ? `${text.slice(0, 57)}...` : text;
  return `"${short}"`;
}

import { NOT_AVAILABLE_CODES, ProticError } from '../engine';

export type CellErrorKind = '#VALUE!' | '#N/A';

export interface CellFailure {
  kind: CellErrorKind;
  message: string;
}

/** Maps a thrown failure to the cell error the contract asks for; an untyped error is a bug, shown as such. */
export function toCellFailure(error: unknown): CellFailure {
  if (error instanceof ProticError) {
    return { kind: NOT_AVAILABLE_CODES.includes(error.failure.code) ? '#N/A' : '#VALUE!', message: error.message };
  }
  const text = error instanceof Error ? error.message : String(error);
  return { kind: '#VALUE!', message: `internal error (please report with the inputs): ${text}` };
}

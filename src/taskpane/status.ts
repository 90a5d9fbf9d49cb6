import { ProticError } from '../engine';
import { toCellFailure } from '../functions/outcome';
import { byId } from './dom';
import { Refusal } from './refusal';

// The pane's one live region: status and results only, so typing is never re-announced.

export type Tone = 'ok' | 'warning' | 'error';

export function setStatus(message: string, tone: Tone = 'ok'): void {
  const status = byId('status');
  status.textContent = message;
  status.className = tone === 'ok' ? 'status' : `status ${tone}`;
}

/** A refusal or an engine failure as its own sentence; anything else is a bug and says so (as a cell would). */
export function failureText(error: unknown): string {
  if (error instanceof Refusal || error instanceof ProticError) return error.message;
  // Excel's own refusals (a protected sheet, a cell being edited) carry a code and debug information
  if (error instanceof Error && 'debugInfo' in error) return `Excel did not write: ${error.message}`;
  return toCellFailure(error).message;
}

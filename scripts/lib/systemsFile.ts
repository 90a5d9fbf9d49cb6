import { readFileSync } from 'fs';
import { applyCustomDefinitions } from '../../src/engine';

/** Reads custom systems from a JSON file (the same shape the pane saves in the workbook). */
export function loadSystemsFile(path: string): string[] {
  let json: unknown;
  try {
    json = JSON.parse(readFileSync(path, 'utf8'));
  } catch (error) {
    return [`${path}: not readable JSON (${(error as Error).message})`];
  }
  return applyCustomDefinitions(json);
}

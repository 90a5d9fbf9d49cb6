import { num } from './dom';

// What the pane's parts share: the system on show, and the conditions at the top of the pane.

/** systemId: the system on show; pickedHit: the search result the user chose (kind:label), marked as selected. */
export const state = { systemId: 'phosphate', pickedHit: '' };

export interface Conditions { temperatureC: number; ionicStrengthM: number; targetPH: number }

/** The conditions boxes; a blank or malformed one is refused with its label. */
export function conditions(): Conditions {
  return { temperatureC: num('temperature'), ionicStrengthM: num('ionic-strength'), targetPH: num('target-ph') };
}

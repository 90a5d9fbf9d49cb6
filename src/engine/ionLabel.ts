// Ion ids as they are printed (Mg2+ → Mg²⁺, Cl- → Cl⁻), for SPECIES, READBACK, density sources and warnings.

const SUPERSCRIPT: Record<string, string> = { '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹', '+': '⁺', '-': '⁻' };
// printed once per ion id: SPECIES prints every ion of every mixture
const ionLabels = new Map<string, string>();

/**
 * An ion id as it is printed: its trailing charge in superscript.
 * @example ionLabel('Ca2+') // 'Ca²⁺'
 */
export function ionLabel(id: string): string {
  let label = ionLabels.get(id);
  if (label === undefined) {
    label = id.replace(/(\d*[+-])$/, (charge) => charge.split('').map((ch) => SUPERSCRIPT[ch]).join(''));
    ionLabels.set(id, label);
  }
  return label;
}

// Labelled blocks the pane writes into the sheet at the selected cell: inputs in cells and a
// formula that references them, so a reviewer sees every number the result depends on.

export type BlockCell = string | number;

export interface Block {
  /** cells, row by row; text starting with = is a formula */
  cells: BlockCell[][];
}

export interface MixtureInput {
  rows: { reagent: string; amount: number; unit: string }[];
  volumeL: number;
  temperatureC: number;
}

/** Column letters of a zero-based column index (0 → A, 26 → AA). */
export function columnName(index: number): string {
  let name = '';
  for (let n = index + 1; n > 0; n = Math.floor((n - 1) / 26)) name = String.fromCharCode(65 + ((n - 1) % 26)) + name;
  return name;
}

export function address(row: number, col: number): string {
  return `${columnName(col)}${row + 1}`;
}

/** A text cell that Excel must not read as a formula or number. */
function text(value: string): string {
  return /^[=+\-@]/.test(value) ? `'${value}` : value;
}

function pad(rows: BlockCell[][]): BlockCell[][] {
  const width = Math.max(...rows.map((r) => r.length));
  return rows.map((r) => [...r, ...Array(width - r.length).fill('')]);
}

function mixtureRows(m: MixtureInput, top: number, left: number): { rows: BlockCell[][]; refs: { reagents: string; amounts: string; units: string; volume: string; temperature: string }; next: number } {
  const rows: BlockCell[][] = [['Reagent', 'Amount', 'Unit']];
  for (const r of m.rows) rows.push([text(r.reagent), r.amount, text(r.unit)]);
  const first = top + 1, last = top + m.rows.length;
  rows.push(['Volume (L)', m.volumeL, '']);
  rows.push(['Temperature (°C)', m.temperatureC, '']);
  const range = (c: number): string => `${address(first, left + c)}:${address(last, left + c)}`;
  return {
    rows,
    refs: { reagents: range(0), amounts: range(1), units: range(2), volume: address(last + 1, left + 1), temperature: address(last + 2, left + 1) },
    next: last + 3,
  };
}

/** The mixture's arguments as the cells reference them. */
function refArgs(refs: ReturnType<typeof mixtureRows>['refs']): string {
  return `${refs.reagents},${refs.amounts},${refs.units},${refs.volume},${refs.temperature}`;
}

export function phBlock(m: MixtureInput, top: number, left: number): Block {
  const { rows, refs } = mixtureRows(m, top, left);
  rows.push(['pH', `=PROTIC.PHMIX(${refArgs(refs)})`, '']);
  // Beside every result, so a number outside the model's range is never silent in the record.
  rows.push(['Warnings', `=PROTIC.WARNINGS(${refArgs(refs)})`, '']);
  return { cells: pad(rows) };
}

export function titrantBlock(m: MixtureInput, titrant: string, targetPH: number, top: number, left: number): Block {
  const { rows, refs, next } = mixtureRows(m, top, left);
  rows.push(['Titrant', text(titrant), '']);
  rows.push(['Target pH', targetPH, '']);
  const titrantRef = address(next, left + 1), targetRef = address(next + 1, left + 1);
  rows.push(['Titrant to add', `=PROTIC.TITRANT(${targetRef},${refs.reagents},${refs.amounts},${refs.units},${refs.volume},${titrantRef},${refs.temperature})`, 'mL or g']);
  rows.push(['Warnings (before titrant)', `=PROTIC.WARNINGS(${refArgs(refs)})`, '']);
  return { cells: pad(rows) };
}

/** The audit view: the mixture, then SPECIES and CONSTANTS, with blank cells reserved for their spills (rows × 5). */
export function speciesBlock(m: MixtureInput, speciesRows: number, constantsRows: number, top: number, left: number): Block {
  const { rows, refs } = mixtureRows(m, top, left);
  for (const [fn, spillRows] of [['SPECIES', speciesRows], ['CONSTANTS', constantsRows]] as const) {
    rows.push([`=PROTIC.${fn}(${refArgs(refs)})`, '', '', '', '']);
    for (let i = 1; i < spillRows; i++) rows.push(['', '', '', '', '']);
  }
  return { cells: pad(rows) };
}

/** Common working temperatures, °C: cold room, ambient range, 37 °C (common practice). Cells the user can edit. */
export const WHAT_IF_TEMPERATURES_C = [4, 10, 15, 20, 25, 30, 37, 40];

/** A what-if table: the mixture at each temperature in a column of editable cells, pH and warnings beside it. */
export function temperatureTableBlock(m: MixtureInput, temperaturesC: number[], top: number, left: number): Block {
  const { rows, refs, next } = mixtureRows(m, top, left);
  rows.pop(); // the table's own column replaces the single temperature cell
  rows.push(['Temperature (°C)', 'pH', 'Warnings']);
  temperaturesC.forEach((t, i) => {
    const cell = address(next + i, left);
    const args = `${refs.reagents},${refs.amounts},${refs.units},${refs.volume},${cell}`;
    rows.push([t, `=PROTIC.PHMIX(${args})`, `=PROTIC.WARNINGS(${args})`]);
  });
  return { cells: pad(rows) };
}

export interface RecipeInput { acidForm: string; baseForm: string; targetPH: number; concentrationM: number; volumeL: number; temperatureC: number }

export function recipeBlock(r: RecipeInput, top: number, left: number): Block {
  const b = (i: number): string => address(top + i, left + 1);
  const rows: BlockCell[][] = [
    ['Acid form', text(r.acidForm)], ['Base form', text(r.baseForm)], ['Target pH', r.targetPH],
    ['Concentration (mol/L)', r.concentrationM], ['Volume (L)', r.volumeL], ['Temperature (°C)', r.temperatureC],
    ['Weigh', 'grams'],
    [`=PROTIC.RECIPE(${b(0)},${b(1)},${b(2)},${b(3)},${b(4)},${b(5)})`, ''],
    ['', ''],
  ];
  return { cells: pad(rows) };
}

export interface FractionsInput { system: string; forms: string[]; fromPH: number; toPH: number; stepPH: number; temperatureC: number; ionicStrengthM: number }

export function fractionsBlock(f: FractionsInput, top: number, left: number): Block {
  const rows: BlockCell[][] = [['pH', ...f.forms.map(text)]];
  const count = Math.min(1001, Math.floor((f.toPH - f.fromPH) / f.stepPH + 1e-9) + 1);
  for (let i = 0; i < count; i++) {
    const r = top + 1 + i;
    const pH = Math.round((f.fromPH + i * f.stepPH) * 1e6) / 1e6;
    rows.push([pH, `=PROTIC.FRACTIONS("${f.system.replace(/"/g, '""')}",${address(r, left)},${f.temperatureC},${f.ionicStrengthM})`, ...Array(f.forms.length - 1).fill('')]);
  }
  return { cells: pad(rows) };
}

// Formulas as a saved .xlsx holds them, turned into what the engine reads, and back.
//
// Forms found in saved workbooks (public Office add-in issue threads and the Open XML schema):
// - an add-in's custom function is saved as `_xldudf_` + namespace + `_` + name, e.g.
//   `_xldudf_PROTIC_PHMIX(...)` for PROTIC.PHMIX; any letter case;
// - an add-in registration mix-up can leave it behind a link index: `[2]!_xldudf_PROTIC_PHMIX(...)`;
// - functions newer than Excel 2007 carry `_xlfn.` (`_xlfn._xlws.` for some), LET/LAMBDA
//   parameters `_xlpm.`; `@` (implicit intersection) is saved as `_xlfn.SINGLE(...)` and a
//   spill reference `B5#` as `_xlfn.ANCHORARRAY(B5)`;
// - a formula typed by a tool (or our CSV) may hold `PROTIC.PHMIX(...)` as it is typed;
// - TRUE and FALSE are saved bare; the engine wants TRUE() and FALSE().

/** Splits a formula into code and string-literal pieces so rewrites never touch text in quotes. */
function mapCode(formula: string, rewrite: (code: string) => string): string {
  let out = '';
  let i = 0;
  while (i < formula.length) {
    const q = formula.indexOf('"', i);
    if (q < 0) { out += rewrite(formula.slice(i)); break; }
    out += rewrite(formula.slice(i, q));
    let j = q + 1;
    for (;;) {
      const end = formula.indexOf('"', j);
      if (end < 0) { j = formula.length; break; }
      if (formula[end + 1] === '"') { j = end + 2; continue; }
      j = end + 1;
      break;
    }
    out += formula.slice(q, j);
    i = j;
  }
  return out;
}

/** What reading one saved formula found, beside the formula the engine gets. */
export interface ReadFormula {
  /** the formula for the engine, without the leading `=` */
  engine: string;
  /** Protic functions the formula calls (upper case, without the namespace) */
  protic: string[];
  /** saved forms met, for the report (e.g. `_xldudf_`) */
  forms: string[];
  /** a reference into another workbook ([1]Sheet!A1): the cell cannot be recomputed here */
  external: boolean;
  /** another add-in's function (or one Excel saved without its name): left for the engine to refuse */
  foreign: string[];
}

const UDF = /(\[\d+\]!)?_xldudf_([A-Za-z0-9_.]+?)\s*\(/g;

/**
 * Reads a saved formula. `spillOf(ref)` gives the saved spill range of an anchor cell (for
 * `_xlfn.ANCHORARRAY`), or undefined. Example: `readFormula('_xldudf_PROTIC_PKA("acetate",1)').engine`
 * is `PROTIC.PKA("acetate",1)`.
 */
export function readFormula(saved: string, spillOf: (ref: string) => string | undefined = () => undefined): ReadFormula {
  const forms = new Set<string>();
  const foreign: string[] = [];
  let external = false;
  const text = saved.startsWith('=') ? saved.slice(1) : saved;
  const engine = mapCode(text, (code) => {
    if (/\bPROTIC\.[A-Za-z]/i.test(code)) forms.add('PROTIC.NAME as typed');
    let c = code.replace(UDF, (_m, link: string | undefined, name: string) => {
      const m = /^PROTIC[._]([A-Za-z0-9]+)$/i.exec(name);
      if (!m) { foreign.push(`_xldudf_${name}`); return `_xldudf_${name}(`; }
      forms.add(link ? '[n]!_xldudf_PROTIC_NAME (add-in behind a link index)' : '_xldudf_PROTIC_NAME');
      return `PROTIC.${m[1].toUpperCase()}(`;
    });
    c = c.replace(/_xlfn\.ANCHORARRAY\(\s*((?:'[^']+'|[A-Za-z0-9_.]+)!)?\$?([A-Z]{1,3})\$?(\d+)\s*\)/gi, (m, sheet: string | undefined, col: string, row: string) => {
      forms.add('_xlfn.ANCHORARRAY (spill reference B5#)');
      const range = spillOf(`${sheet ?? ''}${col.toUpperCase()}${row}`);
      return range ?? `${sheet ?? ''}${col}${row}`;
    });
    c = c.replace(/_xlfn\.SINGLE\(/gi, () => { forms.add('_xlfn.SINGLE (implicit intersection @)'); return '('; });
    c = c.replace(/_xlfn\.(_xlws\.)?/gi, () => { forms.add('_xlfn. / _xlws. prefixes'); return ''; });
    c = c.replace(/_xlws\./gi, '').replace(/_xlpm\./gi, () => { forms.add('_xlpm. parameter names'); return ''; });
    // Excel saves the logical constants bare; the engine reads them as functions
    c = c.replace(/(^|[^A-Za-z0-9_.!$'])(TRUE|FALSE)(?![A-Za-z0-9_.(!]|\s*\()/gi, (_m, before: string, word: string) => `${before}${word.toUpperCase()}()`);
    if (/\[\d+\]/.test(c)) external = true;
    return c;
  });
  const protic: string[] = [];
  mapCode(engine, (code) => {
    for (const m of code.matchAll(/\bPROTIC\.([A-Za-z0-9]+)\s*\(/gi)) protic.push(m[1].toUpperCase());
    return code;
  });
  const upper = mapCode(engine, (code) => code.replace(/\bPROTIC\.([A-Za-z0-9]+)\s*\(/gi, (_m, n: string) => `PROTIC.${n.toUpperCase()}(`));
  return { engine: upper, protic, forms: [...forms], external, foreign };
}

/** The saved form of an engine formula: `PROTIC.PHMIX(` becomes `_xldudf_PROTIC_PHMIX(`, as Excel saves an add-in's function. */
export function savedFormula(engine: string): string {
  const text = engine.startsWith('=') ? engine.slice(1) : engine;
  return mapCode(text, (code) => code.replace(/\bPROTIC\.([A-Za-z0-9]+)\s*\(/gi, (_m, n: string) => `_xldudf_PROTIC_${n.toUpperCase()}(`));
}

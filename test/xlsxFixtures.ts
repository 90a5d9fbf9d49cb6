import JSZip from 'jszip';

// Builds .xlsx files from raw parts, as Excel lays them out, independently of the writer under
// test: each cell is written as the XML Excel saves (<c r t cm><f …>…</f><v>…</v></c>).

export type Raw = number | string | boolean | { error: string } | null;

export interface RawCell {
  ref: string;
  value?: Raw;
  /** formula text as saved, without = */
  f?: string;
  /** attributes of <f>: t="array" ref=…, t="shared" si=… */
  fAttrs?: Record<string, string>;
  /** dynamic-array metadata index */
  cm?: number;
}

export interface RawSheet { name: string; cells: RawCell[] }

export interface RawBook {
  sheets: RawSheet[];
  names?: { name: string; text: string; localSheetId?: number }[];
  /** webextension properties (name → value as Excel stores it) */
  webProperties?: Record<string, string>;
  dynamicMetadata?: boolean;
  externalLink?: string;
}

const esc = (s: string): string => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

function cellXml(c: RawCell): string {
  const v = c.value;
  let t = '';
  let vx = '';
  if (typeof v === 'number') vx = `<v>${String(v)}</v>`;
  else if (typeof v === 'boolean') { t = ' t="b"'; vx = `<v>${v ? 1 : 0}</v>`; }
  else if (typeof v === 'string') {
    if (c.f !== undefined) { t = ' t="str"'; vx = `<v>${esc(v)}</v>`; } else { t = ' t="inlineStr"'; vx = `<is><t>${esc(v)}</t></is>`; }
  } else if (v && typeof v === 'object') { t = ' t="e"'; vx = `<v>${esc(v.error)}</v>`; }
  const cm = c.cm ? ` cm="${c.cm}"` : '';
  const fa = c.fAttrs ? Object.entries(c.fAttrs).map(([k, x]) => ` ${k}="${esc(x)}"`).join('') : '';
  const f = c.f === undefined ? '' : c.f === '' ? `<f${fa}/>` : `<f${fa}>${esc(c.f)}</f>`;
  return `<c r="${c.ref}"${t}${cm}>${f}${vx}</c>`;
}

function sheetXml(s: RawSheet): string {
  const rows = new Map<number, RawCell[]>();
  for (const c of s.cells) {
    const r = Number(/\d+$/.exec(c.ref)![0]);
    if (!rows.has(r)) rows.set(r, []);
    rows.get(r)!.push(c);
  }
  const colOf = (ref: string): number => [.../^[A-Z]+/.exec(ref)![0]].reduce((n, ch) => n * 26 + ch.charCodeAt(0) - 64, 0);
  const body = [...rows.keys()].sort((a, b) => a - b).map((r) => `<row r="${r}">${rows.get(r)!.sort((a, b) => colOf(a.ref) - colOf(b.ref)).map(cellXml).join('')}</row>`).join('');
  return `<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<worksheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" xmlns:r="http://schemas.openxmlformats.org/officeDocument/2006/relationships"><sheetData>${body}</sheetData></worksheet>`;
}

export async function buildXlsx(book: RawBook): Promise<Buffer> {
  const zip = new JSZip();
  const overrides = [
    '<Override PartName="/xl/workbook.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.sheet.main+xml"/>',
    ...book.sheets.map((_s, i) => `<Override PartName="/xl/worksheets/sheet${i + 1}.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.worksheet+xml"/>`),
  ];
  const wbRels = book.sheets.map((_s, i) => `<Relationship Id="rId${i + 1}" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/worksheet" Target="worksheets/sheet${i + 1}.xml"/>`);
  const rootRels = ['<Relationship Id="rId1" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/officeDocument" Target="xl/workbook.xml"/>'];
  if (book.dynamicMetadata) {
    zip.file('xl/metadata.xml', '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<metadata xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" xmlns:xda="http://schemas.microsoft.com/office/spreadsheetml/2017/dynamicarray"><metadataTypes count="1"><metadataType name="XLDAPR" minSupportedVersion="120000" copy="1" pasteAll="1" pasteValues="1" merge="1" splitFirst="1" rowColShift="1" clearFormats="1" clearComments="1" assign="1" coerce="1" cellMeta="1"/></metadataTypes><futureMetadata name="XLDAPR" count="1"><bk><extLst><ext uri="{bdbb8cdc-fa1e-496e-a857-3c3f30c029c3}"><xda:dynamicArrayProperties fDynamic="1" fCollapsed="0"/></ext></extLst></bk></futureMetadata><cellMetadata count="1"><bk><rc t="1" v="0"/></bk></cellMetadata></metadata>');
    wbRels.push('<Relationship Id="rId90" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/sheetMetadata" Target="metadata.xml"/>');
    overrides.push('<Override PartName="/xl/metadata.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.sheetMetadata+xml"/>');
  }
  if (book.externalLink) {
    zip.file('xl/externalLinks/externalLink1.xml', '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<externalLink xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" xmlns:r="http://schemas.openxmlformats.org/officeDocument/2006/relationships"><externalBook r:id="rId1"><sheetNames><sheetName val="Sheet1"/></sheetNames></externalBook></externalLink>');
    zip.file('xl/externalLinks/_rels/externalLink1.xml.rels', `<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships"><Relationship Id="rId1" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/externalLinkPath" Target="${esc(book.externalLink)}" TargetMode="External"/></Relationships>`);
    wbRels.push('<Relationship Id="rId91" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/externalLink" Target="externalLinks/externalLink1.xml"/>');
    overrides.push('<Override PartName="/xl/externalLinks/externalLink1.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.externalLink+xml"/>');
  }
  if (book.webProperties) {
    const props = Object.entries(book.webProperties).map(([k, v]) => `<we:property name="${esc(k)}" value="${esc(v)}"/>`).join('');
    zip.file('xl/webextensions/webextension1.xml', `<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<we:webextension xmlns:we="http://schemas.microsoft.com/office/webextensions/webextension/2010/11" id="{6E2B1C44-0F7A-4B8E-9C51-2D3A4B5C6D7E}"><we:reference id="5f0c2a7e-3b1d-4c55-9a2e-7d1c0b6e4a91" version="0.1.0.0" store="developer" storeType="Registry"/><we:alternateReferences/><we:properties>${props}</we:properties><we:bindings/><we:snapshot xmlns:r="http://schemas.openxmlformats.org/officeDocument/2006/relationships"/></we:webextension>`);
    zip.file('xl/webextensions/taskpanes.xml', '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<wetp:taskpanes xmlns:wetp="http://schemas.microsoft.com/office/webextensions/taskpanes/2010/11"><wetp:taskpane dockstate="right" visibility="1" width="350" row="0"><wetp:webextensionref xmlns:r="http://schemas.openxmlformats.org/officeDocument/2006/relationships" r:id="rId1"/></wetp:taskpane></wetp:taskpanes>');
    zip.file('xl/webextensions/_rels/taskpanes.xml.rels', '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships"><Relationship Id="rId1" Type="http://schemas.microsoft.com/office/2011/relationships/webextension" Target="webextension1.xml"/></Relationships>');
    rootRels.push('<Relationship Id="rId5" Type="http://schemas.microsoft.com/office/2011/relationships/webextensiontaskpanes" Target="xl/webextensions/taskpanes.xml"/>');
    overrides.push('<Override PartName="/xl/webextensions/webextension1.xml" ContentType="application/vnd.ms-office.webextension+xml"/>', '<Override PartName="/xl/webextensions/taskpanes.xml" ContentType="application/vnd.ms-office.webextensiontaskpanes+xml"/>');
  }
  zip.file('[Content_Types].xml', `<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<Types xmlns="http://schemas.openxmlformats.org/package/2006/content-types"><Default Extension="rels" ContentType="application/vnd.openxmlformats-package.relationships+xml"/><Default Extension="xml" ContentType="application/xml"/>${overrides.join('')}</Types>`);
  zip.file('_rels/.rels', `<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships">${rootRels.join('')}</Relationships>`);
  zip.file('xl/_rels/workbook.xml.rels', `<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships">${wbRels.join('')}</Relationships>`);
  const names = book.names && book.names.length > 0 ? `<definedNames>${book.names.map((n) => `<definedName name="${esc(n.name)}"${n.localSheetId === undefined ? '' : ` localSheetId="${n.localSheetId}"`}>${esc(n.text)}</definedName>`).join('')}</definedNames>` : '';
  zip.file('xl/workbook.xml', `<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<workbook xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" xmlns:r="http://schemas.openxmlformats.org/officeDocument/2006/relationships"><sheets>${book.sheets.map((s, i) => `<sheet name="${esc(s.name)}" sheetId="${i + 1}" r:id="rId${i + 1}"/>`).join('')}</sheets>${names}<calcPr calcId="191029"/></workbook>`);
  book.sheets.forEach((s, i) => zip.file(`xl/worksheets/sheet${i + 1}.xml`, sheetXml(s)));
  return zip.generateAsync({ type: 'nodebuffer', compression: 'DEFLATE' });
}

export function colName(col: number): string {
  let s = '';
  for (let c = col + 1; c > 0; c = Math.floor((c - 1) / 26)) s = String.fromCharCode(65 + ((c - 1) % 26)) + s;
  return s;
}

/** Cells for a spilled result laid out from `anchor` (0-based row/col), as Excel saves a dynamic array. */
export function spillCells(anchorRow: number, anchorCol: number, formula: string, result: unknown[][], dynamic = true): RawCell[] {
  const rows = result.length, cols = Math.max(...result.map((r) => r.length));
  const ref = `${colName(anchorCol)}${anchorRow + 1}:${colName(anchorCol + cols - 1)}${anchorRow + rows}`;
  const out: RawCell[] = [];
  for (let r = 0; r < rows; r++) for (let c = 0; c < cols; c++) {
    const v = (result[r][c] ?? '') as Raw;
    const cell: RawCell = { ref: `${colName(anchorCol + c)}${anchorRow + r + 1}`, value: v === '' ? null : v };
    if (r === 0 && c === 0) Object.assign(cell, { f: formula, fAttrs: { t: 'array', ref }, ...(dynamic ? { cm: 1 } : {}) });
    if (cell.value !== null || cell.f) out.push(cell);
  }
  return out;
}

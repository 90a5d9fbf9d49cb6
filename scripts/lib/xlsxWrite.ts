// Writes a workbook as Excel saves one: formulas with their computed values, Protic calls in
// the `_xldudf_PROTIC_NAME` form, as dynamic arrays (anchor `<f t="array" ref>` with cm="1" and
// the XLDAPR block in xl/metadata.xml, the spilled cells holding values; Excel saves even a
// one-cell custom-function result this way, ref="A1"), defined
// names, and add-in settings in a web-extension part. ExcelJS writes the sheets; the parts
// it does not know are added to its zip.
import ExcelJS from 'exceljs';
import JSZip from 'jszip';
import { a1 } from './xlsxRead';
import { savedFormula } from './xlsxFormula';

export type WriteValue = number | string | boolean | null | { error: string; message?: string };

export interface WriteCell {
  value: WriteValue;
  /** the formula in engine form (`PROTIC.PHMIX(...)`, with or without `=`) */
  formula?: string;
  /** the formula exactly as it should be saved (wins over `formula`) */
  saved?: string;
  /** an anchor's spilled size: [rows, cols] */
  spill?: [number, number];
  /** false: a legacy array formula (no dynamic-array metadata) */
  dynamic?: boolean;
}

export interface WriteWorkbook {
  sheets: { name: string; cells: (WriteCell | null | undefined)[][] }[];
  names?: { name: string; expression: string; scope?: number }[];
  /** document settings of the add-in (Office.Settings), stored in xl/webextensions/webextension1.xml */
  settings?: { name: string; value: string }[];
}

/** The add-in's id in manifest/manifest.xml: Excel files its settings under it. */
export const ADDIN_ID = '5f0c2a7e-3b1d-4c55-9a2e-7d1c0b6e4a91';

function xmlEscape(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

function excelValue(v: WriteValue): ExcelJS.CellValue {
  if (v === null || v === '') return null;
  if (typeof v === 'object') return { error: v.error } as ExcelJS.CellErrorValue;
  return v;
}

const METADATA = '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n'
  + '<metadata xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" xmlns:xda="http://schemas.microsoft.com/office/spreadsheetml/2017/dynamicarray">'
  + '<metadataTypes count="1"><metadataType name="XLDAPR" minSupportedVersion="120000" copy="1" pasteAll="1" pasteValues="1" merge="1" splitFirst="1" rowColShift="1" clearFormats="1" clearComments="1" assign="1" coerce="1" cellMeta="1"/></metadataTypes>'
  + '<futureMetadata name="XLDAPR" count="1"><bk><extLst><ext uri="{bdbb8cdc-fa1e-496e-a857-3c3f30c029c3}"><xda:dynamicArrayProperties fDynamic="1" fCollapsed="0"/></ext></extLst></bk></futureMetadata>'
  + '<cellMetadata count="1"><bk><rc t="1" v="0"/></bk></cellMetadata></metadata>';

function webExtension(settings: { name: string; value: string }[]): string {
  return '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n'
    + `<we:webextension xmlns:we="http://schemas.microsoft.com/office/webextensions/webextension/2010/11" id="{${ADDIN_ID.toUpperCase()}}">`
    + `<we:reference id="${ADDIN_ID}" version="0.1.0.0" store="developer" storeType="uploadfiledevcatalog"/>`
    + '<we:alternateReferences/><we:properties>'
    + settings.map((s) => `<we:property name="${xmlEscape(s.name)}" value="${xmlEscape(s.value)}"/>`).join('')
    + '</we:properties><we:bindings/><we:snapshot xmlns:r="http://schemas.openxmlformats.org/officeDocument/2006/relationships"/></we:webextension>';
}

const TASKPANES = '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n'
  + '<wetp:taskpanes xmlns:wetp="http://schemas.microsoft.com/office/webextensions/taskpanes/2010/11">'
  + '<wetp:taskpane dockstate="right" visibility="0" width="350" row="0"><wetp:webextensionref xmlns:r="http://schemas.openxmlformats.org/officeDocument/2006/relationships" r:id="rId1"/></wetp:taskpane></wetp:taskpanes>';

async function addParts(bytes: Buffer, book: WriteWorkbook, anchors: Map<number, Set<string>>): Promise<Buffer> {
  const zip = await JSZip.loadAsync(bytes);
  const types = (await zip.file('[Content_Types].xml')!.async('string'));
  let contentTypes = types;
  if (anchors.size > 0) {
    for (const [index, refs] of anchors) {
      const path = `xl/worksheets/sheet${index + 1}.xml`;
      let xml = await zip.file(path)!.async('string');
      xml = xml.replace(/<c r="([A-Z]+\d+)"/g, (m, r: string) => (refs.has(r) ? `${m} cm="1"` : m));
      zip.file(path, xml);
    }
    zip.file('xl/metadata.xml', METADATA);
    const rels = await zip.file('xl/_rels/workbook.xml.rels')!.async('string');
    zip.file('xl/_rels/workbook.xml.rels', rels.replace('</Relationships>', '<Relationship Id="rIdProticMeta" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/sheetMetadata" Target="metadata.xml"/></Relationships>'));
    contentTypes = contentTypes.replace('</Types>', '<Override PartName="/xl/metadata.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.sheetMetadata+xml"/></Types>');
  }
  if (book.names && book.names.length > 0) {
    const xml = await zip.file('xl/workbook.xml')!.async('string');
    const defined = '<definedNames>' + book.names.map((n) => `<definedName name="${xmlEscape(n.name)}"${n.scope === undefined ? '' : ` localSheetId="${n.scope}"`}>${xmlEscape(savedFormula(n.expression))}</definedName>`).join('') + '</definedNames>';
    zip.file('xl/workbook.xml', xml.replace(/<definedNames>[\s\S]*?<\/definedNames>|<definedNames\/>/, '').replace('</sheets>', `</sheets>${defined}`));
  }
  if (book.settings && book.settings.length > 0) {
    zip.file('xl/webextensions/webextension1.xml', webExtension(book.settings));
    zip.file('xl/webextensions/taskpanes.xml', TASKPANES);
    zip.file('xl/webextensions/_rels/taskpanes.xml.rels', '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships"><Relationship Id="rId1" Type="http://schemas.microsoft.com/office/2011/relationships/webextension" Target="webextension1.xml"/></Relationships>');
    const root = await zip.file('_rels/.rels')!.async('string');
    zip.file('_rels/.rels', root.replace('</Relationships>', '<Relationship Id="rIdProticPanes" Type="http://schemas.microsoft.com/office/2011/relationships/webextensiontaskpanes" Target="xl/webextensions/taskpanes.xml"/></Relationships>'));
    contentTypes = contentTypes.replace('</Types>', '<Override PartName="/xl/webextensions/webextension1.xml" ContentType="application/vnd.ms-office.webextension+xml"/><Override PartName="/xl/webextensions/taskpanes.xml" ContentType="application/vnd.ms-office.webextensiontaskpanes+xml"/></Types>');
  }
  zip.file('[Content_Types].xml', contentTypes);
  return zip.generateAsync({ type: 'nodebuffer', compression: 'DEFLATE', compressionOptions: { level: 6 } });
}

/** The workbook as .xlsx bytes. */
export async function writeWorkbookBytes(book: WriteWorkbook): Promise<Buffer> {
  const wb = new ExcelJS.Workbook();
  wb.calcProperties.fullCalcOnLoad = false;
  const anchors = new Map<number, Set<string>>();
  book.sheets.forEach((sheet, index) => {
    const ws = wb.addWorksheet(sheet.name);
    sheet.cells.forEach((row, r) => row.forEach((cell, c) => {
      if (!cell) return;
      const target = ws.getCell(r + 1, c + 1);
      const formula = cell.saved ?? (cell.formula !== undefined ? savedFormula(cell.formula) : undefined);
      if (formula === undefined) {
        const v = excelValue(cell.value);
        if (v !== null) target.value = v;
        return;
      }
      const result = excelValue(cell.value) ?? undefined;
      if (cell.spill && (cell.spill[0] > 1 || cell.spill[1] > 1 || cell.dynamic !== false)) {
        const ref = cell.spill[0] === 1 && cell.spill[1] === 1 ? a1(r, c) : `${a1(r, c)}:${a1(r + cell.spill[0] - 1, c + cell.spill[1] - 1)}`;
        target.value = { formula, result, shareType: 'array', ref } as unknown as ExcelJS.CellFormulaValue;
        if (cell.dynamic !== false) {
          if (!anchors.has(index)) anchors.set(index, new Set());
          anchors.get(index)!.add(a1(r, c));
        }
      } else {
        target.value = { formula, result } as ExcelJS.CellFormulaValue;
      }
    }));
  });
  const bytes = Buffer.from(await wb.xlsx.writeBuffer());
  return addParts(bytes, book, anchors);
}

// Offline checks of what Excel loads: the function names, functions.json against the custom-functions
// metadata schema (a subset written from the platform docs), and the add-in-only XML manifest
// (well-formed, element order, ids, URLs, icon sizes). Used by `npm run validate` and test/build.test.ts.
import Ajv from 'ajv';
import { DOMParser } from '@xmldom/xmldom';
import { EXCEL4_MACRO_NAMES } from './excel4MacroNames';

const XLM = new Set(EXCEL4_MACRO_NAMES);
const MAX_COLUMN = 16384; // XFD
const MAX_ROW = 1048576;

function columnNumber(letters: string): number {
  let n = 0;
  for (const ch of letters) n = n * 26 + (ch.charCodeAt(0) - 64);
  return n;
}

/** True when `name` reads as a cell reference: A1 … XFD1048576, or an R1C1 form (R1C1 … R1048576C16384, R5, C3, RC). */
export function isCellReference(name: string): boolean {
  const upper = name.toUpperCase();
  const a1 = /^([A-Z]{1,3})([0-9]+)$/.exec(upper);
  if (a1) {
    const row = Number(a1[2]);
    return columnNumber(a1[1]) <= MAX_COLUMN && row >= 1 && row <= MAX_ROW;
  }
  const r1c1 = /^R([0-9]*)C([0-9]*)$/.exec(upper) ?? /^R([0-9]+)()$/.exec(upper) ?? /^()C([0-9]+)$/.exec(upper);
  if (r1c1) return (r1c1[1] === '' || Number(r1c1[1]) <= MAX_ROW) && (r1c1[2] === '' || Number(r1c1[2]) <= MAX_COLUMN);
  return false;
}

/**
 * The custom-functions naming rules (learn.microsoft.com/office/dev/add-ins/excel/custom-functions-naming):
 * starts with a letter, at least 3 characters, only A–Z 0–9 _ . (we hold names to the id rule too),
 * not a cell reference, not an Excel 4.0 macro function. Returns the rules broken, empty when none.
 * @example functionNameProblems('PH') → ['has fewer than 3 characters']
 */
export function functionNameProblems(name: string): string[] {
  const problems: string[] = [];
  if (name.length < 3) problems.push('has fewer than 3 characters');
  if (!/^[A-Za-z]/.test(name)) problems.push('does not start with a letter');
  if (!/^[A-Za-z0-9_.]*$/.test(name)) problems.push('has a character other than A–Z, 0–9, _ and .');
  if (isCellReference(name)) problems.push('reads as a cell reference');
  if (XLM.has(name.toUpperCase())) problems.push('is an Excel 4.0 macro function name');
  return problems;
}

/**
 * functions.json, the subset of the metadata format we use, written from the platform's "Manually create
 * JSON metadata for custom functions" reference (learn.microsoft.com/office/dev/add-ins/excel/custom-functions-json):
 * unknown properties are refused so a typo cannot pass silently.
 */
export const FUNCTIONS_SCHEMA = {
  type: 'object',
  required: ['functions'],
  additionalProperties: false,
  properties: {
    allowCustomDataForDataTypeAny: { type: 'boolean' },
    allowErrorForDataTypeAny: { type: 'boolean' },
    functions: {
      type: 'array',
      minItems: 1,
      items: {
        type: 'object',
        required: ['id', 'name', 'parameters', 'result'],
        additionalProperties: false,
        properties: {
          id: { type: 'string', minLength: 3, pattern: '^[A-Za-z][A-Za-z0-9_.]*$' },
          name: { type: 'string', minLength: 3, pattern: '^[A-Za-z][A-Za-z0-9_.]*$' },
          description: { type: 'string', minLength: 1 },
          helpUrl: { type: 'string', pattern: '^https://[^\\s]+$' },
          parameters: {
            type: 'array',
            items: {
              type: 'object',
              required: ['name'],
              additionalProperties: false,
              properties: {
                name: { type: 'string', minLength: 1 },
                description: { type: 'string' },
                type: { enum: ['boolean', 'number', 'string', 'any'] },
                dimensionality: { enum: ['scalar', 'matrix'] },
                optional: { type: ['boolean', 'null'] },
                repeating: { type: 'boolean' },
                cellValueType: { type: 'string' },
              },
            },
          },
          result: {
            type: 'object',
            additionalProperties: false,
            properties: {
              type: { enum: ['boolean', 'number', 'string', 'any'] },
              dimensionality: { enum: ['scalar', 'matrix'] },
            },
          },
          options: {
            type: 'object',
            additionalProperties: false,
            properties: {
              cancelable: { type: 'boolean' },
              requiresAddress: { type: 'boolean' },
              requiresParameterAddresses: { type: 'boolean' },
              stream: { type: 'boolean' },
              volatile: { type: 'boolean' },
              capturesCallingObject: { type: 'boolean' },
              excludeFromAutoComplete: { type: 'boolean' },
              linkedEntityLoadService: { type: 'boolean' },
            },
          },
        },
      },
    },
  },
} as const;

export interface FunctionMeta { id: string; name: string; helpUrl?: string; parameters: { name: string }[] }

/** Problems with functions.json: schema, naming rules, unique ids and names, unique parameter names. */
export function functionsJsonProblems(json: unknown): string[] {
  const ajv = new Ajv({ allErrors: true });
  const validate = ajv.compile(FUNCTIONS_SCHEMA);
  const problems: string[] = [];
  if (!validate(json)) for (const e of validate.errors ?? []) problems.push(`functions.json${e.instancePath}: ${e.message}`);
  const functions = ((json as { functions?: unknown }).functions ?? []) as FunctionMeta[];
  const seen = new Set<string>();
  for (const f of Array.isArray(functions) ? functions : []) {
    for (const key of ['id', 'name'] as const) {
      const value = String(f[key] ?? '');
      for (const p of functionNameProblems(value)) problems.push(`function ${key} "${value}" ${p}`);
    }
    const id = String(f.id).toUpperCase();
    if (seen.has(id)) problems.push(`function id "${f.id}" appears twice`);
    seen.add(id);
    const params = (f.parameters ?? []).map((p) => p.name);
    if (new Set(params).size !== params.length) problems.push(`function "${f.id}" repeats a parameter name`);
  }
  return problems;
}

// Child order under each parent, from the XSD sequences: OfficeApp + its TaskPaneApp extension from
// OfficeAppManifestV1_1.xsd (github.com/OfficeDev/office-js-docs-pr, docs/overview/schemas/taskpane); the
// VersionOverrides parents from TaskPaneAppVersionOverridesV1_0.xsd, from memory (they agree with the
// platform's shared-runtime sample manifest).
const ORDER: Record<string, string[]> = {
  OfficeApp: ['Id', 'AlternateId', 'Version', 'ProviderName', 'DefaultLocale', 'DisplayName', 'Description', 'IconUrl',
    'HighResolutionIconUrl', 'SupportUrl', 'AppDomains', 'Hosts', 'Requirements', 'DefaultSettings', 'Permissions', 'Dictionary',
    'VersionOverrides'],
  VersionOverrides: ['Description', 'Requirements', 'Hosts', 'Resources', 'EquivalentAddins', 'VersionOverrides'],
  Host: ['Runtimes', 'AllFormFactors', 'DesktopFormFactor', 'MobileFormFactor'],
  DesktopFormFactor: ['GetStarted', 'SupportsSharedFolders', 'FunctionFile', 'ExtensionPoint'],
  ExtensionPoint: ['Script', 'Page', 'Metadata', 'Namespace', 'OfficeTab', 'CustomTab', 'OfficeMenu'],
  GetStarted: ['Title', 'Description', 'LearnMoreUrl'],
  Group: ['Label', 'Icon', 'Control'],
  Control: ['Label', 'Supertip', 'Icon', 'Action'],
  Resources: ['bt:Images', 'bt:Urls', 'bt:ShortStrings', 'bt:LongStrings'],
};
// Required children of OfficeApp for a task pane add-in (the OfficeApp element reference).
const REQUIRED_TOP = ['Id', 'Version', 'ProviderName', 'DefaultLocale', 'DisplayName', 'Description', 'DefaultSettings', 'Permissions'];
// bt:Image sizes the platform accepts for commands (Image and Icon element references): 16, 32 and 80 required.
export const RIBBON_ICON_SIZES = [16, 20, 24, 32, 40, 48, 64, 80];
const REQUIRED_ICON_SIZES = [16, 32, 80];

interface El { nodeName: string; nodeType: number; childNodes: ArrayLike<El>; getAttribute(n: string): string | null; textContent: string | null; parentNode: El | null }

function children(el: El): El[] {
  return Array.from(el.childNodes).filter((n) => n.nodeType === 1);
}
function all(el: El): El[] {
  const out: El[] = [];
  const walk = (e: El): void => { for (const c of children(e)) { out.push(c); walk(c); } };
  walk(el);
  return out;
}
function localName(el: El): string {
  return el.nodeName.startsWith('bt:') ? el.nodeName : el.nodeName.replace(/^\w+:/, '');
}

/** Width and height of a PNG from its IHDR chunk, or null when it is not a PNG. */
export function pngSize(bytes: Uint8Array): { width: number; height: number } | null {
  const signature = [137, 80, 78, 71, 13, 10, 26, 10];
  if (bytes.length < 24 || signature.some((b, i) => bytes[i] !== b)) return null;
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  return { width: view.getUint32(16), height: view.getUint32(20) };
}

export interface ManifestOptions {
  /** Reads a file the manifest points at, by its URL; null when it does not exist. Omit to skip the file checks. */
  readUrl?: (url: string) => Uint8Array | null;
}

/** Problems with an add-in-only XML manifest; empty when none. */
export function manifestProblems(text: string, options: ManifestOptions = {}): string[] {
  const problems: string[] = [];
  let root: El | null;
  try {
    const doc = new DOMParser({ onError: (level: string, msg: string) => { if (level !== 'warning') problems.push(`not well-formed: ${msg}`); } })
      .parseFromString(text, 'text/xml');
    root = doc.documentElement as unknown as El | null;
  } catch (error) {
    return [`not well-formed: ${(error as Error).message}`];
  }
  if (!root || root.nodeName !== 'OfficeApp') return [...problems, 'the root element is not OfficeApp'];
  if (root.getAttribute('xsi:type') !== 'TaskPaneApp') problems.push('OfficeApp is not xsi:type="TaskPaneApp"');
  const elements = [root, ...all(root)];

  // element order and required children
  for (const el of elements) {
    const order = ORDER[localName(el)];
    if (!order) continue;
    let last = -1, lastName = '';
    for (const child of children(el)) {
      const at = order.indexOf(localName(child));
      if (at < 0) continue;
      if (at < last) problems.push(`<${child.nodeName}> comes after <${lastName}> in <${el.nodeName}>; the schema puts it before`);
      if (at >= last) { last = at; lastName = child.nodeName; }
    }
  }
  const top = children(root).map(localName);
  for (const name of REQUIRED_TOP) if (!top.includes(name)) problems.push(`OfficeApp has no <${name}>`);

  // ids
  const id = children(root).find((c) => c.nodeName === 'Id')?.textContent?.trim() ?? '';
  if (!/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(id)) problems.push(`<Id> "${id}" is not a GUID`);
  const version = children(root).find((c) => c.nodeName === 'Version')?.textContent?.trim() ?? '';
  if (!/^[0-9]{1,5}(\.[0-9]{1,5}){0,3}$/.test(version)) problems.push(`<Version> "${version}" is not n.n.n.n`);
  const resources = new Map<string, El>();
  for (const el of elements) {
    if (!/^bt:(Image|Url|String)$/.test(el.nodeName)) continue;
    const rid = el.getAttribute('id');
    if (!rid) continue;
    if (resources.has(rid)) problems.push(`resource id "${rid}" is defined twice`);
    resources.set(rid, el);
    if (rid.length > 32) problems.push(`resource id "${rid}" is longer than 32 characters`);
  }
  const controlIds = new Set<string>();
  for (const el of elements) {
    const resid = el.getAttribute('resid');
    if (resid && !resources.has(resid)) problems.push(`resid "${resid}" is not defined in Resources`);
    if (resid && resid.length > 32) problems.push(`resid "${resid}" is longer than 32 characters`);
    if (/^(Group|Control|OfficeTab|CustomTab)$/.test(localName(el)) && el.getAttribute('id')) {
      const cid = el.getAttribute('id')!;
      if (controlIds.has(cid)) problems.push(`id "${cid}" is used twice`);
      controlIds.add(cid);
    }
  }
  // strings: ShortStrings ≤ 125, LongStrings ≤ 250 characters (ShortString/LongString in the XSD)
  for (const el of elements) {
    const parent = el.parentNode ? el.parentNode.nodeName : '';
    const value = el.getAttribute('DefaultValue') ?? '';
    if (el.nodeName === 'bt:String' && parent === 'bt:ShortStrings' && value.length > 125) problems.push(`short string "${el.getAttribute('id')}" is over 125 characters`);
    if (el.nodeName === 'bt:String' && parent === 'bt:LongStrings' && value.length > 250) problems.push(`long string "${el.getAttribute('id')}" is over 250 characters`);
  }
  for (const name of ['DisplayName', 'Description']) {
    const value = children(root).find((c) => c.nodeName === name)?.getAttribute('DefaultValue') ?? '';
    if (value.length < 1 || value.length > (name === 'DisplayName' ? 125 : 250)) problems.push(`<${name}> has ${value.length} characters`);
  }

  // URLs: every DefaultValue that is a location must be an absolute https URL, within an AppDomain or the SourceLocation origin
  const urlElements = elements.filter((el) => /^(IconUrl|HighResolutionIconUrl|SupportUrl|SourceLocation)$/.test(localName(el)) || /^bt:(Image|Url)$/.test(el.nodeName));
  const source = elements.find((el) => localName(el) === 'SourceLocation' && el.getAttribute('DefaultValue'))?.getAttribute('DefaultValue') ?? '';
  const origins = new Set<string>(elements.filter((el) => el.nodeName === 'AppDomain').map((el) => (el.textContent ?? '').trim()));
  try { origins.add(new URL(source).origin); } catch { problems.push('no SourceLocation with a URL'); }
  for (const el of urlElements) {
    const value = el.getAttribute('DefaultValue');
    if (value === null) continue;
    let url: URL;
    try { url = new URL(value); } catch { problems.push(`<${el.nodeName}> "${value}" is not an absolute URL`); continue; }
    if (url.protocol !== 'https:') problems.push(`<${el.nodeName}> "${value}" is not https`);
    if (!origins.has(url.origin)) problems.push(`<${el.nodeName}> "${value}" is outside the add-in's origins`);
    if (value.length > 2048) problems.push(`<${el.nodeName}> URL is over 2048 characters`);
  }

  // icons: ribbon sizes from the platform's list, 16/32/80 present, each image the size it claims
  const imageSize = new Map<string, number>();
  for (const icon of elements.filter((el) => localName(el) === 'Icon')) {
    const sizes = children(icon).map((img) => Number(img.getAttribute('size')));
    for (const s of sizes) if (!RIBBON_ICON_SIZES.includes(s)) problems.push(`icon size ${s} is not one the platform lists (${RIBBON_ICON_SIZES.join(', ')})`);
    for (const s of REQUIRED_ICON_SIZES) if (!sizes.includes(s)) problems.push(`an <Icon> has no ${s}-pixel image`);
    for (const img of children(icon)) imageSize.set(img.getAttribute('resid') ?? '', Number(img.getAttribute('size')));
  }
  if (options.readUrl) {
    const expect = (url: string, size: number | null, what: string): void => {
      const bytes = options.readUrl!(url);
      if (!bytes) { problems.push(`${what} ${url} does not exist`); return; }
      if (size === null) return;
      const dims = pngSize(bytes);
      if (!dims) problems.push(`${what} ${url} is not a PNG`);
      else if (dims.width !== size || dims.height !== size) problems.push(`${what} ${url} is ${dims.width}×${dims.height}, not ${size}×${size}`);
    };
    for (const [rid, size] of imageSize) { const el = resources.get(rid); if (el) expect(el.getAttribute('DefaultValue') ?? '', size, `image ${rid}`); }
    const icon = children(root).find((c) => c.nodeName === 'IconUrl')?.getAttribute('DefaultValue');
    const high = children(root).find((c) => c.nodeName === 'HighResolutionIconUrl')?.getAttribute('DefaultValue');
    // IconUrl 32×32 and HighResolutionIconUrl 64×64 for task pane add-ins (IconUrl/HighResolutionIconUrl element references)
    if (icon) expect(icon, 32, 'IconUrl');
    if (high) expect(high, 64, 'HighResolutionIconUrl');
    for (const el of urlElements) {
      if (el.nodeName === 'bt:Image' || /IconUrl$/.test(el.nodeName)) continue;
      const value = el.getAttribute('DefaultValue');
      if (value) expect(value.split('#')[0], null, `<${el.nodeName}>`);
    }
  }
  return problems;
}

// A stand-in Office host for the pane's browser tests: Office.onReady, document settings, an Office theme,
// CustomFunctions.associate and an Excel.run over a grid of cells that records what is written.
// Options (set before this script): __initialSettings, __initialSheet ("row,col" → value), __officeTheme,
// __holdReady (onReady waits for window.__releaseReady(), and the document is absent until then).
(function () {
  const initial = window.__initialSettings || {};
  window.__fns = {};
  window.__writes = [];
  window.__sheet = Object.assign({}, window.__initialSheet || {});
  const store = Object.assign({}, initial);
  const documentObject = { settings: {
    get(name) { return name in store ? store[name] : null; },
    set(name, value) { store[name] = value; },
    saveAsync(cb) { window.__savedSettings = Object.assign({}, store); if (cb) cb({ status: 'succeeded' }); },
  } };
  let ready;
  const readyPromise = new Promise((resolve) => { ready = resolve; });
  const context = { document: window.__holdReady ? undefined : documentObject };
  if (window.__officeTheme) context.officeTheme = window.__officeTheme;
  window.__releaseReady = () => { context.document = documentObject; ready({ host: 'Excel' }); };
  if (!window.__holdReady) setTimeout(window.__releaseReady, 0);
  window.Office = {
    onReady(callback) { return readyPromise.then((info) => { if (callback) callback(info); return info; }); },
    context,
  };
  class CustomFunctionsError extends Error { constructor(code, message) { super(message); this.code = code; } }
  window.CustomFunctions = { associate(id, fn) { window.__fns[id] = fn; }, Error: CustomFunctionsError, ErrorCode: { invalidValue: '#VALUE!', notAvailable: '#N/A' } };
  function rangeAt(r, c, h, w) {
    const range = {
      load() {},
      clear() { for (let i = 0; i < h; i++) for (let j = 0; j < w; j++) delete window.__sheet[(r + i) + ',' + (c + j)]; },
      format: { autofitColumns() {} },
    };
    Object.defineProperty(range, 'formulas', {
      get() {
        const rows = [];
        for (let i = 0; i < h; i++) { const row = []; for (let j = 0; j < w; j++) { const v = window.__sheet[(r + i) + ',' + (c + j)]; row.push(v === undefined ? '' : v); } rows.push(row); }
        return rows;
      },
      set(v) {
        window.__writes.push({ at: [r, c, h, w], formulas: v });
        v.forEach((row, i) => row.forEach((x, j) => {
          const key = (r + i) + ',' + (c + j);
          if (x === null) return;
          if (x === '') delete window.__sheet[key]; else window.__sheet[key] = x;
        }));
      },
    });
    return range;
  }
  const excelContext = {
    workbook: {
      getSelectedRange() { return { rowIndex: 1, columnIndex: 1, load() {}, worksheet: { getRangeByIndexes: rangeAt } }; },
      application: { calculate(type) { window.__recalculated = (window.__recalculated || 0) + 1; window.__lastCalculation = type; } },
    },
    sync: async () => {},
  };
  window.Excel = { run: async (callback) => callback(excelContext) };
})();

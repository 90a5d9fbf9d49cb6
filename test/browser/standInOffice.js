// A stand-in Office host for the pane's browser test: Office.onReady, document settings,
// CustomFunctions.associate and an Excel.run that records what is written.
(function () {
  const initial = window.__initialSettings || {};
  window.__fns = {};
  window.__writes = [];
  const store = Object.assign({}, initial);
  window.Office = {
    onReady(callback) { setTimeout(() => callback({ host: 'Excel' }), 0); return Promise.resolve({ host: 'Excel' }); },
    context: { document: { settings: {
      get(name) { return name in store ? store[name] : null; },
      set(name, value) { store[name] = value; },
      saveAsync(cb) { window.__savedSettings = Object.assign({}, store); if (cb) cb({ status: 'succeeded' }); },
    } } },
  };
  class CustomFunctionsError extends Error { constructor(code, message) { super(message); this.code = code; } }
  window.CustomFunctions = { associate(id, fn) { window.__fns[id] = fn; }, Error: CustomFunctionsError, ErrorCode: { invalidValue: '#VALUE!', notAvailable: '#N/A' } };
  const range = { format: { autofitColumns() {} } };
  Object.defineProperty(range, 'formulas', { set(v) { window.__writes[window.__writes.length - 1].formulas = v; }, get() { return []; } });
  const context = {
    workbook: { getSelectedRange() { return { rowIndex: 1, columnIndex: 1, load() {}, worksheet: { getRangeByIndexes(r, c, h, w) { window.__writes.push({ at: [r, c, h, w] }); return range; } } }; } },
    sync: async () => {},
  };
  window.Excel = { run: async (callback) => callback(context) };
})();

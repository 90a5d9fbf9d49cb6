// CommonJS stand-in for office-addin-manifest, of which office-addin-mock uses only the
// OfficeApp host names; the real package pulls in ESM-only modules jest cannot load here.
const OfficeApp = { Excel: 'excel', OneNote: 'onenote', Outlook: 'outlook', PowerPoint: 'powerpoint', Project: 'project', Word: 'word' };
module.exports = { OfficeApp };
